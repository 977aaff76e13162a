/**
 * Money as integers in the currency's minor unit (cents for USD, yen for JPY), as Stripe takes
 * amounts (Stripe docs, Currencies: zero-decimal and three-decimal currencies). Each currency's
 * minor-unit digits are ISO 4217's, which Intl carries; the table below agrees with Intl (tested).
 *
 * Rounding rule, stated once for all of Restday: when an amount must be rounded to the minor
 * unit, round to the nearest unit, halves up (away from zero): `roundHalfUpDiv` in integer-math.ts.
 * Every other function here works on whole minor units and never rounds.
 *
 * - `currencies`, `currencyExponent(code)`: minor-unit exponent (usd 2, jpy 0, kwd 3).
 * - `toMinorUnits(text, currency)`: "12.34" → 1234; refuses more decimals than the currency has.
 * - `formatMoney(minor, currency, locale?)`: the one money formatter of the client and the e-mails:
 *   1234 usd → "$12.34", 1500 jpy → "¥1,500", 1500 kwd → "KWD 1.500".
 * - `percentOf(amount, pct)`: a percentage of an amount, rounded by the rule above.
 * - `sumMinor(amounts)`: a checked sum (every term and the total safe integers).
 */
import { roundHalfUpDiv, toHundredths } from './integer-math';
import type { ParseResult } from './units';

/** Lower-case ISO 4217 codes, as Stripe's API spells them, with their minor-unit exponent. */
export const currencyExponents = {
  usd: 2,
  cad: 2,
  eur: 2,
  gbp: 2,
  aud: 2,
  nzd: 2,
  chf: 2,
  jpy: 0,
  krw: 0,
  vnd: 0,
  clp: 0,
  bhd: 3,
  jod: 3,
  kwd: 3,
  omr: 3,
  tnd: 3,
} as const satisfies Record<string, 0 | 2 | 3>;
export type CurrencyCode = keyof typeof currencyExponents;
export const currencies = Object.keys(currencyExponents) as CurrencyCode[];

/**
 * Currencies a shop may sell in: two- and zero-decimal ones. Stripe takes three-decimal amounts
 * only in whole tens of the minor unit (Stripe docs, Currencies: three-decimal currencies), which
 * Restday's percentages and bag prices do not round to, so those are known for reading but not offered.
 */
export const shopCurrencies = currencies.filter((code) => currencyExponents[code] !== 3);

export function isCurrencyCode(code: string): code is CurrencyCode {
  return Object.hasOwn(currencyExponents, code);
}

export function currencyExponent(currency: CurrencyCode): number {
  return currencyExponents[currency];
}

function assertMinor(amount: number): void {
  if (!Number.isSafeInteger(amount)) throw new RangeError(`money must be whole minor units, got ${amount}`);
}

const AMOUNT_PATTERN = /^-?\d+(\.\d+)?$/;

export function toMinorUnits(text: string, currency: CurrencyCode): ParseResult<number> {
  const trimmed = text.trim().replaceAll(',', '');
  const exponent = currencyExponent(currency);
  if (!AMOUNT_PATTERN.test(trimmed)) return { ok: false, message: `"${text}" is not an amount, e.g. "12.50".` };
  if ((trimmed.split('.')[1]?.length ?? 0) > exponent) {
    return {
      ok: false,
      message:
        exponent === 0
          ? `${currency.toUpperCase()} has no minor unit; enter a whole amount.`
          : `${currency.toUpperCase()} amounts have at most ${exponent} decimals.`,
    };
  }
  const [whole = '0', fraction = ''] = trimmed.split('.');
  // Built from the digits as written, so no float ever touches the amount.
  const minor = Number(BigInt(`${whole}${fraction.padEnd(exponent, '0')}`));
  if (!Number.isSafeInteger(minor)) return { ok: false, message: 'That amount is too large.' };
  return { ok: true, value: minor };
}

const moneyFormats = new Map<string, Intl.NumberFormat>();

function moneyFormat(currency: string, locale: string): Intl.NumberFormat {
  const key = `${locale}|${currency}`;
  let format = moneyFormats.get(key);
  if (!format) {
    format = new Intl.NumberFormat(locale, { style: 'currency', currency: currency.toUpperCase() });
    moneyFormats.set(key, format);
  }
  return format;
}

/** A currency's minor-unit digits as ISO 4217 sets them (JPY 0, USD 2, KWD 3), read from Intl. */
export function minorUnitDigits(currency: string): number {
  return moneyFormat(currency, 'en-US').resolvedOptions().maximumFractionDigits ?? 2;
}

/** `amount` minor units of `currency` (an ISO 4217 code, either case) as people read money. */
export function formatMoney(amount: number, currency: string, locale = 'en-US'): string {
  assertMinor(amount);
  return moneyFormat(currency, locale).format(amount / 10 ** minorUnitDigits(currency));
}

/** `pct` % of `amount` (pct with up to two decimals), rounded half-up to a whole minor unit. */
export function percentOf(amount: number, pct: number): number {
  assertMinor(amount);
  return roundHalfUpDiv(BigInt(amount) * BigInt(toHundredths(pct)), 10_000);
}

export function sumMinor(amounts: readonly number[]): number {
  let total = 0;
  for (const amount of amounts) {
    assertMinor(amount);
    total += amount;
  }
  assertMinor(total);
  return total;
}
