import { toDec } from './decimal';

// The first-article report: for each cut item, the dimension measured on a molded sample from the
// changed tool against the intended part dimension and its tolerance. An item passes when the
// measurement lies within intended ± tolerance, both limits included (a symmetric bilateral
// tolerance: upper limit = nominal + t, lower limit = nominal − t, as ISO 286-1 and ASME Y14.5 define
// limits of size). All three figures are in the item's unit; compared as decimals, never floats.

export interface FirstArticleMeasure {
  /** The intended part dimension (nominal), as typed: "12.40". */
  intended: string;
  /** The permitted deviation either side, as typed: "0.05" (zero or more). */
  tolerance: string;
  /** What was measured on the molded sample, as typed: "12.43". */
  measured: string;
}

export interface FirstArticleJudgement {
  pass: boolean;
  /** measured − intended, as a decimal string ("0.03", "-0.07"). */
  deviation: string;
  lower: string;
  upper: string;
}

/** Pass or fail for one item. Throws a RangeError for a figure that is not a number or a negative tolerance. */
export function judgeFirstArticle(m: FirstArticleMeasure): FirstArticleJudgement {
  const intended = toDec(m.intended, 'intended');
  const tolerance = toDec(m.tolerance, 'tolerance');
  const measured = toDec(m.measured, 'measured');
  if (tolerance.isNegative()) throw new RangeError('tolerance cannot be negative');
  const lower = intended.minus(tolerance);
  const upper = intended.plus(tolerance);
  return {
    pass: measured.gte(lower) && measured.lte(upper),
    deviation: measured.minus(intended).toString(),
    lower: lower.toString(),
    upper: upper.toString(),
  };
}

/** The whole report passes only when every item passes (and there is at least one). */
export const reportPasses = (items: readonly { pass: boolean }[]) => items.length > 0 && items.every((i) => i.pass);
