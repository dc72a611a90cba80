import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MotifView } from '../../../../shared/schemas/upload.ts';
import { api } from '../../../lib/api-client.ts';
import { uploadKeys } from './keys.ts';

export async function getMotifs(signal?: AbortSignal): Promise<MotifView[]> {
  return (await api.get<{ motifs: MotifView[] }>('/api/motifs', { signal })).motifs;
}

export const getMotifsQueryOptions = () => queryOptions({ queryKey: uploadKeys.motifs(), queryFn: ({ signal }) => getMotifs(signal) });

export function useMotifs() {
  return useQuery(getMotifsQueryOptions());
}
