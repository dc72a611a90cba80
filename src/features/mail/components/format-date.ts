import { formatDateTime } from '../../../../shared/dates.ts';

/** A captured mail's date, in the app's one date style. */
export function formatMailDate(iso: string): string {
  return formatDateTime(iso);
}
