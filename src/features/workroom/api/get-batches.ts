import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

export type BatchSummary = { batchId: string; createdAt: number; sheets: number; planned: number; lineCount: number };
export const getBatches = async (signal?: AbortSignal) => (await api.get<{ batches: BatchSummary[] }>('/api/workroom/batches', { signal })).batches;
export const getBatchesQueryOptions = () => queryOptions({ queryKey: workroomKeys.batches(), queryFn: ({ signal }) => getBatches(signal) });
export const useBatches = () => useQuery(getBatchesQueryOptions());
