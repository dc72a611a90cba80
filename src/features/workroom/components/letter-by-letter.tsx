import { catalogEntry } from '../../../../shared/engine/font-catalog.ts';
import type { ProofText } from '../../../../shared/schemas/workroom.ts';
import { formatSmallLength } from '../../../../shared/units.ts';

/**
 * The text exactly as typed, one box per code point: anything outside printable ASCII shows its
 * code point, so "Zoë" typed with a combining diaeresis (e + U+0308) reads differently from the
 * precomposed U+00EB. A combining mark is drawn on a dotted circle so it can be seen alone.
 */
export function LetterByLetter({ text }: { text: ProofText }) {
  return (
    <div className="flex flex-col gap-2">
      <p className="text-sm text-ink-soft">
        {text.label}: {text.chars.length} character{text.chars.length === 1 ? '' : 's'} in {catalogEntry(text.fontId)?.family ?? text.fontId}
        {text.letterHeightMm ? `, letters about ${formatSmallLength(text.letterHeightMm)} tall` : ''}
        {text.normalized === 'NFD' || text.normalized === 'mixed' ? ' · typed with combining marks' : ''}
      </p>
      <ol className="flex flex-wrap gap-1.5" aria-label={`${text.label}, letter by letter`} data-testid={`letters-${text.fieldId}`}>
        {text.chars.map((c, i) => {
          const mark = /\p{M}/u.test(c.char);
          const invisible = c.name !== null && /space|joiner|tab/.test(c.name);
          return (
            <li
              // biome-ignore lint/suspicious/noArrayIndexKey: the place in the typed text is each character's identity; a letter may repeat
              key={i}
              className={`flex min-w-12 flex-col items-center rounded-lg border-2 px-2 py-1 ${c.ascii ? 'border-line bg-white' : 'border-marigold bg-marigold-wash'}`}
              title={c.name ?? undefined}
            >
              <span className="text-2xl leading-tight font-bold" aria-hidden={invisible || undefined}>
                {mark ? `\u25CC${c.char}` : invisible ? '␣' : c.char}
              </span>
              {!c.ascii ? <span className="font-mono text-xs font-bold">{c.codePoints.join(' ')}</span> : null}
              {c.name ? <span className="text-center text-[11px] leading-tight text-ink-soft">{c.name}</span> : null}
            </li>
          );
        })}
      </ol>
    </div>
  );
}
