import { useMutation } from '@tanstack/react-query';
import type { ResetPasswordInput } from '../../../../shared/schemas/auth.ts';
import { api } from '../../../lib/api-client.ts';

export function resetPassword(input: ResetPasswordInput): Promise<unknown> {
  return api.post('/api/auth/reset-password', { newPassword: input.newPassword, token: input.token });
}

export function useResetPassword() {
  return useMutation({ mutationFn: resetPassword });
}
