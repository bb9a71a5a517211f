// Amounts come from the API in minor units of an ISO 4217 currency (cents for EUR).

/** Digits after the decimal point of a currency, as Intl knows them (EUR: 2; JPY: 0). */
function minorDigits(currency: string): number {
  return new Intl.NumberFormat('en', { style: 'currency', currency: currency.toUpperCase() }).resolvedOptions().maximumFractionDigits ?? 2;
}

/** "€290.00" from 29000 and "eur"; whole amounts keep their decimals so prices line up in a list. */
export function formatMoney(amountMinor: number, currency: string, locale?: string): string {
  const code = currency.toUpperCase();
  const value = amountMinor / 10 ** minorDigits(code);
  return new Intl.NumberFormat(locale, { style: 'currency', currency: code }).format(value);
}
