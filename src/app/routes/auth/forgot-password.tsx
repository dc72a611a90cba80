import { ForgotPasswordForm } from '../../../features/auth/components/forgot-password-form.tsx';
import { AuthPanel, BackToSignIn } from './auth-panel.tsx';

export function ForgotPasswordPage() {
  return (
    <AuthPanel title="Forgot your password?" lead="Tell us the e-mail address you signed up with and we'll send a link to choose a new one." footer={<BackToSignIn />}>
      <ForgotPasswordForm />
    </AuthPanel>
  );
}
