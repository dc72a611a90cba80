import type { InputHTMLAttributes, Ref } from 'react';
import { Field, splitFieldProps } from './form-controls.tsx';

type TextFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> & {
  label: string;
  /** Shown under the label; linked to the input with aria-describedby. */
  hint?: string;
  error?: string;
  ref?: Ref<HTMLInputElement>;
};

/** A labelled input whose hint and error are read out with it (aria-describedby, aria-invalid). */
export function TextField({ ref, ...props }: TextFieldProps) {
  const [field, inputProps] = splitFieldProps(props);
  return <Field {...field} control={(c) => <input {...c} ref={ref} {...inputProps} />} />;
}
