import { formatLength, formatTemperature } from '../../../../shared/units.ts';

/** The state words, as sellers read them ("awaiting proof"); one home with the state badge. */
export { lineStateWords as stateWords } from '../../../components/ui/line-state-badge.tsx';
export { formatLength, formatTemperature };

export const formatDate = (ms: number) => new Date(ms).toLocaleDateString(undefined, { year: 'numeric', month: 'short', day: 'numeric' });
export const formatDateTime = (ms: number) => new Date(ms).toLocaleString(undefined, { year: 'numeric', month: 'short', day: 'numeric', hour: '2-digit', minute: '2-digit' });
export const percent = (v: number) => `${(v * 100).toFixed(1)} %`;
