import type { StockWarning, WorkSheet } from '../../../../shared/schemas/workroom.ts';
import { Button } from '../../../components/ui/button.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { useMarkCut } from '../api/mark-cut.ts';
import { formatLength, percent } from './format.ts';

export function stockWarningsText(ws: StockWarning[]) {
  return ws.map((w) => w.message).join(' ');
}

/** One material's nested sheet: a picture of the cut file, its numbers, downloads and "mark cut". */
export function CutSheetCard({ sheet, index }: { sheet: WorkSheet; index: number }) {
  const toast = useToast();
  const markCut = useMarkCut();
  const orders = [...new Set(sheet.pieces.map((p) => p.orderNumber))];
  const onCut = async () => {
    try {
      const r = await markCut.mutateAsync({ sheetId: sheet.id });
      toast.success(`Marked cut. ${r.linesCut.length ? `${r.linesCut.length} line${r.linesCut.length === 1 ? ' is' : 's are'} now cut.` : 'Lines move to cut once all their sheets are cut.'}`);
      if (r.warnings.length) toast.error(stockWarningsText(r.warnings));
    } catch (e) {
      toast.error(isApiError(e) ? e.message : 'That did not work. Please try again.');
    }
  };
  return (
    <article className="flex flex-col gap-3 rounded-lg border border-line bg-white p-5 shadow-sm" data-testid="cut-sheet" aria-labelledby={`sheet-${sheet.id}`}>
      <header className="flex flex-wrap items-center justify-between gap-2">
        <h3 id={`sheet-${sheet.id}`} className="flex items-center gap-2 text-lg font-extrabold">
          <span aria-hidden="true" className="size-4 rounded-full border border-ink/30" style={{ background: sheet.material.colourHex }} />
          Sheet {index + 1}: {sheet.material.colour} ({sheet.material.kind})
        </h3>
        <span className={`rounded-full px-2.5 py-0.5 text-sm font-bold ${sheet.state === 'cut' ? 'bg-thread text-white' : 'bg-marigold-wash text-ink'}`}>{sheet.state}</span>
      </header>
      <div className="max-h-80 overflow-auto rounded border border-dashed border-thread/50 bg-paper p-2">
        <img src={sheet.svgUrl} alt={`Cut file for ${sheet.material.colour}, mirrored: ${sheet.pieces.length} pieces`} className="mx-auto h-auto w-full max-w-sm" />
      </div>
      <dl className="grid grid-cols-2 gap-x-3 gap-y-1 text-sm">
        <dt className="text-ink-soft">Roll width</dt>
        <dd className="font-semibold">{formatLength(sheet.rollWidthMm)}</dd>
        <dt className="text-ink-soft">Length used</dt>
        <dd className="font-semibold">{formatLength(sheet.lengthMm)} + 25 mm trim</dd>
        {sheet.grouping === 'order' ? (
          <>
            <dt className="text-ink-soft">Order groups</dt>
            <dd className="font-semibold">
              {sheet.groups.length} bordered; {sheet.extraLengthMm > 0 ? `+${formatLength(sheet.extraLengthMm)}` : 'no extra'} against tightest
            </dd>
          </>
        ) : null}
        <dt className="text-ink-soft">Utilisation</dt>
        <dd className="font-semibold">{percent(sheet.utilisation)}</dd>
        <dt className="text-ink-soft">Pieces</dt>
        <dd className="font-semibold">
          {sheet.pieces.length} from {orders.join(', ')}
        </dd>
        <dt className="text-ink-soft">Stock</dt>
        <dd className={`font-semibold ${sheet.stock.short ? 'text-danger' : ''}`}>
          {sheet.state === 'cut' ? `took ${formatLength(sheet.consumedMm ?? 0)}` : `${formatLength(sheet.stock.stockMm)} → ${formatLength(Math.max(0, sheet.stock.afterMm))}`}
          {sheet.state !== 'cut' && sheet.stock.short ? ' — not enough on the roll' : sheet.state !== 'cut' && sheet.stock.low ? ' — low after this' : ''}
        </dd>
      </dl>
      <div className="flex flex-wrap gap-2">
        <a className="inline-flex min-h-11 items-center rounded-lg border-2 border-thread px-4 font-bold text-thread-deep hover:bg-thread-wash" href={`${sheet.svgUrl}?download`} download>
          Download SVG
        </a>
        {sheet.state !== 'cut' ? (
          <Button variant="secondary" onClick={onCut} pending={markCut.isPending} pendingLabel="Saving…">
            Mark this sheet cut
          </Button>
        ) : null}
      </div>
    </article>
  );
}
