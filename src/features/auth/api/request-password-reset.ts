import { useMutation } from '@tanstack/react-query';
import type { RequestResetInput } from '../../../../shared/schemas/auth.ts';
import { paths } from '../../../config/paths.ts';
import { api } from '../../../lib/api-client.ts';

/** The server answers 200 whether or not the account exists, so nobody can probe for accounts. */
export function requestPasswordReset(input: RequestResetInput): Promise<unknown> {
  return api.post('/api/auth/request-password-reset', { email: input.email, redirectTo: paths.auth.resetPassword.path });
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
