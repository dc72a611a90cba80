import { Spinner } from '../../../components/ui/button.tsx';
import { PageHeading, StitchedBox } from '../../../components/ui/card.tsx';
import { Pager, usePageParam } from '../../../components/ui/pager.tsx';
import { useAuditLog } from '../../../features/moderation/api/get-audit-log.ts';
import { AuditTable } from '../../../features/moderation/components/audit-table.tsx';

export function AuditLogPage() {
  const [page, setPage] = usePageParam();
  const audit = useAuditLog({ page });

  return (
    <div>
      <PageHeading eyebrow="Moderation desk" title="Audit log" lead="Every decision on a shop or listing: who made it, when, and the reason given." />
      {audit.isPending ? <Spinner label="Loading…" /> : null}
      {audit.isError ? (
        <p role="alert" className="text-danger">
          {audit.error.message}
        </p>
      ) : null}
      {audit.data && audit.data.total === 0 ? (
        <StitchedBox>
          <p>No decisions yet.</p>
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
