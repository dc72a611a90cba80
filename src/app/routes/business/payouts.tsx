import { PageHeading } from '../../../components/ui/card.tsx';
import { LedgerTable } from '../../../features/business/components/ledger-table.tsx';

export function PayoutsPage() {
  return (
    <div>
      <PageHeading eyebrow="Workroom" title="Payouts" lead="Every charge, fee, transfer and refund of your shop. Earned is what you keep; paid out is what reached your account." />
      <LedgerTable />
    </div>
  );
}

export default PayoutsPage;
