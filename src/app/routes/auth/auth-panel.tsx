import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';

/** The narrow paper panel every sign-in style page sits in. */
export function AuthPanel({ title, lead, children, footer }: { title: string; lead?: ReactNode; children: ReactNode; footer?: ReactNode }) {
  return (
    <div className="mx-auto w-full max-w-xl">
      <div className="rounded-lg border border-line bg-white p-6 shadow-sm sm:p-10">
        <h1 className="text-3xl font-black tracking-tight">{title}</h1>
        {lead ? <div className="mt-2 text-ink-soft">{lead}</div> : null}
        <div className="mt-8">{children}</div>
      </div>
      {footer ? <div className="mt-6 flex flex-col gap-2 px-2 text-ink-soft sm:flex-row sm:flex-wrap sm:gap-x-6">{footer}</div> : null}
    </div>
  );
}

export const textLinkClasses = 'font-bold text-thread-deep underline decoration-2 underline-offset-4 hover:text-ink';

/** The footer link of the password pages. */
export function BackToSignIn() {
  return (
    <Link className={textLinkClasses} to={paths.auth.signIn.getHref()}>
      Back to sign in
    </Link>
  );
}
