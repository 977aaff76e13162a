import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { currencies, currencyExponent, shopCurrencies, formatMoney, isCurrencyCode, minorUnitDigits, percentOf, sumMinor, toMinorUnits } from './money';

describe('currencies and their minor units', () => {
  it('offers shops only currencies with zero or two decimals (Stripe takes three-decimal amounts in tens only: Stripe docs, Currencies)', () => {
    expect(shopCurrencies).toEqual(expect.arrayContaining(['usd', 'eur', 'jpy']));
    expect(shopCurrencies).not.toContain('kwd');
    for (const currency of shopCurrencies) expect([0, 2]).toContain(currencyExponent(currency));
  });

  it('knows two-, zero- and three-decimal currencies', () => {
    expect(currencyExponent('usd')).toBe(2); // Stripe docs, Currencies
    expect(currencyExponent('jpy')).toBe(0); // Stripe docs, Currencies: zero-decimal
    expect(currencyExponent('krw')).toBe(0); // Stripe docs, Currencies: zero-decimal
    expect(currencyExponent('vnd')).toBe(0); // Stripe docs, Currencies: zero-decimal
    expect(currencyExponent('clp')).toBe(0); // Stripe docs, Currencies: zero-decimal
    expect(currencyExponent('kwd')).toBe(3); // Stripe docs, Currencies: three-decimal (from memory)
    expect(currencies).toContain('eur');
    expect(isCurrencyCode('usd')).toBe(true);
    expect(isCurrencyCode('xyz')).toBe(false);
    expect(isCurrencyCode('constructor')).toBe(false);
  });

  it('holds the same minor-unit digits as ISO 4217, which Intl carries', () => {
    for (const currency of currencies) expect(currencyExponent(currency), currency).toBe(minorUnitDigits(currency));
  });

  it('reads typed amounts into minor units without float error', () => {
    expect(toMinorUnits('12.34', 'usd')).toEqual({ ok: true, value: 1234 });
    expect(toMinorUnits('0.29', 'usd')).toEqual({ ok: true, value: 29 }); // 0.29 × 100 = 28.999… in floating point
    expect(toMinorUnits('1,000', 'jpy')).toEqual({ ok: true, value: 1000 }); // Stripe: ¥1,000 is amount 1000
    expect(toMinorUnits('1.234', 'kwd')).toEqual({ ok: true, value: 1234 });
    expect(toMinorUnits('-5.5', 'usd')).toEqual({ ok: true, value: -550 });
    expect(toMinorUnits('12.5', 'jpy')).toMatchObject({ ok: false, message: expect.stringMatching(/no minor unit/) });
    expect(toMinorUnits('12.345', 'usd')).toMatchObject({ ok: false, message: expect.stringMatching(/at most 2 decimals/) });
    expect(toMinorUnits('twelve', 'usd')).toMatchObject({ ok: false });
    expect(toMinorUnits('99999999999999999999', 'usd')).toMatchObject({ ok: false, message: expect.stringMatching(/too large/) });
  });

  it('formats minor units in the currency', () => {
    expect(formatMoney(1234, 'usd')).toBe('$12.34');
    expect(formatMoney(1000, 'jpy')).toBe('¥1,000');
    expect(formatMoney(1234, 'kwd')).toMatch(/1\.234/);
    // Intl (en-US) with ISO 4217's minor units: yen have none, Kuwaiti dinars three, dollars two.
    expect(formatMoney(1500, 'jpy')).toBe('¥1,500');
    expect(formatMoney(1500, 'kwd')).toBe('KWD\u00a01.500');
    expect(formatMoney(1500, 'USD')).toBe('$15.00');
    expect(() => formatMoney(12.5, 'usd')).toThrow(RangeError);
  });

  it('round-trips every amount through text', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000 }), fc.constantFrom(...currencies), (minor, currency) => {
        const exponent = currencyExponent(currency);
        const text = exponent === 0 ? String(minor) : `${Math.floor(minor / 10 ** exponent)}.${String(minor % 10 ** exponent).padStart(exponent, '0')}`;
        expect(toMinorUnits(text, currency)).toEqual({ ok: true, value: minor });
      }),
    );
  });
});

describe('the rounding rule: half-up to a whole minor unit', () => {
  it('rounds a half cent up', () => {
    expect(percentOf(1005, 10)).toBe(101); // 100.5 → 101
    expect(percentOf(1004, 10)).toBe(100); // 100.4 → 100
    expect(percentOf(1999, 12.5)).toBe(250); // 249.875 → 250
  });

  it('is within half a unit of the exact value, halves going up', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 100_000_000 }), fc.integer({ min: 0, max: 10_000 }), (amount, hundredths) => {
        const exactTimes10000 = amount * hundredths; // exact value × 10,000
        const rounded = percentOf(amount, hundredths / 100);
        const diff = rounded * 10_000 - exactTimes10000;
        // Within half a unit; an exact half lands on +5,000 (rounded up), never −5,000.
        expect(diff).toBeGreaterThan(-5_000);
        expect(diff).toBeLessThanOrEqual(5_000);
      }),
    );
  });

  it('sums whole minor units and refuses anything else', () => {
    expect(sumMinor([100, -25, 5])).toBe(80);
    expect(() => sumMinor([0.5])).toThrow(RangeError);
    expect(() => sumMinor([Number.MAX_SAFE_INTEGER, 1])).toThrow(RangeError);
  });
});
