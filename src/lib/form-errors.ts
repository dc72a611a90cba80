import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-client.ts';

/**
 * Puts a server's `fields` next to the matching inputs. Returns the message to show in a toast
 * when the error isn't about known fields (or isn't an ApiError at all), or null when every
 * message found a field.
 */
export function applyServerErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>, knownFields: ReadonlyArray<Path<T>>): string | null {
  if (!isApiError(error)) return 'Something went wrong. Please try again.';
  let placed = 0;
  let first = true;
  for (const [field, message] of Object.entries(error.fields ?? {})) {
    if ((knownFields as ReadonlyArray<string>).includes(field)) {
      setError(field as Path<T>, { type: 'server', message }, { shouldFocus: first });
      first = false;
      placed += 1;
    }
  }
  return placed > 0 ? null : error.message;
}
