import { requestResetSchema } from '../../../../shared/schemas/auth.ts';
import { SubmitForm } from '../../../components/ui/form-controls.tsx';
import { useServerForm } from '../../../lib/use-server-form.ts';
import { useRequestPasswordReset } from '../api/request-password-reset.ts';
import { EmailField } from './account-fields.tsx';

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const { register, formProps, formState, getValues } = useServerForm({
    schema: requestResetSchema,
    defaultValues: { email: '' },
    fields: ['email'],
    submit: async (values) => {
      await request.mutateAsync(values);
    },
  });

  if (request.isSuccess) {
    // Same words whether or not the account exists: nobody can use this page to probe for accounts.
    return (
      <div role="status" className="rounded-lg border-2 border-thread bg-thread-wash p-5">
        <h2 className="text-lg font-extrabold">Check your inbox</h2>
        <p className="mt-1">
          If an account uses <strong>{getValues('email')}</strong>, a link to choose a new password is on its way. It works for a limited time; if it doesn't arrive in a few minutes, check your spam
          folder or ask again.
        </p>
      </div>
    );
  }

  return (
    <SubmitForm {...formProps} pendingLabel="Sending…" submitLabel="Send reset link">
      <EmailField error={formState.errors.email?.message} {...register('email')} />
    </SubmitForm>
  );
}
