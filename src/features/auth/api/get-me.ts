import { queryOptions, useQuery } from '@tanstack/react-query';
import { type Me, meSchema } from '../../../../shared/schemas/auth.ts';
import { api, isApiError } from '../../../lib/api-client.ts';
import { authKeys } from './keys.ts';

/** The signed-in account and its shop, or null for a guest (the server answers 200 with `user: null`). */
export async function getMe(signal?: AbortSignal): Promise<Me | null> {
  try {
    const data = await api.get<unknown>('/api/me', { signal, redirectOn401: false });
    if (data && typeof data === 'object' && (data as { user?: unknown }).user === null) return null;
    return meSchema.parse(data);
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export const getMeQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 60_000,
  });

export function useMe() {
  return useQuery(getMeQueryOptions());
}
