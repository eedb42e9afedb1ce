import { Dec, toDec, type DecimalInput } from './decimal';
import type { ResinShrinkage } from './data/resins';

/**
 * Shrink-compensated steel dimensions.
 *
 * Mold shrinkage S is defined relative to the MOLD dimension: S = (mold - part) / mold
 * (ASTM D955; routsis.blog "Calculating Part Shrinkage"), so the steel is part / (1 - S). Shop
 * sheets often use the shortcut part x (1 + S), which is slightly small; the gap is
 * S^2 x part / (1 - S) (TRADE-FACTS 3.1). The user picks the convention and every result says
 * which one was applied.
 *
 * Dimensions are millimetres. Results are decimal strings rounded half-up to 0.001 mm (1 um).
 */

export type ShrinkConvention = 'astm_d955' | 'shop_shortcut';

export const SHRINK_CONVENTIONS: Record<ShrinkConvention, { label: string; formula: string; source: string }> = {
  astm_d955: {
    label: 'ASTM D955 definition',
    formula: 'steel = part / (1 - S)',
    source: 'ASTM D955: shrinkage is measured from mold cavity to molded dimension, as a fraction of the mold dimension',
  },
  shop_shortcut: {
    label: 'Shop shortcut',
    formula: 'steel = part x (1 + S)',
    source: 'Common shop-sheet convention ("Basic Injection Molding Conversions and Calculations"; plastwise.com)',
  },
};

export const DEFAULT_SHRINK_CONVENTION: ShrinkConvention = 'astm_d955';

/** Decimal places of every millimetre result (0.001 mm), rounded half-up. */
export const MM_DECIMALS = 3;
export const STEEL_ROUNDING = 'Rounded half-up to 0.001 mm.';

/** Shrink above this is almost surely a percent typed as a fraction (0.6 meaning 0.6 %). */
const MAX_SHRINK = new Dec('0.1');

function shrinkOf(shrink: DecimalInput) {
  const s = toDec(shrink, 'shrink');
  if (s.isNegative()) throw new RangeError('shrink must not be negative');
  if (s.gte(MAX_SHRINK)) throw new RangeError('shrink is a fraction: 0.006 means 0.6 %');
  return s;
}

function positiveMm(value: DecimalInput, field: string) {
  const d = toDec(value, field);
  if (d.lte(0)) throw new RangeError(`${field} must be above zero`);
  return d;
}

function mm(d: Dec): string {
  return d.toFixed(MM_DECIMALS, Dec.ROUND_HALF_UP);
}

/** The unrounded steel dimension, for callers that chain computations. */
export function exactSteelDimension(
  partMm: DecimalInput,
  shrink: DecimalInput,
  convention: ShrinkConvention = DEFAULT_SHRINK_CONVENTION,
): Dec {
  const part = positiveMm(partMm, 'partMm');
  const s = shrinkOf(shrink);
  return convention === 'astm_d955' ? part.div(new Dec(1).minus(s)) : part.times(new Dec(1).plus(s));
}

export interface SteelDimension {
  partMm: string;
  shrink: string;
  convention: ShrinkConvention;
  formula: string;
  /** Steel (cavity or core) dimension, mm, rounded half-up to 0.001 mm. */
  steelMm: string;
}

/** Steel dimension that molds `partMm` with shrink S under the chosen convention (default ASTM D955). */
export function steelDimension(
  partMm: DecimalInput,
  shrink: DecimalInput,
  convention: ShrinkConvention = DEFAULT_SHRINK_CONVENTION,
): SteelDimension {
  return {
    partMm: toDec(partMm, 'partMm').toString(),
    shrink: toDec(shrink, 'shrink').toString(),
    convention,
    formula: SHRINK_CONVENTIONS[convention].formula,
    steelMm: mm(exactSteelDimension(partMm, shrink, convention)),
  };
}

/** Part dimension a given steel dimension molds (the inverse of steelDimension), rounded to 0.001 mm. */
export function partFromSteel(
  steelMm: DecimalInput,
  shrink: DecimalInput,
  convention: ShrinkConvention = DEFAULT_SHRINK_CONVENTION,
): string {
  const steel = positiveMm(steelMm, 'steelMm');
  const s = shrinkOf(shrink);
  return mm(convention === 'astm_d955' ? steel.times(new Dec(1).minus(s)) : steel.div(new Dec(1).plus(s)));
}

