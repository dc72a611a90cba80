import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MotifDetailView } from '../../../../shared/schemas/upload.ts';
import { api } from '../../../lib/api-client.ts';
import { uploadKeys } from './keys.ts';

export async function getMotif(id: string, signal?: AbortSignal): Promise<MotifDetailView> {
  return (await api.get<{ motif: MotifDetailView }>(`/api/motifs/${encodeURIComponent(id)}`, { signal })).motif;
}

export const getMotifQueryOptions = (id: string) => queryOptions({ queryKey: uploadKeys.motif(id), queryFn: ({ signal }) => getMotif(id, signal), staleTime: Infinity });

export function useMotif(id: string | null | undefined) {
  return useQuery({ ...getMotifQueryOptions(id ?? ''), enabled: Boolean(id) });
}
