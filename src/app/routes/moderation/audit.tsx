import { useSearchParams } from 'react-router-dom';
import { AUDIT_ACTIONS } from '../../../../shared/schemas/catalog.ts';
import { Spinner } from '../../../components/ui/button.tsx';
import { PageHeading, StitchedBox } from '../../../components/ui/card.tsx';
import { Pager, usePageParam } from '../../../components/ui/pager.tsx';
import { useAuditLog } from '../../../features/moderation/api/get-audit-log.ts';
import { AuditTable } from '../../../features/moderation/components/audit-table.tsx';

export function AuditLogPage() {
  const [page, setPage] = usePageParam();
  const [params, setParams] = useSearchParams();
  const raw = params.get('action') ?? '';
  const action = raw in AUDIT_ACTIONS ? raw : '';
  const audit = useAuditLog({ page, action: action || undefined });
  const setAction = (next: string) =>
    setParams(
      (prev) => {
        const p = new URLSearchParams(prev);
        if (next) p.set('action', next);
        else p.delete('action');
        p.delete('page');
        return p;
      },
      { replace: true },
    );

  return (
    <div>
      <PageHeading eyebrow="Moderation desk" title="Audit log" lead="Every decision on a shop or listing: who made it, when, and the reason given." />
      <div className="mb-4 flex max-w-xs flex-col gap-1.5">
        <label htmlFor="audit-action" className="font-bold">
          Action
        </label>
        <select id="audit-action" className="min-h-11 rounded-lg border-2 border-field bg-white px-3 py-2" value={action} onChange={(e) => setAction(e.target.value)}>
          <option value="">Every action</option>
          {Object.entries(AUDIT_ACTIONS).map(([k, label]) => (
            <option key={k} value={k}>
              {label}
            </option>
          ))}
        </select>
      </div>
      {audit.isPending ? <Spinner label="Loading…" /> : null}
      {audit.isError ? (
        <p role="alert" className="text-danger">
          {audit.error.message}
        </p>
      ) : null}
      {audit.data && audit.data.total === 0 ? (
        <StitchedBox>
          <p>{action ? 'No decisions of this kind yet.' : 'No decisions yet.'}</p>
        </StitchedBox>
      ) : null}
      {audit.data && audit.data.total > 0 ? (
        <>
          <AuditTable items={audit.data.items} />
          <Pager className="mt-4" page={page} total={audit.data.total} limit={audit.data.limit} label="Audit log pages" noun="entries" onPageChange={setPage} />
        </>
      ) : null}
    </div>
  );
}

export default AuditLogPage;
