import { useState } from 'react';
import type { Choices } from '../../../../shared/schemas/listing.ts';
import { Button, Spinner } from '../../../components/ui/button.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { usePersonalisation } from '../api/get-personalisation.ts';
import { useSavePersonalisation } from '../api/save-personalisation.ts';

type LineLike = { id: string; state: string; listingTitle: string };

const selectClass = 'min-h-11 w-full rounded-lg border-2 border-field bg-white px-3 py-2 text-base hover:border-ink';

/**
 * On the shopper's order page: for each item the shop asked to change, the shop's message and the
 * personalisation to edit. The server checks it with the listing's own rules and the engine
 * (the same as when it was added to the cart) and sends it back to the shop for a new proof.
 */
export function ProofEditPanel({ lines, onSaved }: { lines: LineLike[]; onSaved: () => void }) {
  const waiting = lines.filter((l) => l.state === 'changes_requested');
  if (!waiting.length) return null;
  return (
    <section aria-labelledby="proof-edit-title" className="mb-8 flex flex-col gap-4 rounded-lg border-2 border-marigold bg-marigold-wash/50 p-5">
      <h2 id="proof-edit-title" className="text-xl font-extrabold">
        The shop asks you to check your personalisation
      </h2>
      {waiting.map((l) => (
        <EditOne key={l.id} lineId={l.id} title={l.listingTitle} onSaved={onSaved} />
      ))}
    </section>
  );
}

function EditOne({ lineId, title, onSaved }: { lineId: string; title: string; onSaved: () => void }) {
  const toast = useToast();
  const data = usePersonalisation(lineId);
  const save = useSavePersonalisation(onSaved);
  const [draft, setDraft] = useState<Choices | null>(null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  if (data.isPending) return <Spinner label="Loading…" />;
  if (data.isError)
    return (
      <p role="alert" className="font-bold text-danger">
        {data.error.message}
      </p>
    );
  const d = data.data;
  const choices = draft ?? d.choices;
  const setText = (fieldId: string, patch: Partial<Choices['texts'][string]>) => {
    const field = d.textFields.find((f) => f.id === fieldId)!;
    const cur = choices.texts[fieldId] ?? { text: '', fontId: field.fonts[0]?.id ?? '', letterHeightMm: 50 };
    setDraft({ ...choices, texts: { ...choices.texts, [fieldId]: { ...cur, ...patch } } });
  };
  const onSubmit = async (e: React.FormEvent) => {
    e.preventDefault();
    const local: Record<string, string> = {};
    for (const f of d.textFields) {
      const t = choices.texts[f.id]?.text.trim() ?? '';
      if (f.required && !t) local[`choices.texts.${f.id}.text`] = `Enter the ${f.label.toLowerCase()}.`;
      else if ([...t].length > f.maxLength) local[`choices.texts.${f.id}.text`] = `Use at most ${f.maxLength} characters.`;
    }
    setErrors(local);
    if (Object.keys(local).length) return;
    try {
      await save.mutateAsync({ lineId, choices });
      setDraft(null);
      toast.success('Thank you! The shop will check the new proof.');
    } catch (err) {
      if (isApiError(err) && err.fields) setErrors(err.fields);
      toast.error(isApiError(err) ? err.message : 'That did not work. Please try again.');
    }
  };
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4 rounded-lg border border-line bg-white p-4" aria-label={`Edit the personalisation of ${title}`}>
      <p className="font-bold">{title}</p>
      {d.changeRequest ? (
        <blockquote className="border-l-4 border-thread bg-thread-wash px-3 py-2">
          <span className="block text-sm font-bold text-thread-deep">The shop wrote:</span>
          <span data-testid="change-request">{d.changeRequest}</span>
        </blockquote>
      ) : null}
      {d.textFields.map((f) => {
        const c = choices.texts[f.id];
        const fontId = c?.fontId ?? f.fonts[0]?.id ?? '';
        return (
          <div key={f.id} className="grid gap-3 sm:grid-cols-3">
            <TextField
              label={f.label}
              hint={`Up to ${f.maxLength} characters.`}
              value={c?.text ?? ''}
              maxLength={f.maxLength * 2}
              autoComplete="off"
              spellCheck={false}
              error={errors[`choices.texts.${f.id}.text`]}
              onChange={(e) => setText(f.id, { text: e.target.value })}
            />
            <label className="flex flex-col gap-1.5 font-bold">
              Font
              <select className={selectClass} value={fontId} onChange={(e) => setText(f.id, { fontId: e.target.value })}>
                {f.fonts.map((x) => (
                  <option key={x.id} value={x.id}>
                    {x.label}
                  </option>
                ))}
              </select>
              {errors[`choices.texts.${f.id}.fontId`] ? <span className="text-sm text-danger">{errors[`choices.texts.${f.id}.fontId`]}</span> : null}
            </label>
            <label className="flex flex-col gap-1.5 font-bold">
              Colour
              <select
                className={selectClass}
                value={choices.textColours[f.id] ?? f.colours[0]?.id ?? ''}
                onChange={(e) => setDraft({ ...choices, textColours: { ...choices.textColours, [f.id]: e.target.value } })}
              >
                {f.colours.map((x) => (
                  <option key={x.id} value={x.id}>
                    {x.label}
                  </option>
                ))}
              </select>
              {errors[`choices.textColours.${f.id}`] ? <span className="text-sm text-danger">{errors[`choices.textColours.${f.id}`]}</span> : null}
            </label>
          </div>
        );
      })}
      {errors.choices ? <p className="text-sm font-semibold text-danger">{errors.choices}</p> : null}
      <Button type="submit" pending={save.isPending} pendingLabel="Sending…" className="self-start">
        Send the corrected personalisation
      </Button>
    </form>
  );
}
