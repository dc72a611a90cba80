import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { ButtonLink } from '../../../components/ui/button.tsx';
import { paths } from '../../../config/paths.ts';
import { ResetPasswordForm } from '../../../features/auth/components/reset-password-form.tsx';
import { AuthPanel, BackToSignIn } from './auth-panel.tsx';

export function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  // The auth server redirects here with ?error=INVALID_TOKEN when a link is stale or reused.
  const linkError = params.get('error');
  const [done, setDone] = useState(false);

  if (done) {
    return (
      <AuthPanel title="Your new password is saved" lead="Sign in with it from now on.">
        <ButtonLink to={paths.auth.signIn.getHref()}>Sign in</ButtonLink>
      </AuthPanel>
    );
  }

  if (!token || linkError) {
    return (
      <AuthPanel title="This reset link doesn't work" lead="It may have expired, been used already, or been cut short when it was copied.">
        <ButtonLink to={paths.auth.forgotPassword.getHref()}>Ask for a new link</ButtonLink>
      </AuthPanel>
    );
  }

  return (
    <AuthPanel title="Choose a new password" lead="Pick something you don't use anywhere else." footer={<BackToSignIn />}>
      <ResetPasswordForm token={token} onDone={() => setDone(true)} />
    </AuthPanel>
  );
}
