import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WorkLine } from '../../../../shared/schemas/workroom.ts';
import type { LineState } from '../../../../shared/schemas/order.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

export const getLines = async (state?: LineState, signal?: AbortSignal) =>
  (await api.get<{ lines: WorkLine[] }>(`/api/workroom/lines${state ? `?state=${encodeURIComponent(state)}` : ''}`, { signal })).lines;
export const getLinesQueryOptions = (state?: LineState) => queryOptions({ queryKey: workroomKeys.lines(state), queryFn: ({ signal }) => getLines(state, signal) });
export const useLines = (state?: LineState) => useQuery(getLinesQueryOptions(state));
