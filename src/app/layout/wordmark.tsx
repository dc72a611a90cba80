/** "Namesake" set in heavy Nunito over a stitched thread line: our own simple type treatment. */
export function Wordmark() {
  return (
    <span className="relative inline-flex flex-col leading-none">
      <span className="text-2xl font-black tracking-tight text-ink">
        Name<span className="text-thread">sake</span>
      </span>
      <svg aria-hidden="true" viewBox="0 0 100 6" preserveAspectRatio="none" className="mt-1 h-1.5 w-full">
        <line x1="1" y1="3" x2="99" y2="3" stroke="var(--color-marigold)" strokeWidth="2.4" strokeDasharray="6 4" strokeLinecap="round" />
      </svg>
    </span>
  );
}
