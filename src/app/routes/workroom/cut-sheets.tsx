import { useState } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import type { Grouping } from '../../../../shared/schemas/workroom.ts';
import { Button, Spinner } from '../../../components/ui/button.tsx';
import { PageHeading } from '../../../components/ui/card.tsx';
import { ConfirmButton } from '../../../components/ui/confirm-button.tsx';
import { Pager, usePageParam } from '../../../components/ui/pager.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { paths } from '../../../config/paths.ts';
import { useBuildCutSheets } from '../../../features/workroom/api/build-cut-sheets.ts';
import { useDiscardBatch } from '../../../features/workroom/api/discard-batch.ts';
import { useBatch } from '../../../features/workroom/api/get-batch.ts';
import { useBatches } from '../../../features/workroom/api/get-batches.ts';
import { useLines } from '../../../features/workroom/api/get-lines.ts';
import { useMarkCut } from '../../../features/workroom/api/mark-cut.ts';
import { CutSheetCard, stockWarningsText } from '../../../features/workroom/components/cut-sheet-card.tsx';
import { formatDateTime, formatLength } from '../../../features/workroom/components/format.ts';
import { MaterialChips } from '../../../features/workroom/components/material-chips.tsx';
import { WorksheetDownload } from '../../../features/workroom/components/worksheet-download.tsx';
import { isApiError } from '../../../lib/api-client.ts';

function Batch({ batchId }: { batchId: string }) {
  const batch = useBatch(batchId);
  const markCut = useMarkCut();
  const discard = useDiscardBatch();
  const navigate = useNavigate();
  const toast = useToast();
  if (batch.isPending) return <Spinner label="Loading the cut sheets…" />;
  if (batch.isError)
    return (
      <p role="alert" className="font-bold text-danger">
        {batch.error.message}
      </p>
    );
  const sheets = batch.data;
  const planned = sheets.filter((s) => s.state === 'planned');
  const total = sheets.reduce((a, s) => a + s.lengthMm, 0);
  const extra = sheets.reduce((a, s) => a + s.extraLengthMm, 0);
  const grouped = sheets.some((s) => s.grouping === 'order');
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-center justify-between gap-3 rounded-lg border border-line bg-white p-4">
        <p>
          <span className="font-extrabold">
            {sheets.length} cut sheet{sheets.length === 1 ? '' : 's'}
          </span>
          , one per material, {formatLength(total)} of vinyl in all. Files are mirrored for cutting, 1 unit = 1 mm.
          {grouped ? (
            <span className="block" data-testid="grouping-cost">
              Orders kept together: {extra > 0 ? `${formatLength(extra)} more roll` : 'no extra roll'} than the tightest nest of the same pieces.
            </span>
          ) : null}
        </p>
        <div className="flex flex-wrap items-center gap-3">
          {planned.length === sheets.length ? (
            <Button
              variant="quiet"
              pending={discard.isPending}
              pendingLabel="Discarding…"
              onClick={async () => {
                try {
                  const r = await discard.mutateAsync(batchId);
                  toast.success(`Batch discarded; ${r.linesReleased.length} line${r.linesReleased.length === 1 ? ' is' : 's are'} approved and ready to cut again.`);
                  navigate(paths.workroomCutSheets.getHref());
                } catch (e) {
                  toast.error(isApiError(e) ? e.message : 'That did not work.');
                }
              }}
            >
              Discard this batch
            </Button>
          ) : null}
          {planned.length ? (
            <ConfirmButton
              question={`Mark all ${planned.length} sheets cut? ${formatLength(planned.reduce((a, s) => a + s.lengthMm, 0))} of vinyl (plus trim) comes off your stock, and their lines move on to pressing.`}
              confirmLabel="Yes, mark them cut"
              onConfirm={async () => {
                try {
                  const r = await markCut.mutateAsync({ batchId });
                  toast.success(`All sheets marked cut; ${r.linesCut.length} line${r.linesCut.length === 1 ? '' : 's'} now cut. Press cards are ready.`);
                  if (r.warnings.length) toast.error(stockWarningsText(r.warnings));
                } catch (e) {
                  toast.error(isApiError(e) ? e.message : 'That did not work.');
                }
              }}
              pending={markCut.isPending}
              pendingLabel="Saving…"
            >
              Mark all {planned.length} sheets cut
            </ConfirmButton>
          ) : (
            <Link to={paths.workroomPress.getHref()} className="font-bold text-thread-deep underline decoration-2">
              All cut — go to the press cards
            </Link>
          )}
        </div>
      </div>
      <WorksheetDownload batchId={batchId} />
      <div className="grid gap-5 md:grid-cols-2 xl:grid-cols-3">
        {sheets.map((s, i) => (
          <CutSheetCard key={s.id} sheet={s} index={i} />
        ))}
      </div>
    </div>
  );
}

