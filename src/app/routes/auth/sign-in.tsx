import { useQueryClient } from '@tanstack/react-query';
import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import type { Me } from '../../../../shared/schemas/auth.ts';
import { paths, safeNextPath } from '../../../config/paths.ts';
import { getMeQueryOptions, useMe } from '../../../features/auth/api/get-me.ts';
import { SignInForm } from '../../../features/auth/components/sign-in-form.tsx';
import { useSiteConfig } from '../../../features/site-config/api/get-site-config.ts';
import { AuthPanel, textLinkClasses } from './auth-panel.tsx';

/** Where a sign-in without a `next` lands: a seller at her workroom, an admin at the desk, a shopper at home. */
export function landingFor(me: Me | null | undefined): string {
  if (me?.user.role === 'admin') return paths.moderation.desk.getHref();
  if (me?.user.role === 'seller' || me?.shop) return paths.workroom.getHref();
  return paths.home.getHref();
}

export function SignInPage() {
  const [params] = useSearchParams();
  const rawNext = params.get('next');
  const next = safeNextPath(rawNext);
  const navigate = useNavigate();
  const me = useMe();
  const config = useSiteConfig();
  const queryClient = useQueryClient();
  const onSignedIn = async () => {
    if (rawNext) return navigate(next, { replace: true });
    const who = await queryClient.fetchQuery(getMeQueryOptions()).catch(() => null);
    navigate(landingFor(who), { replace: true });
  };

  // Someone already signed in who lands here (an old bookmark) goes on to where they were headed.
  if (me.data) return <Navigate to={rawNext ? next : landingFor(me.data)} replace />;

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
      <SignInForm onSignedIn={onSignedIn} demoPassword={demo?.demoPassword} demoAccounts={demo?.demoAccounts} />
    </AuthPanel>
  );
}
