/**
 * Where a carrier shows a parcel by its tracking number, for the carriers studios name most.
 * From memory of each carrier's public tracking page: the addresses are theirs and may move;
 * an unknown carrier simply gets no link.
 */
const TRACKING_PAGES: Array<[RegExp, (number: string) => string]> = [
  [/^royal\s*mail$/i, (n) => `https://www.royalmail.com/track-your-item#/tracking-results/${n}`],
  [/^usps$/i, (n) => `https://tools.usps.com/go/TrackConfirmAction?tLabels=${n}`],
  [/^ups$/i, (n) => `https://www.ups.com/track?tracknum=${n}`],
  [/^fedex$/i, (n) => `https://www.fedex.com/fedextrack/?trknbr=${n}`],
  [/^dhl(\s*express)?$/i, (n) => `https://www.dhl.com/global-en/home/tracking/tracking-express.html?submit=1&tracking-id=${n}`],
  [/^dpd$/i, (n) => `https://track.dpd.co.uk/parcels/${n}`],
  [/^evri$/i, (n) => `https://www.evri.com/track/parcel/${n}`],
];

/** The carrier's tracking page for this parcel, or null when the carrier is not one we know. */
export function trackingUrl(carrier: string | null, trackingNumber: string | null): string | null {
  if (!carrier || !trackingNumber) return null;
  const page = TRACKING_PAGES.find(([name]) => name.test(carrier.trim()));
  return page ? page[1](encodeURIComponent(trackingNumber.trim())) : null;
}
