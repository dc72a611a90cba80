import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { resetPasswordSchema, type ResetPasswordInput } from '../../../../shared/schemas/auth.ts';
import { Button } from '../../../components/ui/button.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { applyServerErrors } from '../../../lib/form-errors.ts';
import { useResetPassword } from '../api/reset-password.ts';

export function ResetPasswordForm({ token, onDone }: { token: string; onDone: () => void }) {
  const toast = useToast();
  const reset = useResetPassword();
  const { register, handleSubmit, setError, formState } = useForm<ResetPasswordInput>({
    resolver: zodResolver(resetPasswordSchema),
    defaultValues: { token, newPassword: '' },
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      await reset.mutateAsync(values);
      onDone();
    } catch (error) {
      // The server may call the field "password" or "newPassword"; both belong to the one input.
      const fields = (error as { fields?: Record<string, string> }).fields;
      if (fields?.password && !fields.newPassword) fields.newPassword = fields.password;
      const message = applyServerErrors(error, setError, ['newPassword']);
      if (message) toast.error(message);
    }
  });

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
      <input type="hidden" {...register('token')} />
      {formState.errors.token?.message ? (
        <p role="alert" className="font-semibold text-danger">
          {formState.errors.token.message}
        </p>
      ) : null}
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint="At least 8 characters."
        error={formState.errors.newPassword?.message}
        {...register('newPassword')}
      />
      <Button type="submit" pending={formState.isSubmitting || reset.isPending} pendingLabel="Saving…" className="w-full sm:w-auto sm:self-start">
        Save new password
      </Button>
    </form>
  );
}
