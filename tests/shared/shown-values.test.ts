// The one way dates, materials and tracking links are shown (shared/dates.ts, material-label.ts, tracking.ts).
import { describe, expect, it } from 'vitest';
import { formatDate, formatDateTime } from '../../shared/dates.ts';
import { materialLabel } from '../../shared/material-label.ts';
import { trackingUrl } from '../../shared/tracking.ts';

describe('formatDate', () => {
  it('when given a calendar day, then it is that same day in the one style, whatever the time zone', () => {
    expect(formatDate('2026-12-02')).toBe('Dec 2, 2026');
    expect(formatDate('2026-01-31')).toBe('Jan 31, 2026');
  });

  it('when given an instant (ms or ISO), then day and time come in the same style', () => {
    const ms = new Date(2026, 10, 29, 16, 5).getTime(); // Nov 29, 2026 4:05 PM where the test runs
    expect(formatDate(ms)).toBe('Nov 29, 2026');
    expect(formatDateTime(ms)).toBe('Nov 29, 2026, 4:05 PM');
    expect(formatDate(new Date(ms).toISOString())).toBe('Nov 29, 2026');
  });

  it('when the text is not a date, then it is shown as it came', () => {
    expect(formatDate('soon')).toBe('soon');
  });
});

describe('materialLabel', () => {
  it('when the colour name already says its kind, then the kind is not said twice', () => {
    expect(materialLabel({ colourName: 'Pine flock', kind: 'flock' })).toBe('Pine flock');
    expect(materialLabel({ colourName: 'Marigold glitter', kind: 'glitter' })).toBe('Marigold glitter');
  });

  it('when it does not, then the kind follows in brackets', () => {
    expect(materialLabel({ colourName: 'Ink navy', kind: 'smooth' })).toBe('Ink navy (smooth)');
    // "Flocked" is not the word "flock"
    expect(materialLabel({ colourName: 'Flocked pine', kind: 'flock' })).toBe('Flocked pine (flock)');
  });
});

describe('trackingUrl', () => {
  it("when the carrier is one the ship form offers, then the carrier's own tracking page for that number", () => {
    expect(trackingUrl('UPS', '1Z999AA10123456784')).toBe('https://www.ups.com/track?tracknum=1Z999AA10123456784');
    expect(trackingUrl(' royal mail ', 'AB 1234 5678 GB')).toBe('https://www.royalmail.com/track-your-item#/tracking-results/AB12345678GB');
  });

  it('when the carrier is unknown or a part is missing, then no link', () => {
    expect(trackingUrl('Other', '12345')).toBeNull();
    expect(trackingUrl('Village courier', '12345')).toBeNull();
    expect(trackingUrl(null, '12345')).toBeNull();
  });
});
