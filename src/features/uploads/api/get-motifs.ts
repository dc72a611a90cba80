import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { uploadKeys } from './keys.ts';
import type { MotifSummary } from './types.ts';

export async function getMotifs(signal?: AbortSignal): Promise<MotifSummary[]> {
  return (await api.get<{ motifs: MotifSummary[] }>('/api/motifs', { signal })).motifs;
}

export const getMotifsQueryOptions = () => queryOptions({ queryKey: uploadKeys.motifs(), queryFn: ({ signal }) => getMotifs(signal) });

export function useMotifs() {
  return useQuery(getMotifsQueryOptions());
}
