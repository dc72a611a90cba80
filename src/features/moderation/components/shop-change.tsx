import { useState } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { useDecideShopChange } from '../api/decide-shop-change.ts';
import type { QueueShopChange } from '../api/types.ts';
import { ReasonForm } from './reason-form.tsx';

/** One field's before → after; an unchanged field is left out. */
function BeforeAfter({ label, before, after }: { label: string; before: string; after: string }) {
  return (
    <div className="flex flex-col gap-1">
      <h3 className="font-bold">{label}</h3>
      <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-3 gap-y-1">
        <dt className="text-sm text-ink-soft">Now</dt>
        <dd className="whitespace-pre-wrap [overflow-wrap:anywhere]">{before || <span className="text-ink-faint">(empty)</span>}</dd>
        <dt className="text-sm text-ink-soft">New</dt>
        <dd className="font-semibold whitespace-pre-wrap [overflow-wrap:anywhere]">{after || <span className="text-ink-faint">(empty)</span>}</dd>
      </dl>
    </div>
  );
}

/**
 * A live shop's new name/description: shown as before → after; approving applies exactly this
 * revision, rejecting keeps the public details and sends the reason to the seller.
 */
export function ShopChangeCard({ change }: { change: QueueShopChange }) {
  const toast = useToast();
  const decide = useDecideShopChange();
  const [rejecting, setRejecting] = useState(false);
  const [stale, setStale] = useState<string | null>(null);
  const label = change.before.name;

  const run = async (reason?: string) => {
    setStale(null);
    try {
      await decide.mutateAsync({ id: change.id, revision: change.revision, reason });
    } catch (e) {
      if (isApiError(e) && e.status === 409) {
        // the queue reloads (onSettled) with the seller's newer change
        setStale(e.message);
        setRejecting(false);
        return;
      }
      throw e;
    }
    toast.success(reason === undefined ? `The new details of ${label} are public.` : `${label} keeps its current details; the seller has your reason.`);
  };

  return (
    <li className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4" aria-label={`Changes to shop ${label}`}>
      <p className="text-sm [overflow-wrap:anywhere] text-ink-soft">
        /shops/{change.slug} · {change.owner.name} ({change.owner.email})
      </p>
      {change.changed.includes('name') ? <BeforeAfter label="Shop name" before={change.before.name} after={change.after.name} /> : null}
      {change.changed.includes('description') ? <BeforeAfter label="Description" before={change.before.description} after={change.after.description} /> : null}
      {stale ? (
        <p role="alert" className="font-semibold text-danger">
          {stale}
        </p>
      ) : null}
      {rejecting ? (
        <ReasonForm label={`Why are the new details of ${label} not approved?`} submitLabel="Reject change" danger onSubmit={(reason) => run(reason)} onCancel={() => setRejecting(false)} />
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button pending={decide.isPending} onClick={() => void run().catch((e: Error) => toast.error(e.message))}>
            Approve change<span className="sr-only"> to {label}</span>
          </Button>
          <Button variant="secondary" onClick={() => setRejecting(true)}>
            Reject change<span className="sr-only"> to {label}</span>
          </Button>
        </div>
      )}
    </li>
  );
}
