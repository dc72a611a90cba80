import { Pager, usePageParam } from '../../../components/ui/pager.tsx';
import { QueryPage } from '../../../components/ui/query-boundary.tsx';
import { useStock } from '../../../features/workroom/api/get-stock.ts';
import { StockTable } from '../../../features/workroom/components/stock-table.tsx';

export function StockPage() {
  const [page, setPage] = usePageParam();
  const stock = useStock({ page });
  return (
    <QueryPage
      eyebrow="Workroom"
      title="Stock"
      lead="Vinyl left on each roll. Cutting a sheet takes its length plus the trim; you are warned when a roll runs low."
      query={stock}
      loading="Loading stock…"
    >
      {(data) => (
        <StockTable
          stock={data}
          sheetsPager={<Pager className="mt-4" page={page} total={data.sheets.total} limit={data.sheets.limit} label="Cut sheet pages" noun="cut sheets" onPageChange={setPage} />}
        />
      )}
    </QueryPage>
  );
}
