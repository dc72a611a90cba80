import { type ReactNode, useState } from 'react';
import { Button } from './button.tsx';

/**
 * A button for a step that is hard to take back: the first press asks, in words, what will happen;
 * only "Yes" does it. Cancel (or Escape) leaves everything as it was.
 */
export function ConfirmButton({
  children,
  question,
  confirmLabel,
  onConfirm,
  pending,
  pendingLabel,
}: {
  children: ReactNode;
  question: ReactNode;
  confirmLabel: string;
  onConfirm: () => Promise<unknown> | unknown;
  pending?: boolean;
  pendingLabel?: string;
}) {
  const [asking, setAsking] = useState(false);
  if (!asking) return <Button onClick={() => setAsking(true)}>{children}</Button>;
  return (
    <fieldset className="flex flex-wrap items-center gap-3 rounded-lg border-2 border-marigold bg-marigold-wash p-3" onKeyDown={(e) => e.key === 'Escape' && setAsking(false)}>
      <legend className="sr-only">Confirm</legend>
      <p className="font-semibold">{question}</p>
      <Button
        // biome-ignore lint/a11y/noAutofocus: the question just opened from the button the keyboard was on
        autoFocus
        pending={pending}
        pendingLabel={pendingLabel}
        onClick={async () => {
          await onConfirm();
          setAsking(false);
        }}
      >
        {confirmLabel}
      </Button>
      <Button variant="quiet" onClick={() => setAsking(false)}>
        Cancel
      </Button>
    </fieldset>
  );
}