export interface ConventionComparison {
  astmD955Mm: string;
  shopShortcutMm: string;
  /** ASTM D955 minus shortcut, mm, from the exact values, rounded half-up to 0.001 mm. */
  differenceMm: string;
  /** The same difference in micrometres, rounded half-up to 0.1 um. */
  differenceMicrons: string;
}

/** Both conventions side by side, and how far apart they are (S^2 x part / (1 - S)). */
export function compareConventions(partMm: DecimalInput, shrink: DecimalInput): ConventionComparison {
  const astm = exactSteelDimension(partMm, shrink, 'astm_d955');
  const shop = exactSteelDimension(partMm, shrink, 'shop_shortcut');
  const diff = astm.minus(shop);
  return {
    astmD955Mm: mm(astm),
    shopShortcutMm: mm(shop),
    differenceMm: mm(diff),
    differenceMicrons: diff.times(1000).toFixed(1, Dec.ROUND_HALF_UP),
  };
}

/**
 * Which side of the steel forms the dimension:
 * - 'recess': plastic fills a pocket in the steel (outside size of a part in a cavity, depth of a
 *   rib). A bigger part dimension means a bigger pocket: remove steel.
 * - 'protrusion': plastic forms around steel (a hole on a core pin, a slot on a blade). A bigger
 *   part dimension means bigger steel: add steel.
 */
export type FormedBy = 'recess' | 'protrusion';

export type SteelAction = 'remove_steel' | 'add_steel' | 'none';

export interface SteelChangeInput {
  oldPartMm: DecimalInput;
  newPartMm: DecimalInput;
  shrink: DecimalInput;
  convention?: ShrinkConvention;
  formedBy?: FormedBy;
}

export interface SteelChange {
  oldSteelMm: string;
  newSteelMm: string;
  /** newSteelMm - oldSteelMm, signed, mm: the difference of the two rounded steel dimensions. */
  steelDeltaMm: string;
  /** Size of the change, mm, always zero or more. */
  depthMm: string;
  action: SteelAction;
  formedBy: FormedBy;
  convention: ShrinkConvention;
  formula: string;
  sentence: string;
}

/**
 * Steel to cut or build up to move a part dimension from old to new. The delta is taken between
 * the two rounded steel dimensions, so old + delta = new exactly as shown. It is the change across
 * the whole dimension: a width changed on both faces splits it between them.
 */
export function steelChangeForDimension(input: SteelChangeInput): SteelChange {
  const convention = input.convention ?? DEFAULT_SHRINK_CONVENTION;
  const formedBy = input.formedBy ?? 'recess';
  const oldSteel = steelDimension(input.oldPartMm, input.shrink, convention).steelMm;
  const newSteel = steelDimension(input.newPartMm, input.shrink, convention).steelMm;
  const delta = new Dec(newSteel).minus(oldSteel);
  const depth = delta.abs();
  let action: SteelAction = 'none';
  if (!delta.isZero()) {
    const grows = delta.isPositive();
    action = (formedBy === 'recess') === grows ? 'remove_steel' : 'add_steel';
  }
  const formula = SHRINK_CONVENTIONS[convention].formula;
  const basis = `steel ${oldSteel} -> ${newSteel} mm, ${formula}, S = ${toDec(input.shrink).toString()}`;
  const sentence =
    action === 'none'
      ? `No steel change at 0.001 mm (${basis}).`
      : action === 'remove_steel'
        ? `Remove ${mm(depth)} mm of steel across the dimension (${basis}). Steel-safe: cut only.`
        : `Add ${mm(depth)} mm of steel across the dimension (${basis}). Not steel-safe: needs welding and re-cutting, or a new insert.`;
  return {
    oldSteelMm: oldSteel,
    newSteelMm: newSteel,
    steelDeltaMm: mm(delta),
    depthMm: mm(depth),
    action,
    formedBy,
    convention,
    formula,
    sentence,
  };
}

/** Middle of a resin's published range, as a decimal string: a starting point, not a datasheet value. */
export function shrinkMidpoint(resin: Pick<ResinShrinkage, 'shrinkMin' | 'shrinkMax'>): string {
  return new Dec(resin.shrinkMin).plus(resin.shrinkMax).div(2).toString();
}
