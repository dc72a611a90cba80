import { useSearchParams } from 'react-router-dom';
import { Button, Spinner } from '../../../components/ui/button.tsx';
import { PageHeading, StitchedBox } from '../../../components/ui/card.tsx';
import { useAuditLog } from '../../../features/moderation/api/get-audit-log.ts';
import { AuditTable } from '../../../features/moderation/components/audit-table.tsx';
import { DeskNav } from './desk-nav.tsx';

export function AuditLogPage() {
  const [params, setParams] = useSearchParams();
  const page = Math.max(1, Number(params.get('page')) || 1);
  const audit = useAuditLog(page);
  const pages = audit.data ? Math.max(1, Math.ceil(audit.data.total / audit.data.pageSize)) : 1;
  const go = (p: number) => setParams(p > 1 ? { page: String(p) } : {});

  return (
    <div>
      <DeskNav />
      <PageHeading eyebrow="Moderation desk" title="Audit log" lead="Every decision on a shop or listing: who made it, when, and the reason given." />
      {audit.isPending ? <Spinner label="Loading…" /> : null}
      {audit.isError ? <p role="alert" className="text-danger">{audit.error.message}</p> : null}
      {audit.data && audit.data.items.length === 0 ? (
        <StitchedBox>
          <p>No decisions yet.</p>
        </StitchedBox>
      ) : null}
      {audit.data && audit.data.items.length > 0 ? (
        <>
          <AuditTable items={audit.data.items} />
          <nav aria-label="Audit log pages" className="mt-4 flex flex-wrap items-center gap-3">
            <Button variant="secondary" disabled={page <= 1} onClick={() => go(page - 1)}>
              Newer
            </Button>
            <span>
              Page {page} of {pages} · {audit.data.total} entries
            </span>
            <Button variant="secondary" disabled={page >= pages} onClick={() => go(page + 1)}>
              Older
            </Button>
          </nav>
        </>
      ) : null}
    </div>
  );
}

export default AuditLogPage;
