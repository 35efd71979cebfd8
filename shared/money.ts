/**
 * Money is an integer count of the currency's minor unit (cents, pence; yen have none). The
 * number of decimals comes from Intl, which follows ISO 4217.
 */
export function minorUnitDigits(currency: string): number {
  return currencyFormat('en', currency).resolvedOptions().maximumFractionDigits ?? 2;
}

export function formatMoney(minor: number, currency: string, locale = 'en'): string {
  return currencyFormat(locale, currency).format(minor / 10 ** minorUnitDigits(currency));
}

/** Making a formatter costs far more than using one (a catalog page formats dozens of prices). */
const formats = new Map<string, Intl.NumberFormat>();
function currencyFormat(locale: string, currency: string): Intl.NumberFormat {
  const key = `${locale} ${currency}`;
  let format = formats.get(key);
  if (!format) {
    // Made before it is kept: an unknown code throws here, as it always has, and is not cached.
    format = new Intl.NumberFormat(locale, { style: 'currency', currency });
    formats.set(key, format);
  }
  return format;
}

/**
 * A price as typed in a form ("49", "49.5", "49,50") → minor units; undefined when it is not one.
 * A comma is read as the decimal mark, and thousands separators are refused rather than guessed.
 */
export function parseMoneyInput(text: string, currency: string): number | undefined {
  const digits = minorUnitDigits(currency);
  const trimmed = text.trim().replace(',', '.');
  const pattern = digits === 0 ? /^\d+$/ : new RegExp(`^\\d+(\\.\\d{1,${digits}})?$`);
  if (!pattern.test(trimmed)) return undefined;
  const [whole, fraction = ''] = trimmed.split('.');
  return Number(whole) * 10 ** digits + Number(fraction.padEnd(digits, '0') || 0);
}

/** Minor units → the plain number a price field shows ("49.00", "1234"). */
export function moneyInputValue(minor: number, currency: string): string {
  const digits = minorUnitDigits(currency);
  return (minor / 10 ** digits).toFixed(digits);
}
