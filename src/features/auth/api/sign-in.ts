import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SignInInput } from '../../../../shared/schemas/auth.ts';
import { api } from '../../../lib/api-client.ts';
import { authKeys } from './keys.ts';

export function signIn(input: SignInInput): Promise<unknown> {
  return api.post('/api/auth/sign-in/email', input);
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    // Waits for /api/me to answer so the page after sign-in already knows the role.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: authKeys.all }),
  });
}