function Choose() {
  // approved lines a page at a time, most urgent first; a batch is built from the page's lines
  const [page, setPage] = usePageParam();
  const lines = useLines({ state: 'approved', page });
  const batches = useBatches();
  const build = useBuildCutSheets();
  const toast = useToast();
  const navigate = useNavigate();
  // the lines ticked on the page shown; until one is touched, every line of the page is
  const [picked, setPicked] = useState<{ page: number; ids: Set<string> } | null>(null);
  const [grouping, setGrouping] = useState<Grouping>('tightest');
  const [weedingLines, setWeedingLines] = useState(false);
  if (lines.isPending) return <Spinner label="Loading approved lines…" />;
  if (lines.isError)
    return (
      <p role="alert" className="font-bold text-danger">
        {lines.error.message}
      </p>
    );
  const items = lines.data.items;
  const chosen = picked && picked.page === lines.data.page ? picked.ids : new Set(items.map((l) => l.id));
  const pick = (ids: Set<string>) => setPicked({ page: lines.data.page, ids });
  const toggle = (id: string) => {
    const next = new Set(chosen);
    if (next.has(id)) next.delete(id);
    else next.add(id);
    pick(next);
  };
  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="approved" className="flex flex-col gap-3">
        <h2 id="approved" className="text-xl font-extrabold">
          Approved lines, ready to cut
        </h2>
        <p className="text-sm text-ink-soft">Lines already on a batch that is not cut yet are planned and not listed here; discard that batch to build them again.</p>
        {lines.data.total === 0 ? (
          <p className="text-ink-soft">
            No approved lines yet. Approve proofs in the{' '}
            <Link className="underline" to={paths.workroom.getHref()}>
              workroom
            </Link>{' '}
            first.
          </p>
        ) : (
          <>
            <ul className="flex flex-col gap-2">
              {items.map((l) => (
                <li key={l.id}>
                  <label className="flex min-h-11 cursor-pointer flex-wrap items-center gap-3 rounded-lg border border-line bg-white px-3 py-2 hover:border-thread">
                    <input type="checkbox" className="size-5 accent-thread" checked={chosen.has(l.id)} onChange={() => toggle(l.id)} />
                    <span className="font-bold">{l.orderNumber}</span>
                    <span className="font-extrabold">
                      {l.text || '—'}
                      {l.quantity > 1 ? ` × ${l.quantity}` : ''}
                    </span>
                    <span className="text-ink-soft">
                      {l.listingTitle}
                      {l.blankChoice ? ` · ${l.blankChoice}` : ''}
                    </span>
                    <MaterialChips materials={l.materials} />
                  </label>
                </li>
              ))}
            </ul>
            <fieldset className="flex flex-col gap-2 rounded-lg border border-line bg-white p-3">
              <legend className="px-1 font-extrabold">Layout on the roll</legend>
              <label className="flex min-h-11 cursor-pointer items-center gap-3">
                <input type="radio" name="grouping" className="size-5 accent-thread" checked={grouping === 'tightest'} onChange={() => setGrouping('tightest')} />
                <span>
                  <span className="font-bold">Tightest</span> — least vinyl; pieces of different orders mix on the sheet
                </span>
              </label>
              <label className="flex min-h-11 cursor-pointer items-center gap-3">
                <input type="radio" name="grouping" className="size-5 accent-thread" checked={grouping === 'order'} onChange={() => setGrouping('order')} />
                <span>
                  <span className="font-bold">Keep each order together</span> — each order inside its own cut border, labelled with its number, so you can split the sheet before weeding
                </span>
              </label>
              <label className={`ml-8 flex min-h-11 items-center gap-3 ${grouping === 'order' ? 'cursor-pointer' : 'text-ink-soft'}`}>
                <input
                  type="checkbox"
                  className="size-5 accent-thread"
                  disabled={grouping !== 'order'}
                  checked={grouping === 'order' && weedingLines}
                  onChange={(e) => setWeedingLines(e.target.checked)}
                />
                <span>Add straight weeding lines between the orders (groups sit in rows)</span>
              </label>
            </fieldset>
            <div className="flex flex-wrap gap-3">
              <Button
                disabled={chosen.size === 0}
                pending={build.isPending}
                pendingLabel="Nesting…"
                onClick={async () => {
                  try {
                    const r = await build.mutateAsync({ lineIds: [...chosen], grouping, weedingLines: grouping === 'order' && weedingLines });
                    navigate(paths.workroomCutSheets.getHref(r.batchId));
                  } catch (e) {
                    toast.error(isApiError(e) ? e.message : 'That did not work.');
                  }
                }}
              >
                Build cut sheets for {chosen.size} line{chosen.size === 1 ? '' : 's'}
              </Button>
              <Button variant="quiet" onClick={() => pick(new Set(items.map((l) => l.id)))}>
                Select all{lines.data.total > items.length ? ' on this page' : ''}
              </Button>
              <Button variant="quiet" onClick={() => pick(new Set())}>
                Select none
              </Button>
            </div>
            <Pager page={page} total={lines.data.total} limit={lines.data.limit} label="Approved line pages" noun="approved lines" onPageChange={setPage} />
          </>
        )}
      </section>
      {batches.data?.length ? (
        <section aria-labelledby="recent" className="flex flex-col gap-2">
          <h2 id="recent" className="text-xl font-extrabold">
            Earlier batches
          </h2>
          <ul className="flex flex-col gap-1">
            {batches.data.map((b) => (
              <li key={b.batchId}>
                <Link className="underline decoration-thread decoration-2" to={paths.workroomCutSheets.getHref(b.batchId)}>
                  {formatDateTime(b.createdAt)}: {b.sheets} sheets, {b.lineCount} lines{b.planned ? `, ${b.planned} not cut yet` : ', all cut'}
                </Link>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}

export function CutSheetsPage() {
  const [params] = useSearchParams();
  const batchId = params.get('batch');
  return (
    <div>
      <PageHeading eyebrow="Workroom" title="Cut sheets" lead="Approved pieces, grouped by material and colour, nested on each roll with a 6 mm gap and 6 mm edges." />
      {batchId ? (
        <>
          <p className="mb-4">
            <Link className="font-bold underline decoration-thread decoration-2" to={paths.workroomCutSheets.getHref()}>
              ← Choose other lines
            </Link>
          </p>
          <Batch batchId={batchId} />
        </>
      ) : (
        <Choose />
      )}
    </div>
  );
}
