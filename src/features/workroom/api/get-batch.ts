import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WorkSheet } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

export const getBatch = async (id: string, signal?: AbortSignal) => (await api.get<{ batchId: string; sheets: WorkSheet[] }>(`/api/workroom/batches/${encodeURIComponent(id)}`, { signal })).sheets;
export const getBatchQueryOptions = (id: string) => queryOptions({ queryKey: workroomKeys.batch(id), queryFn: ({ signal }) => getBatch(id, signal) });
export const useBatch = (id: string | null) => useQuery({ ...getBatchQueryOptions(id ?? ''), enabled: !!id });
