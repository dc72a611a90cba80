import { Spinner } from '../../../components/ui/button.tsx';
import { PageHeading } from '../../../components/ui/card.tsx';
import { Pager, usePageParam } from '../../../components/ui/pager.tsx';
import { useStock } from '../../../features/workroom/api/get-stock.ts';
import { StockTable } from '../../../features/workroom/components/stock-table.tsx';

export function StockPage() {
  const [page, setPage] = usePageParam();
  const stock = useStock({ page });
  return (
    <div>
      <PageHeading eyebrow="Workroom" title="Stock" lead="Vinyl left on each roll. Cutting a sheet takes its length plus the trim; you are warned when a roll runs low." />
      {stock.isPending ? (
        <Spinner label="Loading stock…" />
      ) : stock.isError ? (
        <p role="alert" className="font-bold text-danger">
          {stock.error.message}
        </p>
      ) : (
        <StockTable
          stock={stock.data}
          sheetsPager={<Pager className="mt-4" page={page} total={stock.data.sheets.total} limit={stock.data.sheets.limit} label="Cut sheet pages" noun="cut sheets" onPageChange={setPage} />}
        />
      )}
    </div>
  );
}
