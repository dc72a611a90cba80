import { useNavigate, useSearchParams } from 'react-router-dom';
import { Button, Spinner } from '../../../components/ui/button.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { paths } from '../../../config/paths.ts';
import { isApiError } from '../../../lib/api-client.ts';
import { useApproveProofs } from '../api/approve-proofs.ts';
import { useBuildCutSheets } from '../api/build-cut-sheets.ts';
import { useLines } from '../api/get-lines.ts';
import { useSummary } from '../api/get-summary.ts';
import { LinesTable } from './lines-table.tsx';
import { StateCounts } from './state-counts.tsx';

/** The workroom home: counts per state, the filterable table, and the bulk actions. */
export function WorkroomOrders() {
  const [params, setParams] = useSearchParams();
  const state = params.get('state') ?? '';
  const setState = (s: string) => setParams(s ? { state: s } : {}, { replace: true });
  const summary = useSummary();
  const lines = useLines();
  const approve = useApproveProofs();
  const build = useBuildCutSheets();
  const toast = useToast();
  const navigate = useNavigate();

  return (
    <div className="flex min-w-0 max-w-full flex-col gap-8">
      <StateCounts summary={summary.data} active={state} onPick={setState} />
      {lines.isPending ? (
        <Spinner label="Loading orders…" />
      ) : lines.isError ? (
        <p role="alert" className="font-bold text-danger">{lines.error.message}</p>
      ) : (
        <LinesTable
          lines={lines.data}
          state={state}
          onStateChange={setState}
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
              </>
            );
          }}
        />
      )}
    </div>
  );
}
