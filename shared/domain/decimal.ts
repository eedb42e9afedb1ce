import Decimal from 'decimal.js';

/**
 * The decimal type used by every computation in `shared/domain`.
 *
 * A private clone with 40 significant digits, so that intermediate quotients (1/3 of a
 * billion-dollar sum, a shrink factor of 1/(1 - S)) keep far more digits than any result
 * we round to. The default rounding of the clone is half-up (away from zero on a tie);
 * each function states the rounding it applies to its result.
 */
export const Dec = Decimal.clone({ precision: 40, rounding: Decimal.ROUND_HALF_UP });
export type Dec = Decimal;

/** Anything a decimal can be built from. Prefer strings ("0.006") for ratios typed by people. */
export type DecimalInput = Decimal.Value;

/** Parse a decimal input, throwing a RangeError naming the field when it is not a finite number. */
export function toDec(value: DecimalInput, field = 'value'): Decimal {
  let d: Decimal;
  try {
    d = new Dec(typeof value === 'string' ? value.trim() : value);
  } catch {
    throw new RangeError(`${field} is not a number: ${String(value)}`);
  }
  if (!d.isFinite()) throw new RangeError(`${field} must be a finite number`);
  return d;
}

/** Throw unless `n` is a safe integer (optionally also >= 0). */
export function assertInteger(n: number, field: string, opts: { min?: number } = {}): void {
  if (!Number.isSafeInteger(n)) throw new RangeError(`${field} must be a whole number, got ${n}`);
  if (opts.min !== undefined && n < opts.min) throw new RangeError(`${field} must be at least ${opts.min}, got ${n}`);
}

/** Group an integer's digits in threes with commas: 1234567 -> "1,234,567". */
export function groupDigits(digits: string): string {
  const negative = digits.startsWith('-');
  const body = negative ? digits.slice(1) : digits;
  const grouped = body.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return negative ? `-${grouped}` : grouped;
}

/** A whole number written with thousands separators: 10000 -> "10,000". */
export function formatCount(n: number): string {
  assertInteger(n, 'count');
  return groupDigits(String(n));
}
