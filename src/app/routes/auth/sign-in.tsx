import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { paths, safeNextPath } from '../../../config/paths.ts';
import { useMe } from '../../../features/auth/api/get-me.ts';
import { SignInForm } from '../../../features/auth/components/sign-in-form.tsx';
import { useSiteConfig } from '../../../features/site-config/api/get-site-config.ts';
import { AuthPanel, textLinkClasses } from './auth-panel.tsx';

export function SignInPage() {
  const [params] = useSearchParams();
  const rawNext = params.get('next');
  const next = safeNextPath(rawNext);
  const navigate = useNavigate();
  const me = useMe();
  const config = useSiteConfig();

  // Someone already signed in who lands here (an old bookmark) goes on to where they were headed.
  if (me.data) return <Navigate to={next} replace />;

  const demo = config.data?.demoMode ? config.data : undefined;

  return (
    <AuthPanel
      title="Welcome back"
      lead={rawNext ? 'Sign in to carry on where you were.' : 'Sign in to see your orders, your cart and, if you sell, your workroom.'}
      footer={
        <>
          <span>
            New here?{' '}
            <Link className={textLinkClasses} to={paths.auth.signUp.getHref(rawNext ? next : undefined)}>
              Create an account
            </Link>
          </span>
          <Link className={textLinkClasses} to={paths.auth.forgotPassword.getHref()}>
            Forgot your password?
          </Link>
        </>
      }
    >
      <SignInForm onSignedIn={() => navigate(next, { replace: true })} demoPassword={demo?.demoPassword} demoAccounts={demo?.demoAccounts} />
    </AuthPanel>
  );
}
