import type { ComponentProps } from 'react';
import { TextField } from '../../../components/ui/text-field.tsx';

/**
 * The input where someone chooses a password (sign-up, reset): typed hidden, offered to password
 * managers as a new password, with the rule of the shared password schema as its hint.
 */
export function NewPasswordField(props: Omit<ComponentProps<typeof TextField>, 'type' | 'autoComplete' | 'hint'>) {
  return <TextField type="password" autoComplete="new-password" hint="At least 8 characters. A short sentence is easy to remember and hard to guess." {...props} />;
}
