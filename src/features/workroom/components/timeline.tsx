import type { TimelineEvent } from '../../../../shared/schemas/workroom.ts';
import { formatDateTime, stateWords } from './format.ts';

const roleWords = { shopper: 'shopper', shop: 'shop', namesake: 'Namesake' } as const;

/** Every change on the order's lines: what, who, when. */
export function Timeline({ events, lineLabel }: { events: TimelineEvent[]; lineLabel?: (lineId: string) => string }) {
  if (!events.length) return <p className="text-ink-soft">Nothing has happened yet.</p>;
  return (
    <ol className="flex flex-col gap-3 border-l-2 border-thread/40 pl-4" aria-label="Timeline">
      {events.map((e) => (
        <li key={e.id} className="relative">
          <span aria-hidden="true" className="absolute top-2 -left-[1.4rem] size-3 rounded-full border-2 border-thread bg-paper" />
          <p>
            <span className="font-bold">{e.fromState ? `${stateWords(e.fromState)} → ${stateWords(e.toState)}` : stateWords(e.toState)}</span>
            {lineLabel ? <span className="text-ink-soft"> · {lineLabel(e.lineId)}</span> : null}
          </p>
          <p className="text-sm text-ink-soft">
            {formatDateTime(e.at)} · {e.actorName ? `${e.actorName} (${roleWords[e.actorRole ?? 'namesake']})` : 'Namesake'}
          </p>
          {e.message ? <p className="mt-0.5 rounded bg-white px-2 py-1 text-sm">{e.message}</p> : null}
        </li>
      ))}
    </ol>
  );
}
