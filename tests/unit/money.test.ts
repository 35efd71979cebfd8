import { describe, expect, it } from 'vitest';
import { formatMoney, minorUnitDigits } from '../../shared/money.ts';

// ISO 4217 minor units (USD, EUR, GBP: 2; JPY: 0), checked against Intl.NumberFormat itself.
describe('money in minor units', () => {
  it.each([
    ['USD', 1234, 2],
    ['EUR', 1234, 2],
    ['GBP', 1234, 2],
    ['JPY', 1234, 0],
  ])('%s: %i minor units', (currency, minor, digits) => {
    expect(minorUnitDigits(currency)).toBe(digits);
    expect(formatMoney(minor, currency)).toBe(new Intl.NumberFormat('en', { style: 'currency', currency }).format(minor / 10 ** digits));
  });

  it('formats the usual cases as people read them', () => {
    expect(formatMoney(4900, 'USD')).toBe('$49.00');
    expect(formatMoney(3500, 'GBP')).toBe('£35.00');
    expect(formatMoney(1234, 'JPY')).toBe('¥1,234');
    expect(formatMoney(1999, 'EUR', 'de-DE')).toBe('19,99\u00a0€'); // CLDR puts a no-break space before the sign
  });
});
