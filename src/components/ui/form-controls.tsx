import { formatMoney, minorDigits, parseMajor } from '../../../shared/money.ts';
import { useId, useState, type InputHTMLAttributes, type ReactNode, type Ref, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';

/** Field pieces that match TextField: label, hint and error linked with aria-describedby. */

const controlClasses = (error?: string) =>
  'min-h-11 w-full rounded-lg border-2 bg-white px-3.5 py-2 text-base text-ink placeholder:text-ink-faint ' + (error ? 'border-danger' : 'border-field hover:border-ink');

export function FieldError({ id, message }: { id?: string; message?: string }) {
  if (!message) return null;
  return (
    <p id={id} className="flex items-start gap-1.5 text-sm font-semibold text-danger">
      <span aria-hidden="true">●</span>
      <span>{message}</span>
    </p>
  );
}

function useDescribed(hint?: ReactNode, error?: string) {
  const id = useId();
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ') || undefined;
  return { id, hintId, errorId, describedBy };
}

type TextAreaProps = Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> & { label: string; hint?: ReactNode; error?: string; ref?: Ref<HTMLTextAreaElement> };

export function TextAreaField({ label, hint, error, className = '', ref, rows = 4, ...rest }: TextAreaProps) {
  const d = useDescribed(hint, error);
  return (
    <div className={`flex flex-col gap-1.5 ${className}`}>
      <label htmlFor={d.id} className="font-bold text-ink">
        {label}
      </label>
      {hint ? (
        <p id={d.hintId} className="text-sm text-ink-soft">
          {hint}
        </p>
      ) : null}
      <textarea id={d.id} ref={ref} rows={rows} aria-invalid={error ? true : undefined} aria-describedby={d.describedBy} className={controlClasses(error)} {...rest} />
      <FieldError id={d.errorId} message={error} />
    </div>
  );
}

type SelectProps = Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> & { label: string; hint?: ReactNode; error?: string; ref?: Ref<HTMLSelectElement>; children: ReactNode };

export function SelectField({ label, hint, error, className = '', ref, children, ...rest }: SelectProps) {
  const d = useDescribed(hint, error);
  return (
    <div className={`flex flex-col gap-1.5 ${className}`}>
      <label htmlFor={d.id} className="font-bold text-ink">
        {label}
      </label>
      {hint ? (
        <p id={d.hintId} className="text-sm text-ink-soft">
          {hint}
        </p>
      ) : null}
      <select id={d.id} ref={ref} aria-invalid={error ? true : undefined} aria-describedby={d.describedBy} className={controlClasses(error)} {...rest}>
        {children}
      </select>
      <FieldError id={d.errorId} message={error} />
    </div>
  );
}

type CheckboxProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'id' | 'type'> & { label: ReactNode; hint?: ReactNode; ref?: Ref<HTMLInputElement> };

export function CheckboxField({ label, hint, className = '', ref, ...rest }: CheckboxProps) {
  const d = useDescribed(hint);
  return (
    <div className={`flex items-start gap-3 ${className}`}>
      <input id={d.id} ref={ref} type="checkbox" aria-describedby={hint ? d.hintId : undefined} className="mt-0.5 size-6 shrink-0 accent-thread" {...rest} />
      <div>
        <label htmlFor={d.id} className="font-bold text-ink">
          {label}
        </label>
        {hint ? (
          <p id={d.hintId} className="text-sm text-ink-soft">
            {hint}
          </p>
        ) : null}
      </div>
    </div>
  );
}

export type BadgeTone = 'neutral' | 'thread' | 'marigold' | 'danger' | 'ink' | 'done' | 'muted';
const badgeTones: Record<BadgeTone, string> = {
  neutral: 'border-line bg-paper-deep text-ink',
  thread: 'border-thread bg-thread-wash text-thread-deep',
  marigold: 'border-marigold bg-marigold-wash text-ink',
  danger: 'border-danger bg-danger-wash text-danger',
  ink: 'border-ink bg-ink text-paper',
  done: 'border-thread-deep bg-thread text-white',
  muted: 'border-line bg-white text-ink-soft',
};

export function Badge({ tone = 'neutral', children }: { tone?: BadgeTone; children: ReactNode }) {
  return <span className={`inline-flex items-center rounded-full border px-2.5 py-0.5 text-sm font-bold whitespace-nowrap ${badgeTones[tone]}`}>{children}</span>;
}

/** A labelled progress bar; `value` null shows an indeterminate bar. */
export function ProgressBar({ value, label }: { value: number | null; label: string }) {
  const pct = value === null ? null : Math.round(Math.min(1, Math.max(0, value)) * 100);
  return (
    <div className="flex flex-col gap-1">
      <div className="flex justify-between text-sm font-semibold text-ink-soft">
        <span>{label}</span>
        <span>{pct === null ? '…' : `${pct} %`}</span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={pct ?? undefined}
        className="h-2.5 w-full overflow-hidden rounded-full bg-paper-deep"
      >
        <div className={`h-full rounded-full bg-thread transition-[width] ${pct === null ? 'w-1/3 animate-pulse' : ''}`} style={pct === null ? undefined : { width: `${pct}%` }} />
      </div>
    </div>
  );
}

/** A titled group of fields. */
export function FormSection({ title, lead, children, className = '' }: { title: string; lead?: ReactNode; children: ReactNode; className?: string }) {
  return (
    <fieldset className={`flex min-w-0 flex-col gap-5 rounded-lg border border-line bg-white p-5 sm:p-6 ${className}`}>
      <legend className="px-1 text-lg font-extrabold text-ink">{title}</legend>
      {lead ? <div className="-mt-2 text-ink-soft">{lead}</div> : null}
      {children}
    </fieldset>
  );
}

type MoneyFieldProps = {
  label: string;
  hint?: ReactNode;
  error?: string;
  currency: string;
  /** integer minor units; NaN while the typed text is not an amount */
  value: number | undefined;
  onChange: (minor: number) => void;
  onBlur?: () => void;
  name?: string;
  className?: string;
};

/**
 * Money typed in major units ("12.50"), held as integer minor units. Text that is not an amount
 * gives NaN, which the form's zod schema reports next to the field.
 */
export function MoneyField({ label, hint, error, currency, value, onChange, onBlur, name, className = '' }: MoneyFieldProps) {
  const d = useDescribed(hint, error);
  const digits = minorDigits(currency);
  const [text, setText] = useState(() => (value === undefined || Number.isNaN(value) ? '' : (value / 10 ** digits).toFixed(digits)));
  const symbol = formatMoney(0, currency).replace(/[\d.,]/g, '');
  return (
    <div className={`flex flex-col gap-1.5 ${className}`}>
      <label htmlFor={d.id} className="font-bold text-ink">
        {label}
      </label>
      {hint ? (
        <p id={d.hintId} className="text-sm text-ink-soft">
          {hint}
        </p>
      ) : null}
      <div className="relative">
        <span aria-hidden="true" className="pointer-events-none absolute inset-y-0 left-3.5 flex items-center font-bold text-ink-soft">
          {symbol}
        </span>
        <input
          id={d.id}
          name={name}
          inputMode="decimal"
          autoComplete="off"
          value={text}
          aria-invalid={error ? true : undefined}
          aria-describedby={d.describedBy}
          className={`${controlClasses(error)} pl-8`}
          onChange={(e) => {
            setText(e.target.value);
            const minor = parseMajor(e.target.value, currency);
            onChange(minor === null ? Number.NaN : minor);
          }}
          onBlur={() => {
            const minor = parseMajor(text, currency);
            if (minor !== null) setText((minor / 10 ** digits).toFixed(digits));
            onBlur?.();
          }}
        />
      </div>
      <FieldError id={d.errorId} message={error} />
    </div>
  );
}
