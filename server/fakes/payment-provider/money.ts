const CURRENCY_FORMATS = new Map<string, Intl.NumberFormat>();

/** "€290.00" from 29000 minor units of "eur" (two-decimal currencies, ISO 4217). */
export function formatMoney(amountMinor: number, currency: string): string {
  const code = currency.toUpperCase();
  let format = CURRENCY_FORMATS.get(code);
  if (!format) {
    format = new Intl.NumberFormat('en-GB', { style: 'currency', currency: code });
    CURRENCY_FORMATS.set(code, format);
  }
  return format.format(amountMinor / 100);
}
