import { describe, expect, it } from 'vitest';
import { formatMoney, minorUnitDigits, moneyInputValue, parseMoneyInput } from '#shared/money.ts';

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

describe('prices typed into a form', () => {
  it.each([
    ['49', 'USD', 4900],
    ['49.5', 'USD', 4950],
    ['49,50', 'EUR', 4950],
    ['0.07', 'GBP', 7],
    ['1234', 'JPY', 1234],
  ])('%s %s is %i minor units', (text, currency, minor) => {
    expect(parseMoneyInput(text, currency)).toBe(minor);
    // And back: the field shows what formatMoney's number part would (ISO 4217 digits via Intl).
    expect(Number(moneyInputValue(minor, currency))).toBe(minor / 10 ** minorUnitDigits(currency));
  });

  it.each([
    ['12.345', 'USD'],
    ['1,234.00', 'USD'],
    ['12.5', 'JPY'],
    ['-3', 'USD'],
    ['', 'USD'],
    ['abc', 'GBP'],
  ])('refuses %j in %s', (text, currency) => {
    expect(parseMoneyInput(text, currency)).toBeUndefined();
  });
});
