import { trackingUrl } from '../../../shared/tracking.ts';

/** A tracking number: a link to the carrier's tracking page when the carrier is one we know, else text. */
export function TrackingNumber({ carrier, trackingNumber }: { carrier: string | null; trackingNumber: string }) {
  const href = trackingUrl(carrier, trackingNumber);
  const number = <span className="font-mono font-bold">{trackingNumber}</span>;
  if (!href) return number;
  return (
    <a href={href} target="_blank" rel="noopener noreferrer" className="text-thread-deep underline decoration-thread/50 hover:decoration-thread">
      {number}
      <span className="sr-only"> (track the parcel on the carrier's site, opens in a new tab)</span>
    </a>
  );
}
