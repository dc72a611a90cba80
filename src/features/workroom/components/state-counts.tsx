import { WORK_STATES, type WorkroomSummary } from '../../../../shared/schemas/workroom.ts';
import { stateWords } from './format.ts';

/** One tile per line state; clicking one filters the table below. */
export function StateCounts({ summary, active, onPick }: { summary: WorkroomSummary | undefined; active: string; onPick: (state: string) => void }) {
  return (
    <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6" aria-label="Order lines by state">
      {WORK_STATES.map((s) => (
        <li key={s}>
          <button
            type="button"
            aria-pressed={active === s}
            onClick={() => onPick(active === s ? '' : s)}
            className={`flex w-full flex-col items-start rounded-lg border-2 px-4 py-3 text-left ${active === s ? 'border-thread bg-thread-wash' : 'border-line bg-white hover:border-thread'}`}
          >
            <span className="text-3xl font-extrabold" data-testid={`count-${s}`}>
              {summary ? summary.counts[s] : '…'}
            </span>
            <span className="text-sm font-bold text-ink-soft">{stateWords(s)}</span>
          </button>
        </li>
      ))}
    </ul>
  );
}
