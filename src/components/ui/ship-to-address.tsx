import { type ShipTo, shipToLines } from '../../../shared/schemas/checkout.ts';

/** A parcel address, one line per row, as it is written on the parcel. */
export function ShipToAddress({ shipTo, label }: { shipTo: ShipTo | null; label: string }) {
  if (!shipTo) return <p className="text-sm text-ink-soft">No address was given with this order.</p>;
  return (
    <address aria-label={label} data-testid="ship-to" className="text-sm not-italic leading-relaxed">
      {shipToLines(shipTo).map((l, i) => (
        // biome-ignore lint/suspicious/noArrayIndexKey: the lines of one read-only address in a fixed order; two lines may read the same, so the place is the identity
        <span key={i} className="block">
          {l}
        </span>
      ))}
    </address>
  );
}
