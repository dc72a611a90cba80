import { resetPasswordSchema } from '../../../../shared/schemas/auth.ts';
import { SubmitForm } from '../../../components/ui/form-controls.tsx';
import { useServerForm } from '../../../lib/use-server-form.ts';
import { useResetPassword } from '../api/reset-password.ts';
import { NewPasswordField } from './account-fields.tsx';

export function ResetPasswordForm({ token, onDone }: { token: string; onDone: () => void }) {
  const reset = useResetPassword();
  const { register, formProps, formState } = useServerForm({
    schema: resetPasswordSchema,
    defaultValues: { token, newPassword: '' },
    fields: ['newPassword'],
    submit: async (values) => {
      try {
        await reset.mutateAsync(values);
      } catch (error) {
        // The server may call the field "password" or "newPassword"; both belong to the one input.
        const fields = (error as { fields?: Record<string, string> }).fields;
        if (fields?.password && !fields.newPassword) fields.newPassword = fields.password;
        throw error;
      }
      onDone();
    },
  });

  return (
    <SubmitForm {...formProps} pendingLabel="Saving…" submitLabel="Save new password">
      <input type="hidden" {...register('token')} />
      {formState.errors.token?.message ? (
        <p role="alert" className="font-semibold text-danger">
          {formState.errors.token.message}
        </p>
      ) : null}
      <NewPasswordField label="New password" error={formState.errors.newPassword?.message} {...register('newPassword')} />
    </SubmitForm>
  );
}
