import type { ButtonHTMLAttributes, ReactNode, Ref } from 'react';
import { Link, type LinkProps } from 'react-router-dom';

export type ButtonVariant = 'primary' | 'secondary' | 'quiet';

const base = 'inline-flex min-h-11 items-center justify-center gap-2 rounded-lg px-5 py-2.5 text-base font-bold leading-tight transition-colors ' + 'disabled:cursor-not-allowed disabled:opacity-60';

// Primary is marigold with ink-navy text (6.5 : 1); white on marigold would fail WCAG AA.
const variants: Record<ButtonVariant, string> = {
  primary: 'bg-marigold text-ink shadow-[0_2px_0_0_var(--color-marigold-deep)] hover:bg-marigold-light active:translate-y-px',
  secondary: 'border-2 border-thread bg-paper text-thread-deep hover:bg-thread-wash',
  quiet: 'text-ink underline decoration-thread decoration-2 underline-offset-4 hover:bg-thread-wash',
};

export function buttonClasses(variant: ButtonVariant = 'primary', extra = ''): string {
  return `${base} ${variants[variant]} ${extra}`.trim();
}

type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & {
  variant?: ButtonVariant;
  pending?: boolean;
  pendingLabel?: string;
  ref?: Ref<HTMLButtonElement>;
};

export function Button({ variant = 'primary', pending = false, pendingLabel, disabled, className = '', children, type = 'button', ...rest }: ButtonProps) {
  return (
    <button type={type} className={buttonClasses(variant, className)} disabled={disabled || pending} aria-busy={pending || undefined} {...rest}>
      {pending ? <Spinner /> : null}
      {pending && pendingLabel ? pendingLabel : children}
    </button>
  );
}

export function ButtonLink({ variant = 'primary', className = '', children, ...rest }: LinkProps & { variant?: ButtonVariant; children: ReactNode }) {
  return (
    <Link className={buttonClasses(variant, className)} {...rest}>
      {children}
    </Link>
  );
}

export function Spinner({ label }: { label?: string }) {
  return (
    <span className="inline-flex items-center gap-2">
      <span aria-hidden="true" className="size-4 animate-spin rounded-full border-2 border-current border-t-transparent" />
      {label ? <span>{label}</span> : null}
    </span>
  );
}
