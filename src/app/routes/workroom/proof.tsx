import { Link, useParams } from 'react-router-dom';
import { Button } from '../../../components/ui/button.tsx';
import { PageHeading } from '../../../components/ui/card.tsx';
import { LineStateBadge } from '../../../components/ui/line-state-badge.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { paths } from '../../../config/paths.ts';
import { useApproveProofs } from '../../../features/workroom/api/approve-proofs.ts';
import { useProof } from '../../../features/workroom/api/get-proof.ts';
import { DesignProof } from '../../../features/workroom/components/design-proof.tsx';
import { formatDateTime } from '../../../features/workroom/components/format.ts';
import { LetterByLetter } from '../../../features/workroom/components/letter-by-letter.tsx';
import { MaterialChips } from '../../../features/workroom/components/material-chips.tsx';
import { RequestChangeForm } from '../../../features/workroom/components/request-change-form.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { SellerPageStatus } from '../seller/seller-page-status.tsx';

export function ProofPage() {
  const { lineId = '' } = useParams();
  const proof = useProof(lineId);
  const approve = useApproveProofs();
  const toast = useToast();
  if (proof.isPending || proof.isError) return <SellerPageStatus error={proof.error} loading="Loading the proof…" />;
  const p = proof.data;
  const l = p.line;
  return (
    <div>
      <PageHeading
        eyebrow={`Proof · order ${l.orderNumber}`}
        title={l.text || l.listingTitle}
        lead={
          <>
            {l.quantity} × {l.listingTitle}
            {l.blankChoice ? ` (${l.blankChoice})` : ''} for {l.buyerName} · version {l.version} ·{' '}
            <Link className="underline decoration-thread decoration-2" to={paths.workroomOrder.getHref(l.orderId)}>
              the whole order
            </Link>
          </>
        }
      />
      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="flex flex-col gap-6">
          <DesignProof proof={p} />
          <section aria-labelledby="letters" className="flex flex-col gap-4 rounded-lg border border-line bg-white p-5">
            <h2 id="letters" className="text-lg font-extrabold">
              Letter by letter
            </h2>
            {p.texts.length ? p.texts.map((t) => <LetterByLetter key={t.fieldId} text={t} />) : <p className="text-ink-soft">This design has no text.</p>}
          </section>
        </div>
        <aside className="flex flex-col gap-5">
          <div className="flex items-center gap-3">
            <span className="font-bold">State</span> <LineStateBadge state={l.state} words="workroom" />
          </div>
          <section aria-labelledby="warn" className="flex flex-col gap-2">
            <h2 id="warn" className="text-lg font-extrabold">
              Check before approving
            </h2>
            {p.warnings.length ? (
              <ul className="flex flex-col gap-2" data-testid="proof-warnings">
                {p.warnings.map((w) => (
                  // one warning of each kind per text field
                  <li key={`${w.fieldId ?? ''}:${w.code}`} className="rounded-lg border-2 border-marigold bg-marigold-wash px-3 py-2 text-sm font-semibold">
                    ⚠ {w.message}
                  </li>
                ))}
              </ul>
            ) : (
              <p className="text-ink-soft">No warnings from the engine. Still read the letters one by one.</p>
            )}
          </section>
          <section aria-labelledby="mats" className="flex flex-col gap-2">
            <h2 id="mats" className="font-extrabold">
              Materials, bottom to top
            </h2>
            <MaterialChips materials={l.materials} />
          </section>
          {l.state === 'awaiting_proof' ? (
            <div className="flex flex-col gap-5 rounded-lg border border-line bg-white p-5">
              <Button
                pending={approve.isPending}
                pendingLabel="Approving…"
                onClick={async () => {
                  try {
                    await approve.mutateAsync([l.id]);
                    toast.success('Proof approved. The line is ready for a cut sheet.');
                  } catch (e) {
                    toast.error(isApiError(e) ? e.message : 'That did not work.');
                  }
                }}
              >
                Approve the proof
              </Button>
              <RequestChangeForm lineId={l.id} />
            </div>
          ) : l.state === 'changes_requested' ? (
            <div className="rounded-lg border-2 border-danger bg-danger-wash p-4">
              <p className="font-bold">Waiting for the shopper to edit.</p>
              {p.changeRequest ? <p className="mt-1 text-sm">You asked: “{p.changeRequest}”</p> : null}
            </div>
          ) : null}
          <section aria-labelledby="vers" className="flex flex-col gap-2">
            <h2 id="vers" className="font-extrabold">
              Versions
            </h2>
            <ol className="flex flex-col gap-2" data-testid="proof-versions">
              {[...p.versions].reverse().map((v) => (
                <li key={v.version} className="rounded-lg border border-line bg-white px-3 py-2 text-sm">
                  <p className="font-bold">
                    Version {v.version}: {v.texts.join(' / ') || '—'}
                  </p>
                  <p className="text-ink-soft">
                    {formatDateTime(v.createdAt)}
                    {v.authorName ? ` · ${v.authorName}` : ''}
                  </p>
                </li>
              ))}
            </ol>
          </section>
        </aside>
      </div>
    </div>
  );
}
