import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { requestResetSchema, type RequestResetInput } from '../../../../shared/schemas/auth.ts';
import { Button } from '../../../components/ui/button.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { applyServerErrors } from '../../../lib/form-errors.ts';
import { useRequestPasswordReset } from '../api/request-password-reset.ts';

export function ForgotPasswordForm() {
  const toast = useToast();
  const request = useRequestPasswordReset();
  const { register, handleSubmit, setError, formState, getValues } = useForm<RequestResetInput>({
    resolver: zodResolver(requestResetSchema),
    defaultValues: { email: '' },
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      await request.mutateAsync(values);
    } catch (error) {
      const message = applyServerErrors(error, setError, ['email']);
      if (message) toast.error(message);
    }
  });

  if (request.isSuccess) {
    // Same words whether or not the account exists: nobody can use this page to probe for accounts.
    return (
      <div role="status" className="rounded-lg border-2 border-thread bg-thread-wash p-5">
        <h2 className="text-lg font-extrabold">Check your inbox</h2>
        <p className="mt-1">
          If an account uses <strong>{getValues('email')}</strong>, a link to choose a new password is on its way. It works for a
          limited time; if it doesn't arrive in a few minutes, check your spam folder or ask again.
        </p>
      </div>
    );
  }

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
      <TextField label="E-mail" type="email" autoComplete="email" inputMode="email" error={formState.errors.email?.message} {...register('email')} />
      <Button type="submit" pending={formState.isSubmitting || request.isPending} pendingLabel="Sending…" className="w-full sm:w-auto sm:self-start">
        Send reset link
      </Button>
    </form>
  );
}
