/** Links to a line's 1:1 placement template (a PDF to print at actual size and lay on the blank). */
export function PlacementTemplateLinks({ lineId }: { lineId: string }) {
  const href = (paper: 'A4' | 'Letter') => `/api/workroom/lines/${encodeURIComponent(lineId)}/template?paper=${paper}`;
  return (
    <p className="text-sm" data-testid="placement-template">
      <span className="text-ink-soft">1:1 placement template: </span>
      <a className="font-bold text-thread-deep underline decoration-2" href={href('A4')} target="_blank" rel="noopener">
        A4
      </a>
      {' · '}
      <a className="font-bold text-thread-deep underline decoration-2" href={href('Letter')} target="_blank" rel="noopener">
        Letter
      </a>
    </p>
  );
}
