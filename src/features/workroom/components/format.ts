import { formatDate, formatDateTime } from '../../../../shared/dates.ts';
import { formatLength, formatTemperature } from '../../../../shared/units.ts';

/** The state words, as sellers read them ("awaiting proof"); one home with the state badge. */
export { lineStateWords as stateWords } from '../../../components/ui/line-state-badge.tsx';
export { formatDate, formatDateTime, formatLength, formatTemperature };
export const percent = (v: number) => `${(v * 100).toFixed(1)} %`;
