import { useState } from 'react';
import { Spinner } from '../../../components/ui/button.tsx';
import { useMailMessage } from '../api/get-mail-message.ts';
import { formatMailDate } from './format-date.ts';

/**
 * Shows one captured message. The HTML part goes into an iframe with an empty `sandbox`
 * (no scripts, no forms, no same-origin access), so nothing in a mail can run in our page.
 */
export function MailViewer({ id }: { id: string | null }) {
  const message = useMailMessage(id);
  const [view, setView] = useState<'html' | 'text'>('html');

  if (!id) {
    return <p className="rounded-lg border-2 border-dashed border-line p-10 text-center text-ink-soft">Choose a message to read it.</p>;
  }
  if (message.isPending) return <Spinner label="Opening message…" />;
  if (message.isError)
    return (
      <p role="alert" className="font-semibold text-danger">
        {message.error.message}
      </p>
    );

  const m = message.data;
  const hasHtml = Boolean(m.html);
  const shown = hasHtml ? view : 'text';

  return (
    <article aria-labelledby="mail-subject" className="flex flex-col gap-4 rounded-lg border border-line bg-white p-5">
      <header className="flex flex-col gap-1 border-b border-line pb-4">
        <h2 id="mail-subject" className="text-xl font-extrabold break-words">
          {m.subject || '(no subject)'}
        </h2>
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
          <dt className="font-bold">From</dt>
          <dd className="break-all">{m.from}</dd>
          <dt className="font-bold">To</dt>
          <dd className="break-all">{m.to}</dd>
          <dt className="font-bold">Date</dt>
          <dd>{formatMailDate(m.date)}</dd>
        </dl>
      </header>
      {hasHtml ? (
        <fieldset aria-label="Show as" className="flex gap-2">
          {(['html', 'text'] as const).map((v) => (
            <button
              key={v}
              type="button"
              aria-pressed={shown === v}
              onClick={() => setView(v)}
              className={`min-h-10 rounded-lg border-2 px-3 text-sm font-bold ${shown === v ? 'border-ink bg-ink text-paper' : 'border-line bg-white hover:border-ink'}`}
            >
              {v === 'html' ? 'Formatted' : 'Plain text'}
            </button>
          ))}
        </fieldset>
      ) : null}
      {shown === 'html' && m.html ? (
        // a script-less sandbox; tall, and the admin can drag it taller: the plain text view shows it all
        <iframe title={`Message: ${m.subject}`} sandbox="" srcDoc={m.html} referrerPolicy="no-referrer" className="h-[75vh] min-h-[32rem] w-full resize-y rounded-lg border border-line bg-white" />
      ) : (
        <pre className="overflow-x-auto rounded-lg bg-paper-deep p-4 font-mono text-sm whitespace-pre-wrap break-words">{m.text || '(this message has no text part)'}</pre>
      )}
    </article>
  );
}
