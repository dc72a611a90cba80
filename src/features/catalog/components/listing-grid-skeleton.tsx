/** Grey cards while a grid loads (announced once, not per card). */
export function ListingGridSkeleton({ count = 4 }: { count?: number }) {
  return (
    <div role="status" aria-label="Loading listings">
      <ul className="grid grid-cols-1 gap-5 min-[480px]:grid-cols-2 lg:grid-cols-3 xl:grid-cols-4" aria-hidden="true">
        {Array.from({ length: count }, (_, i) => (
          // biome-ignore lint/suspicious/noArrayIndexKey: identical placeholder cards with no data behind them; the place is all that tells them apart
          <li key={i} className="h-72 animate-pulse rounded-lg border border-line bg-paper-deep/70" />
        ))}
      </ul>
    </div>
  );
}
