import { type FormEventHandler, type InputHTMLAttributes, type ReactNode, type Ref, type SelectHTMLAttributes, type TextareaHTMLAttributes, useId, useState } from 'react';
import { type Control, type FieldPathByValue, type FieldValues, useController } from 'react-hook-form';
import { formatMoney, minorDigits, parseMajor } from '../../../shared/money.ts';
import { Button } from './button.tsx';

/** Field pieces that match TextField: label, hint and error linked with aria-describedby. */

const controlClasses = (error?: string) =>
  'min-h-11 w-full rounded-lg border-2 bg-white px-3.5 py-2 text-base text-ink placeholder:text-ink-faint ' + (error ? 'border-danger' : 'border-field hover:border-ink');

export function FieldError({ id, message }: { id?: string; message?: string }) {
  if (!message) return null;
  return (
    <p id={id} data-field-error className="flex items-start gap-1.5 text-sm font-semibold text-danger">
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

function FieldHint({ id, hint }: { id: string; hint?: ReactNode }) {
  return hint ? (
    <p id={id} className="text-sm text-ink-soft">
      {hint}
    </p>
  ) : null;
}

/** What a field's control needs to be read out with its label, hint and error. */
export type FieldControlProps = { id: string; 'aria-invalid': true | undefined; 'aria-describedby': string | undefined; className: string };

/** The field around a control: its label, the hint under it, the error, and classes for the wrapper. */
export type FieldProps = { label: ReactNode; hint?: ReactNode; error?: string; className?: string };

/** A field component's props split into the field's own and the rest (for its control). */
export function splitFieldProps<P extends FieldProps>({ label, hint, error, className, ...rest }: P): [FieldProps, Omit<P, keyof FieldProps>] {
  return [{ label, hint, error, className }, rest];
}

/**
 * The one field layout: label, hint, the control, error. `control` renders the input, select or
 * textarea with the props it is given (id, aria-invalid, aria-describedby, the field's classes).
 */
export function Field({ label, hint, error, className = '', control }: FieldProps & { control: (props: FieldControlProps) => ReactNode }) {
  const d = useDescribed(hint, error);
  return (
    <div className={`flex flex-col gap-1.5 ${className}`}>
      <label htmlFor={d.id} className="font-bold text-ink">
        {label}
      </label>
      <FieldHint id={d.hintId} hint={hint} />
      {control({ id: d.id, 'aria-invalid': error ? true : undefined, 'aria-describedby': d.describedBy, className: controlClasses(error) })}
      <FieldError id={d.errorId} message={error} />
    </div>
  );
}

type TextAreaProps = Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> & FieldProps & { label: string; ref?: Ref<HTMLTextAreaElement> };

export function TextAreaField({ ref, rows = 4, ...props }: TextAreaProps) {
  const [field, rest] = splitFieldProps(props);
  return <Field {...field} control={(c) => <textarea {...c} ref={ref} rows={rows} {...rest} />} />;
}

type SelectProps = Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> & FieldProps & { label: string; ref?: Ref<HTMLSelectElement>; children: ReactNode };

export function SelectField({ ref, children, ...props }: SelectProps) {
  const [field, rest] = splitFieldProps(props);
  return (
    <Field
      {...field}
      control={(c) => (
        <select {...c} ref={ref} {...rest}>
          {children}
        </select>
      )}
    />
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
        <FieldHint id={d.hintId} hint={hint} />
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
      <div role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct ?? undefined} className="h-2.5 w-full overflow-hidden rounded-full bg-paper-deep">
        <div className={`h-full rounded-full bg-thread transition-[width] ${pct === null ? 'w-1/3 animate-pulse' : ''}`} style={pct === null ? undefined : { width: `${pct}%` }} />
      </div>
    </div>
  );
}

/** A one-column form: its fields, then the submit button, which shows `pendingLabel` while `pending`. */
export function SubmitForm({
  onSubmit,
  pending,
  pendingLabel,
  submitLabel,
  children,
}: {
  onSubmit: FormEventHandler<HTMLFormElement>;
  pending: boolean;
  pendingLabel: string;
  submitLabel: string;
  children: ReactNode;
}) {
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
      {children}
      <Button type="submit" pending={pending} pendingLabel={pendingLabel} className="w-full sm:w-auto sm:self-start">
        {submitLabel}
      </Button>
    </form>
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
export function MoneyField({ currency, value, onChange, onBlur, name, ...field }: MoneyFieldProps) {
  const digits = minorDigits(currency);
  const [text, setText] = useState(() => (value === undefined || Number.isNaN(value) ? '' : (value / 10 ** digits).toFixed(digits)));
  const symbol = formatMoney(0, currency).replace(/[\d.,]/g, '');
  return (
    <Field
      {...field}
      control={(c) => (
        <div className="relative">
          <span aria-hidden="true" className="pointer-events-none absolute inset-y-0 left-3.5 flex items-center font-bold text-ink-soft">
            {symbol}
          </span>
          <input
            {...c}
            className={`${c.className} pl-8`}
            name={name}
            inputMode="decimal"
            autoComplete="off"
            value={text}
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
      )}
    />
  );
}

/** A MoneyField bound to a number field of a react-hook-form form (its value, changes and blur). */
export function MoneyController<T extends FieldValues, O>({
  control,
  name,
  ...field
}: Omit<MoneyFieldProps, 'value' | 'onChange' | 'onBlur' | 'name'> & { control: Control<T, unknown, O>; name: FieldPathByValue<T, number | undefined> }) {
  const { field: bound } = useController({ control, name });
  return <MoneyField {...field} value={bound.value} onChange={bound.onChange} onBlur={bound.onBlur} name={bound.name} />;
}
