/**
 * Exact integer arithmetic the trade engine rounds with, so no float error can tip a gram or a
 * cent the wrong way.
 *
 * - `ceilDiv(n, d)`, `floorDiv(n, d)`: integer division rounded up / down (d > 0).
 * - `roundHalfUpDiv(n, d)`: the one rounding rule for money and displayed percentages: to the
 *   nearest integer, halves away from zero (half-up for the non-negative amounts shops deal in).
 * - `toHundredths(pct)`: a percentage with at most two decimals as an integer of 0.01 % steps.
 * - `fromHundredths(h)`: back to a percentage number.
 * - `decimalToScaled(value, scale)`: a decimal number as an exact integer of 10^-scale units.
 *
 * Inputs beyond Number's safe integer range go through BigInt.
 */

function assertInteger(value: number | bigint, name: string): void {
  if (typeof value === 'number' && !Number.isSafeInteger(value)) {
    throw new RangeError(`${name} must be a safe integer, got ${value}`);
  }
}

// Below 2^52 the product quotient × divisor stays exact in a double.
const FAST_PATH_LIMIT = 2 ** 52;

function checkedOperands(numerator: number | bigint, divisor: number | bigint): boolean {
  assertInteger(numerator, 'numerator');
  assertInteger(divisor, 'divisor');
  if (divisor <= 0) throw new RangeError('divisor must be positive');
  return typeof numerator === 'number' && typeof divisor === 'number' && Math.abs(numerator) <= FAST_PATH_LIMIT;
}

/** Floor of n ÷ d in doubles: the float quotient is within one of the truth; the remainder corrects it. */
function floorInDoubles(numerator: number, divisor: number): number {
  const quotient = Math.floor(numerator / divisor);
  const remainder = numerator - quotient * divisor;
  return remainder < 0 ? quotient - 1 : remainder >= divisor ? quotient + 1 : quotient;
}

function floorInBigInts(numerator: number | bigint, divisor: number | bigint): bigint {
  const n = BigInt(numerator);
  const d = BigInt(divisor);
  const quotient = n / d;
  return n % d < 0n ? quotient - 1n : quotient;
}

/** Integer division rounded towards +∞. */
export function ceilDiv(numerator: number | bigint, divisor: number | bigint): number {
  if (checkedOperands(numerator, divisor)) {
    const quotient = floorInDoubles(numerator as number, divisor as number);
    return quotient * (divisor as number) === numerator ? quotient : quotient + 1;
  }
  const quotient = floorInBigInts(numerator, divisor);
  return Number(quotient * BigInt(divisor) === BigInt(numerator) ? quotient : quotient + 1n);
}

/** Integer division rounded towards −∞. */
export function floorDiv(numerator: number | bigint, divisor: number | bigint): number {
  if (checkedOperands(numerator, divisor)) return floorInDoubles(numerator as number, divisor as number);
  return Number(floorInBigInts(numerator, divisor));
}

/** Integer division rounded to nearest, halves away from zero (half-up for non-negative values). */
export function roundHalfUpDiv(numerator: number | bigint, divisor: number | bigint): number {
  const negative = numerator < 0;
  const magnitude = negative ? -numerator : numerator;
  let rounded: number;
  if (checkedOperands(magnitude, divisor)) {
    const quotient = floorInDoubles(magnitude as number, divisor as number);
    const remainder = (magnitude as number) - quotient * (divisor as number);
    rounded = remainder * 2 >= (divisor as number) ? quotient + 1 : quotient;
  } else {
    const quotient = floorInBigInts(magnitude, divisor);
    const remainder = BigInt(magnitude) - quotient * BigInt(divisor);
    rounded = Number(remainder * 2n >= BigInt(divisor) ? quotient + 1n : quotient);
  }
  return negative && rounded !== 0 ? -rounded : rounded;
}

/**
 * A decimal number as an integer count of 10^-scale units, exactly as written in decimal
 * (0.1 → 1 at scale 1). Refuses values with more decimals than the scale allows.
 */
export function decimalToScaled(value: number, scale: number): number {
  if (!Number.isFinite(value)) throw new RangeError(`not a finite number: ${value}`);
  const scaled = Math.round(value * 10 ** scale);
  if (!Number.isSafeInteger(scaled) || Math.abs(scaled - value * 10 ** scale) > 1e-6 * Math.max(1, Math.abs(scaled))) {
    throw new RangeError(`${value} has more than ${scale} decimals or is too large`);
  }
  return scaled;
}

/** A percentage with at most two decimals (12.5 → 1250). */
export function toHundredths(pct: number): number {
  return decimalToScaled(pct, 2);
}

export function fromHundredths(hundredths: number): number {
  return hundredths / 100;
}

/** True when a number has at most `decimals` decimals (as typed in decimal). */
export function hasAtMostDecimals(value: number, decimals: number): boolean {
  try {
    decimalToScaled(value, decimals);
    return true;
  } catch {
    return false;
  }
}
