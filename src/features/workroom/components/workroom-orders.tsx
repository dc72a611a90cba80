import { useNavigate, useSearchParams } from 'react-router-dom';
import { LINE_STATES, type LineState } from '../../../../shared/schemas/order.ts';
import { Button, Spinner } from '../../../components/ui/button.tsx';
import { Pager, usePageParam } from '../../../components/ui/pager.tsx';
import type { ShipByLookup } from '../../../components/ui/ship-by-cell.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { paths } from '../../../config/paths.ts';
import { isApiError } from '../../../lib/api-client.ts';
import { useApproveProofs } from '../api/approve-proofs.ts';
import { useBuildCutSheets } from '../api/build-cut-sheets.ts';
import { useLines } from '../api/get-lines.ts';
import { useSummary } from '../api/get-summary.ts';
import { type LinesFilterValues, LinesTable } from './lines-table.tsx';
import { StateCounts } from './state-counts.tsx';

const FILTER_KEYS = ['state', 'from', 'to', 'material', 'listing'] as const;
/** a calendar day typed in the date field, as the first or last millisecond of that day here */
const dayEdge = (day: string, edge: 'start' | 'end') => {
  const ms = Date.parse(`${day}T${edge === 'start' ? '00:00:00' : '23:59:59.999'}`);
  return day && Number.isFinite(ms) && ms >= 0 ? ms : undefined;
};

/**
 * The workroom home: counts per state, the filterable table a page at a time, and the bulk
 * actions on the lines selected on the page. Filters and page live in the URL. `shipBy` gives each
 * line's ship-by date and mark (the route takes it from the business feature).
 */
export function WorkroomOrders({ shipBy }: { shipBy: ShipByLookup }) {
  const [params, setParams] = useSearchParams();
  const [page, setPage] = usePageParam();
  const filters = Object.fromEntries(FILTER_KEYS.map((k) => [k, params.get(k) ?? ''])) as LinesFilterValues;
  const state = filters.state;
  // a filter change starts again from page 1
  const setFilters = (patch: Partial<LinesFilterValues>) =>
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        for (const [k, v] of Object.entries(patch))
          if (v) next.set(k, v);
          else next.delete(k);
        next.delete('page');
        return next;
      },
      { replace: true },
    );
  const setState = (s: string) => setFilters({ state: s });
  const summary = useSummary();
  const lines = useLines({
    page,
    state: (LINE_STATES as readonly string[]).includes(state) ? (state as LineState) : undefined,
    paidFrom: dayEdge(filters.from, 'start'),
    paidTo: dayEdge(filters.to, 'end'),
    material: filters.material || undefined,
    listing: filters.listing || undefined,
  });
  const approve = useApproveProofs();
  const build = useBuildCutSheets();
  const toast = useToast();
  const navigate = useNavigate();

  return (
    <div className="flex min-w-0 max-w-full flex-col gap-8">
      <StateCounts summary={summary.data} active={state} onPick={setState} />
      {lines.isPending ? (
        <Spinner label="Loading orders…" />
      ) : lines.isError && !lines.data ? (
        <p role="alert" className="font-bold text-danger">
          {lines.error.message}
        </p>
      ) : (
        <div className={`flex min-w-0 max-w-full flex-col gap-4 ${lines.isPlaceholderData ? 'opacity-60 transition-opacity' : ''}`}>
          {lines.isError ? (
            <p role="alert" className="font-bold text-danger">
              {lines.error.message}
            </p>
          ) : null}
          <LinesTable
            shipBy={shipBy}
            lines={lines.data.items}
            total={lines.data.total}
            filters={filters}
            onFiltersChange={setFilters}
            options={lines.data.options}
            actions={(selected, clear) => {
              const proofs = selected.filter((l) => l.state === 'awaiting_proof');
              const approved = selected.filter((l) => l.state === 'approved');
              return (
                <>
                  <Button
                    variant="secondary"
                    disabled={proofs.length === 0}
                    pending={approve.isPending}
                    onClick={async () => {
                      try {
                        await approve.mutateAsync(proofs.map((l) => l.id));
                        toast.success(`${proofs.length} proof${proofs.length === 1 ? '' : 's'} approved.`);
                        clear();
                      } catch (e) {
                        toast.error(isApiError(e) ? e.message : 'That did not work.');
                      }
                    }}
                  >
                    Approve {proofs.length || ''} selected proof{proofs.length === 1 ? '' : 's'}
                  </Button>
                  <Button
                    disabled={approved.length === 0}
                    pending={build.isPending}
                    onClick={async () => {
                      try {
                        const r = await build.mutateAsync(approved.map((l) => l.id));
                        navigate(paths.workroomCutSheets.getHref(r.batchId));
                      } catch (e) {
                        toast.error(isApiError(e) ? e.message : 'That did not work.');
                      }
                    }}
                  >
                    Build cut sheets from {approved.length || ''} approved
                  </Button>
                  <p className="basis-full text-sm text-ink-soft" data-testid="bulk-hint">
                    {bulkHint(selected.length, proofs.length, approved.length)}
                  </p>
                </>
              );
            }}
          />
          <Pager page={page} total={lines.data.total} limit={lines.data.limit} label="Order line pages" noun="lines" onPageChange={setPage} />
        </div>
      )}
    </div>
  );
}

/** Why the bulk buttons are (partly) greyed out: what the ticked lines would need. */
function bulkHint(selected: number, proofs: number, approved: number): string {
  if (selected === 0) return 'Tick lines in the table to approve their proofs or build cut sheets from them.';
  if (proofs === 0 && approved === 0) return 'None of the ticked lines waits for a proof check or is approved and ready to cut.';
  if (proofs === 0) return 'Approving needs lines that wait for a proof check; none of the ticked ones does.';
  if (approved === 0) return 'Cut sheets are built from approved lines; none of the ticked ones is approved yet.';
  return `${selected} ticked: ${proofs} to approve, ${approved} ready to cut.`;
}
