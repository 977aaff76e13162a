import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ceilDiv, decimalToScaled, floorDiv, hasAtMostDecimals, roundHalfUpDiv, toHundredths } from './integer-math';

describe('integer division', () => {
  it('ceilDiv, floorDiv and roundHalfUpDiv agree with Math on exact small cases', () => {
    fc.assert(
      fc.property(fc.integer({ min: -1_000_000, max: 1_000_000 }), fc.integer({ min: 1, max: 10_000 }), (n, d) => {
        // `+ 0` turns Math's −0 into 0; integers have no sign of zero.
        expect(ceilDiv(n, d)).toBe(Math.ceil(n / d) + 0);
        expect(floorDiv(n, d)).toBe(Math.floor(n / d) + 0);
        // Half away from zero: the magnitude rounds like Math.round does for positives.
        expect(roundHalfUpDiv(n, d)).toBe(Math.sign(n) * Math.round(Math.abs(n) / d) + 0);
      }),
    );
  });

  it('rounds halves up and stays exact beyond 2^53 through BigInt', () => {
    expect(roundHalfUpDiv(5, 2)).toBe(3);
    expect(roundHalfUpDiv(-5, 2)).toBe(-3);
    expect(roundHalfUpDiv(4, 2)).toBe(2);
    const big = 10n ** 20n + 1n;
    expect(ceilDiv(big, 10n ** 18n)).toBe(101);
    expect(floorDiv(big, 10n ** 18n)).toBe(100);
  });

  it('gives the same answers in Number and BigInt arithmetic, up to the edge of safe integers', () => {
    fc.assert(
      fc.property(fc.integer({ min: -Number.MAX_SAFE_INTEGER, max: Number.MAX_SAFE_INTEGER }), fc.integer({ min: 1, max: 2 ** 40 }), (n, d) => {
        // The defining inequality: q·d ≤ n < (q + 1)·d.
        const quotient = BigInt(floorDiv(n, d));
        expect(quotient * BigInt(d) <= BigInt(n) && BigInt(n) < (quotient + 1n) * BigInt(d)).toBe(true);
        expect(ceilDiv(n, d)).toBe(ceilDiv(BigInt(n), BigInt(d)));
        expect(floorDiv(n, d)).toBe(floorDiv(BigInt(n), BigInt(d)));
        expect(roundHalfUpDiv(n, d)).toBe(roundHalfUpDiv(BigInt(n), BigInt(d)));
      }),
    );
  });

  it('refuses a zero divisor and non-integers', () => {
    expect(() => ceilDiv(1, 0)).toThrow(RangeError);
    expect(() => floorDiv(1.5, 1)).toThrow(RangeError);
    expect(() => roundHalfUpDiv(1, 0.5)).toThrow(RangeError);
  });
});

describe('decimal percentages', () => {
  it('reads decimals as written', () => {
    expect(toHundredths(12.5)).toBe(1250);
    expect(toHundredths(0.07)).toBe(7);
    expect(decimalToScaled(1.005, 3)).toBe(1005);
    expect(hasAtMostDecimals(12.34, 2)).toBe(true);
    expect(hasAtMostDecimals(12.345, 2)).toBe(false);
    expect(() => toHundredths(Number.NaN)).toThrow(RangeError);
  });

  it('round-trips any two-decimal percentage', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1_000_000 }), (hundredths) => {
        expect(toHundredths(hundredths / 100)).toBe(hundredths);
      }),
    );
  });
});
