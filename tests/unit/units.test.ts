import { describe, expect, it } from 'vitest';
import { formatBedSize, formatSize, mmToUnit, unitToMm } from '#shared/units.ts';

// 1 in = 25.4 mm exactly: the International Yard and Pound Agreement (1959).
describe('lengths in the studio’s unit', () => {
  it.each([
    [1, 25.4],
    [8, 203.2],
    [10, 254],
    [0.5, 12.7],
  ])('%d in is %d mm', (inches, mm) => {
    expect(unitToMm(inches, 'in')).toBeCloseTo(mm, 10);
    expect(mmToUnit(mm, 'in')).toBe(inches);
  });

  it('keeps millimetres as they are, to a tenth', () => {
    expect(unitToMm(210, 'mm')).toBe(210);
    expect(mmToUnit(177.8, 'mm')).toBe(177.8);
    expect(mmToUnit(101.66, 'mm')).toBe(101.7);
  });

  it('shows inches to the hundredth (0.254 mm)', () => {
    expect(mmToUnit(100, 'in')).toBe(3.94); // 100 / 25.4 = 3.937…
    expect(formatSize(203.2, 254, 'in')).toBe('8 × 10 in');
    expect(formatSize(210, 297, 'mm')).toBe('210 × 297 mm');
  });

  it('survives the round trip a form makes: shown in inches, stored in mm, shown again', () => {
    for (const inches of [4, 5.25, 7.5, 11.99]) expect(mmToUnit(unitToMm(inches, 'in'), 'in')).toBe(inches);
  });

  it('gives a machine bed as a person would type it (by hand: 900 mm = 35.43 in, 600 mm = 23.62 in)', () => {
    expect(formatBedSize(900, 600, 'in')).toBe('35.4 × 23.6 in');
    expect(formatBedSize(600, 400, 'mm')).toBe('600 × 400 mm');
    expect(formatBedSize(508, 304.8, 'in')).toBe('20 × 12 in');
  });
});
