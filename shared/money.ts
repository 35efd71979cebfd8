/**
 * Money is an integer count of the currency's minor unit (cents, pence; yen have none). The
 * number of decimals comes from Intl, which follows ISO 4217.
 */
export function minorUnitDigits(currency: string): number {
  return new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
}

export function formatMoney(minor: number, currency: string, locale = 'en'): string {
  return new Intl.NumberFormat(locale, { style: 'currency', currency }).format(minor / 10 ** minorUnitDigits(currency));
}
