// Display formatting only. Trade arithmetic (units, pricing) belongs to shared/domain; money is
// formatted by shared/domain/money.ts in the shop's currency (see shop-currency.ts).

const locale = 'en-US';

const wholeNumber = new Intl.NumberFormat(locale, { maximumFractionDigits: 0 });
const oneDecimal = new Intl.NumberFormat(locale, { minimumFractionDigits: 0, maximumFractionDigits: 1 });

/** 850 → "850 g"; 12_400 → "12.4 kg" */
export function formatGrams(grams: number): string {
  if (Math.abs(grams) < 1000) return `${wholeNumber.format(grams)} g`;
  return `${oneDecimal.format(grams / 1000)} kg`;
}

/** 1850 → "1,850 m" */
export function formatAltitude(metres: number): string {
  return `${wholeNumber.format(metres)} m`;
}

/** 10.8 → "10.8%" */
export function formatPercent(value: number): string {
  return `${oneDecimal.format(value)}%`;
}

/** 86.25 → "86.25"; 87 → "87" */
export function formatScore(score: number): string {
  return new Intl.NumberFormat(locale, { maximumFractionDigits: 2 }).format(score);
}
