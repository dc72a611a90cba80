import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SignUpInput } from '../../../../shared/schemas/auth.ts';
import { api } from '../../../lib/api-client.ts';
import { authKeys } from './keys.ts';

export function signUp(input: SignUpInput): Promise<unknown> {
  return api.post('/api/auth/sign-up/email', input);
}

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: authKeys.all }),
  });
}
