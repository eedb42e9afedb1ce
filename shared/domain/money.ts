import { Dec, assertInteger, groupDigits, toDec, type DecimalInput } from './decimal';

/**
 * Money as integer minor units ("cents": 1/100 of a US dollar; for a currency with no minor
 * unit, such as JPY, one "cent" is one yen). Ratios applied to money use decimal.js; no
 * binary floating point touches an amount.
 */

export const DEFAULT_CURRENCY = 'USD';

/** How many decimal places the currency's minor unit has (USD 2, JPY 0), from the platform's Intl data. */
export function minorUnitDigits(currency: string = DEFAULT_CURRENCY): number {
  let digits: number | undefined;
  try {
    digits = new Intl.NumberFormat('en-US', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits;
  } catch {
    throw new RangeError(`Unknown currency code: ${currency}`);
  }
  return digits ?? 2;
}

const AMOUNT_PATTERN = /^([+-])?(\d{1,3}(?:,\d{3})+|\d+)?(?:\.(\d+))?$/;

/**
 * Parse a decimal amount typed by a person ("1234.56", "1,234.56", "-0.5", ".25") into cents.
 * Thousands commas are allowed only in proper groups of three. More decimal places than the
 * currency has are refused unless they are zeros ("1.500" is fine, "1.505" is an error): this
 * function never rounds money silently.
 */
export function parseCents(text: string, currency: string = DEFAULT_CURRENCY): number {
  const trimmed = text.trim();
  const match = AMOUNT_PATTERN.exec(trimmed);
  if (!match || (match[2] === undefined && match[3] === undefined)) {
    throw new RangeError(`Not an amount: "${text}"`);
  }
  const digits = minorUnitDigits(currency);
  const plain = `${match[1] ?? ''}${(match[2] ?? '0').replace(/,/g, '')}.${match[3] ?? '0'}`;
  const minor = new Dec(plain).times(new Dec(10).pow(digits));
  if (!minor.isInteger()) {
    throw new RangeError(`"${text}" has more than ${digits} decimal places`);
  }
  const cents = minor.toNumber();
  if (!Number.isSafeInteger(cents)) throw new RangeError(`"${text}" is too large`);
  return cents === 0 ? 0 : cents; // no negative zero
}

/**
 * Format cents with the currency sign and thousands separators: 123456 -> "$1,234.56".
 * The amount is handed to Intl as an exact decimal string, never as cents / 100 in floating point.
 */
export function formatCents(cents: number, currency: string = DEFAULT_CURRENCY, locale = 'en-US'): string {
  assertInteger(cents, 'cents');
  const digits = minorUnitDigits(currency);
  const amount = new Dec(cents).div(new Dec(10).pow(digits)).toFixed(digits);
  return new Intl.NumberFormat(locale, {
    style: 'currency',
    currency,
    minimumFractionDigits: digits,
    maximumFractionDigits: digits,
  }).format(amount as Intl.StringNumericLiteral);
}

/** Cents as a plain decimal string without sign or grouping ("1234.56"), for inputs and CSV. */
export function centsToDecimalString(cents: number, currency: string = DEFAULT_CURRENCY): string {
  assertInteger(cents, 'cents');
  const digits = minorUnitDigits(currency);
  return new Dec(cents).div(new Dec(10).pow(digits)).toFixed(digits);
}

/** Plain-digit grouping of cents without a currency sign: 123456 -> "1,234.56". */
export function formatCentsPlain(cents: number, currency: string = DEFAULT_CURRENCY): string {
  const [whole, fraction] = centsToDecimalString(cents, currency).split('.');
  return fraction === undefined ? groupDigits(whole) : `${groupDigits(whole)}.${fraction}`;
}

/**
 * Split `totalCents` in proportion to `weights` without losing or inventing a cent
 * (largest-remainder method). Each share is first the exact share rounded toward zero; the
 * cents left over go one each to the shares with the largest remainders, ties to the earlier
 * share (so 100 across [1, 1, 1] gives [34, 33, 33], as dinero.js's allocate does). A negative
 * total is split as its absolute value and every share negated. Arithmetic is exact (BigInt).
 */
export function allocateCents(totalCents: number, weights: readonly DecimalInput[]): number[] {
  assertInteger(totalCents, 'totalCents');
  if (weights.length === 0) throw new RangeError('weights must not be empty');
  const decs = weights.map((w, i) => toDec(w, `weights[${i}]`));
  if (decs.some((d) => d.isNegative() && !d.isZero())) throw new RangeError('weights must not be negative');
  const scale = Math.max(0, ...decs.map((d) => d.decimalPlaces()));
  const ints = decs.map((d) => BigInt(d.times(new Dec(10).pow(scale)).toFixed(0)));
  const sum = ints.reduce((a, b) => a + b, 0n);
  if (sum === 0n) throw new RangeError('at least one weight must be above zero');

  const sign = totalCents < 0 ? -1n : 1n;
  const total = BigInt(totalCents) * sign;
  const shares = ints.map((w) => (total * w) / sum);
  const remainders = ints.map((w) => (total * w) % sum);
  let left = total - shares.reduce((a, b) => a + b, 0n);
  const order = remainders
    .map((r, i) => ({ r, i }))
    .sort((a, b) => (a.r === b.r ? a.i - b.i : a.r > b.r ? -1 : 1));
  for (const { i } of order) {
    if (left === 0n) break;
    shares[i] += 1n;
    left -= 1n;
  }
  return shares.map((s) => {
    const n = Number(s * sign);
    return n === 0 ? 0 : n;
  });
}

/** Split `totalCents` into `parts` shares as even as possible; earlier shares take the odd cents. */
export function splitCentsEvenly(totalCents: number, parts: number): number[] {
  assertInteger(parts, 'parts', { min: 1 });
  return allocateCents(totalCents, Array.from({ length: parts }, () => 1));
}

/**
 * Multiply cents by a decimal ratio and round to the whole cent, half-up: a tie (exactly half a
 * cent) rounds away from zero, so 0.5 -> 1 and -0.5 -> -1. Use a string ratio ("0.065") when it
 * comes from a person.
 */
export function multiplyCents(cents: number, ratio: DecimalInput): number {
  assertInteger(cents, 'cents');
  const result = new Dec(cents).times(toDec(ratio, 'ratio')).toDecimalPlaces(0, Dec.ROUND_HALF_UP).toNumber();
  if (!Number.isSafeInteger(result)) throw new RangeError('result is too large');
  return result === 0 ? 0 : result;
}

/** A percentage of an amount ("6.5" means 6.5 %), rounded half-up to the cent as in multiplyCents. */
export function percentOfCents(cents: number, percent: DecimalInput): number {
  return multiplyCents(cents, toDec(percent, 'percent').div(100));
}

/** Add amounts in cents, refusing anything that is not a safe whole number. */
export function sumCents(amounts: readonly number[]): number {
  let total = 0;
  for (const [i, a] of amounts.entries()) {
    assertInteger(a, `amounts[${i}]`);
    total += a;
  }
  assertInteger(total, 'total');
  return total;
}
