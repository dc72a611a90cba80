import { signUpSchema } from '../../../../shared/schemas/auth.ts';
import { SubmitForm } from '../../../components/ui/form-controls.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useServerForm } from '../../../lib/use-server-form.ts';
import { useSignUp } from '../api/sign-up.ts';
import { EmailField, NewPasswordField } from './account-fields.tsx';

export function SignUpForm({ onSignedUp }: { onSignedUp: (name: string) => void }) {
  const signUp = useSignUp();
  const { register, formProps, formState } = useServerForm({
    schema: signUpSchema,
    defaultValues: { name: '', email: '', password: '' },
    fields: ['name', 'email', 'password'],
    submit: async (values) => {
      await signUp.mutateAsync(values);
      onSignedUp(values.name);
    },
  });

  return (
    <SubmitForm {...formProps} pendingLabel="Creating your account…" submitLabel="Create account">
      <TextField label="Your name" autoComplete="name" error={formState.errors.name?.message} {...register('name')} />
      <EmailField error={formState.errors.email?.message} {...register('email')} />
      <NewPasswordField label="Password" error={formState.errors.password?.message} {...register('password')} />
    </SubmitForm>
  );
}
