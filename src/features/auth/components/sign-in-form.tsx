import { signInSchema } from '../../../../shared/schemas/auth.ts';
import { SubmitForm } from '../../../components/ui/form-controls.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useServerForm } from '../../../lib/use-server-form.ts';
import { useSignIn } from '../api/sign-in.ts';
import { EmailField } from './account-fields.tsx';

export type DemoAccount = { email: string; role: string; label: string };

type Props = {
  onSignedIn: () => void;
  demoPassword?: string;
  demoAccounts?: DemoAccount[];
};

export function SignInForm({ onSignedIn, demoPassword, demoAccounts }: Props) {
  const signIn = useSignIn();
  const { register, formProps, setValue, formState } = useServerForm({
    schema: signInSchema,
    defaultValues: { email: '', password: '' },
    fields: ['email', 'password'],
    submit: async (values) => {
      await signIn.mutateAsync(values);
      onSignedIn();
    },
  });

  return (
    <div className="flex flex-col gap-8">
      <SubmitForm {...formProps} pendingLabel="Signing in…" submitLabel="Sign in">
        <EmailField error={formState.errors.email?.message} {...register('email')} />
        <TextField label="Password" type="password" autoComplete="current-password" error={formState.errors.password?.message} {...register('password')} />
      </SubmitForm>

      {demoPassword && demoAccounts && demoAccounts.length > 0 ? (
        <section aria-labelledby="demo-accounts-title" className="rounded-lg border-2 border-dashed border-marigold bg-marigold-wash/60 p-5">
          <h2 id="demo-accounts-title" className="text-lg font-extrabold">
            Demo accounts
          </h2>
          <p className="mt-1 text-ink-soft">
            This is a demo. Every account below uses the password <code className="rounded bg-white px-1.5 py-0.5 font-mono font-bold text-ink">{demoPassword}</code>. Pick one to fill in the form.
          </p>
          <ul className="mt-4 grid gap-2 sm:grid-cols-2">
            {demoAccounts.map((account) => (
              <li key={account.email}>
                <button
                  type="button"
                  onClick={() => {
                    setValue('email', account.email, { shouldValidate: formState.isSubmitted });
                    setValue('password', demoPassword, { shouldValidate: formState.isSubmitted });
                  }}
                  className="flex min-h-11 w-full flex-col items-start rounded-lg border border-line bg-white px-3.5 py-2 text-left hover:border-thread"
                >
                  <span className="font-bold">Use {account.label}</span>
                  <span className="text-sm text-ink-soft">
                    {account.role} · {account.email}
                  </span>
                </button>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
