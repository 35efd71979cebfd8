import { describe, expect, it } from 'vitest';
import { trackingUrl } from '#shared/orders/tracking.ts';

describe('tracking links', () => {
  // From memory of the carriers' public tracking pages (no source checked here).
  it('links a known carrier’s parcel to its page and gives none for a carrier it does not know', () => {
    expect(trackingUrl('Royal Mail', 'DM123456GB')).toBe('https://www.royalmail.com/track-your-item#/tracking-results/DM123456GB');
    expect(trackingUrl(' usps ', '9400 1000')).toBe('https://tools.usps.com/go/TrackConfirmAction?tLabels=9400%201000');
    expect(trackingUrl('Bicycle courier', 'X1')).toBeNull();
    expect(trackingUrl('UPS', null)).toBeNull();
  });
});
