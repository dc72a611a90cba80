import type { ComponentProps } from 'react';
import { TextField } from '../../../components/ui/text-field.tsx';

type FieldProps = Omit<ComponentProps<typeof TextField>, 'label' | 'type' | 'autoComplete' | 'inputMode' | 'hint'>;

/** The account's e-mail address (sign-in, sign-up, forgotten password). */
export function EmailField(props: FieldProps) {
  return <TextField label="E-mail" type="email" autoComplete="email" inputMode="email" {...props} />;
}

/**
 * The input where someone chooses a password (sign-up, reset): typed hidden, offered to password
 * managers as a new password, with the rule of the shared password schema as its hint.
 */
export function NewPasswordField({ label, ...props }: FieldProps & { label: string }) {
  return <TextField label={label} type="password" autoComplete="new-password" hint="At least 8 characters. A short sentence is easy to remember and hard to guess." {...props} />;
}
