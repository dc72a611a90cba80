import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WorksheetJob } from '../../../../shared/schemas/workroom.ts';
import { api } from '../../../lib/api-client.ts';
import { workroomKeys } from './keys.ts';

export const getWorksheetJob = async (jobId: string, signal?: AbortSignal) => (await api.get<{ job: WorksheetJob }>(`/api/workroom/worksheets/${encodeURIComponent(jobId)}`, { signal })).job;
export const getWorksheetJobQueryOptions = (jobId: string) =>
  queryOptions({
    queryKey: workroomKeys.worksheet(jobId),
    queryFn: ({ signal }) => getWorksheetJob(jobId, signal),
    // poll while it builds
    refetchInterval: (q) => (q.state.data?.state === 'running' || !q.state.data ? 300 : false),
  });
export const useWorksheetJob = (jobId: string | null) => useQuery({ ...getWorksheetJobQueryOptions(jobId ?? ''), enabled: !!jobId });
