import { useRef } from 'react';
import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { useToast } from '../../../components/ui/toast.tsx';
import { paths, safeNextPath } from '../../../config/paths.ts';
import { useMe } from '../../../features/auth/api/get-me.ts';
import { SignUpForm } from '../../../features/auth/components/sign-up-form.tsx';
import { AuthPanel, textLinkClasses } from './auth-panel.tsx';

export function SignUpPage() {
  const [params] = useSearchParams();
  const rawNext = params.get('next');
  const next = safeNextPath(rawNext);
  const navigate = useNavigate();
  const toast = useToast();
  const me = useMe();
  const justSignedUp = useRef(false);

  if (me.data && !justSignedUp.current) return <Navigate to={next} replace />;

  return (
    <AuthPanel
      title="Create your account"
      lead="One account to order personalised goods from every shop on Namesake. You can open a shop of your own later."
      footer={
        <span>
          Already have an account?{' '}
          <Link className={textLinkClasses} to={paths.auth.signIn.getHref(rawNext ? next : undefined)}>
            Sign in
          </Link>
        </span>
      }
    >
      <SignUpForm
        onSignedUp={(name) => {
          justSignedUp.current = true;
          toast.success(`Welcome to Namesake, ${name}.`);
          navigate(next, { replace: true });
        }}
      />
    </AuthPanel>
  );
}
