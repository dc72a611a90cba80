import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { signUpSchema, type SignUpInput } from '../../../../shared/schemas/auth.ts';
import { Button } from '../../../components/ui/button.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { applyServerErrors } from '../../../lib/form-errors.ts';
import { useSignUp } from '../api/sign-up.ts';

export function SignUpForm({ onSignedUp }: { onSignedUp: (name: string) => void }) {
  const toast = useToast();
  const signUp = useSignUp();
  const { register, handleSubmit, setError, formState } = useForm<SignUpInput>({
    resolver: zodResolver(signUpSchema),
    defaultValues: { name: '', email: '', password: '' },
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      await signUp.mutateAsync(values);
      onSignedUp(values.name);
    } catch (error) {
      const message = applyServerErrors(error, setError, ['name', 'email', 'password']);
      if (message) toast.error(message);
    }
  });

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
      <TextField label="Your name" autoComplete="name" error={formState.errors.name?.message} {...register('name')} />
      <TextField label="E-mail" type="email" autoComplete="email" inputMode="email" error={formState.errors.email?.message} {...register('email')} />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint="At least 8 characters. A short sentence is easy to remember and hard to guess."
        error={formState.errors.password?.message}
        {...register('password')}
      />
      <Button type="submit" pending={formState.isSubmitting || signUp.isPending} pendingLabel="Creating your account…" className="w-full sm:w-auto sm:self-start">
        Create account
      </Button>
    </form>
  );
}
