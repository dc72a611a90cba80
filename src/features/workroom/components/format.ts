import { formatLength, formatTemperature } from '../../../../shared/units.ts';
import type { LineState } from '../../../../shared/schemas/order.ts';

export { formatLength, formatTemperature };

/** The order-line state codes, as people read them ("awaiting proof"). */
export const stateWords = (s: LineState | string) => s.replace(/_/g, ' ');

export const formatDate = (ms: number) => new Date(ms).toLocaleDateString(undefined, { year: 'numeric', month: 'short', day: 'numeric' });
export const formatDateTime = (ms: number) => new Date(ms).toLocaleString(undefined, { year: 'numeric', month: 'short', day: 'numeric', hour: '2-digit', minute: '2-digit' });
export const percent = (v: number) => `${(v * 100).toFixed(1)} %`;
