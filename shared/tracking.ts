/**
 * Where a parcel can be followed: the carrier's own public tracking page for a tracking number, for
 * the carriers the ship form offers (CARRIERS in schemas/workroom.ts). A carrier typed by hand that
 * is not one of them ("Other", a local courier) has no known page: null, and the number is shown as text.
 */
const TRACKING_PAGES: Readonly<Record<string, (n: string) => string>> = {
  'royal mail': (n) => `https://www.royalmail.com/track-your-item#/tracking-results/${n}`,
  usps: (n) => `https://tools.usps.com/go/TrackConfirmAction?tLabels=${n}`,
  ups: (n) => `https://www.ups.com/track?tracknum=${n}`,
  fedex: (n) => `https://www.fedex.com/fedextrack/?trknbr=${n}`,
  dhl: (n) => `https://www.dhl.com/global-en/home/tracking/tracking-express.html?submit=1&tracking-id=${n}`,
  'canada post': (n) => `https://www.canadapost-postescanada.ca/track-reperez/en#/search?searchFor=${n}`,
};

export function trackingUrl(carrier: string | null | undefined, trackingNumber: string | null | undefined): string | null {
  if (!carrier || !trackingNumber) return null;
  const page = TRACKING_PAGES[carrier.trim().toLowerCase()];
  return page ? page(encodeURIComponent(trackingNumber.replace(/\s+/g, ''))) : null;
}
