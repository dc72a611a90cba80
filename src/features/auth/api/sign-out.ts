import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { authKeys } from './keys.ts';

export function signOut(): Promise<unknown> {
  return api.post('/api/auth/sign-out', {});
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      queryClient.setQueryData(authKeys.me(), null);
      // Nothing fetched for the old account may linger (orders, workroom data…).
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
    },
  });
}
