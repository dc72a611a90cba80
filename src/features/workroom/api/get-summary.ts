import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WorkroomSummary } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

export const getSummary = (signal?: AbortSignal) => api.get<WorkroomSummary>('/api/workroom/summary', { signal });
export const getSummaryQueryOptions = () => queryOptions({ queryKey: workroomKeys.summary(), queryFn: ({ signal }) => getSummary(signal) });
export const useSummary = () => useQuery(getSummaryQueryOptions());
