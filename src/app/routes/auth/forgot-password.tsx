import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { ForgotPasswordForm } from '../../../features/auth/components/forgot-password-form.tsx';
import { AuthPanel, textLinkClasses } from './auth-panel.tsx';

export function ForgotPasswordPage() {
  return (
    <AuthPanel
      title="Forgot your password?"
      lead="Tell us the e-mail address you signed up with and we'll send a link to choose a new one."
      footer={
        <Link className={textLinkClasses} to={paths.auth.signIn.getHref()}>
          Back to sign in
        </Link>
      }
    >
      <ForgotPasswordForm />
    </AuthPanel>
  );
}
