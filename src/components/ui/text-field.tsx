import { useId, type InputHTMLAttributes, type Ref } from 'react';

type TextFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> & {
  label: string;
  /** Shown under the label; linked to the input with aria-describedby. */
  hint?: string;
  error?: string;
  ref?: Ref<HTMLInputElement>;
};

/** A labelled input whose hint and error are read out with it (aria-describedby, aria-invalid). */
export function TextField({ label, hint, error, className = '', ref, ...inputProps }: TextFieldProps) {
  const id = useId();
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ') || undefined;

  return (
    <div className={`flex flex-col gap-1.5 ${className}`}>
      <label htmlFor={id} className="font-bold text-ink">
        {label}
      </label>
      {hint ? (
        <p id={hintId} className="text-sm text-ink-soft">
          {hint}
        </p>
      ) : null}
      <input
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={
          'min-h-11 w-full rounded-lg border-2 bg-white px-3.5 py-2 text-base text-ink placeholder:text-ink-faint ' +
          (error ? 'border-danger' : 'border-field hover:border-ink')
        }
        {...inputProps}
      />
      {error ? (
        <p id={errorId} className="flex items-start gap-1.5 text-sm font-semibold text-danger">
          <span aria-hidden="true">●</span>
          <span>{error}</span>
        </p>
      ) : null}
    </div>
  );
}
