import Decimal from 'decimal.js';
import type { SafetyFlag } from '../schemas/change-items';

// Safety cautions for cut items that may create a small part, a sharp point or edge, or change a
// wall a child could break. The caution for lifting a heavy tool lives in handling.ts.
//
// These are cautions with reference values, not a test plan. Values come from TRADE-FACTS
// sections 4 and 8 with the source named on each; the inch-pound value is the one the US rules
// state ("for compliance purposes, the English dimensions shall be used", 16 CFR 1501.4(a)), and
// the SI value beside it is computed here from exact factors (1 in = 25.4 mm, 1 ft = 0.3048 m,
// 1 lbf = 4.4482216152605 N, 1 lb = 0.45359237 kg).

export const INCH_MM = new Decimal('25.4');
export const FOOT_M = new Decimal('0.3048');
export const LBF_N = new Decimal('4.4482216152605');
export const LB_KG = new Decimal('0.45359237');

/** How sure we are of a value. */
export type ReferenceStatus = 'regulation_text' | 'secondary_source' | 'from_memory';

export const referenceStatusLabels: Record<ReferenceStatus, string> = {
  regulation_text: 'from the regulation text',
  secondary_source: 'from a secondary source',
  from_memory: 'from memory, check against the current text',
};

type InchPoundUnit = 'in' | 'ft' | 'lbf' | 'in·lbf';
type SiUnit = 'mm' | 'm' | 'N' | 'N·m';

export interface ReferenceValue {
  id: string;
  what: string;
  /** The governing value as a decimal string, in `unit`. */
  value: string;
  unit: InchPoundUnit | 'count';
  /** Exact conversion to SI, to 5 significant digits; absent for counts. */
  si?: { value: string; unit: SiUnit };
  /** The metric figure as the source prints it, where it does (often rounded). */
  publishedMetric?: string;
  source: string;
  status: ReferenceStatus;
}

const toSi = (value: string, unit: InchPoundUnit): { value: string; unit: SiUnit } => {
  const v = new Decimal(value);
  const si = {
    in: () => ({ value: v.times(INCH_MM), unit: 'mm' as const }),
    ft: () => ({ value: v.times(FOOT_M), unit: 'm' as const }),
    lbf: () => ({ value: v.times(LBF_N), unit: 'N' as const }),
    'in·lbf': () => ({ value: v.times(LBF_N).times(INCH_MM).div(1000), unit: 'N·m' as const }),
  }[unit]();
  return { value: si.value.toSignificantDigits(5).toString(), unit: si.unit };
};

const ref = (
  id: string,
  what: string,
  value: string,
  unit: InchPoundUnit | 'count',
  source: string,
  status: ReferenceStatus,
  publishedMetric?: string,
): ReferenceValue => ({
  id,
  what,
  value,
  unit,
  ...(unit === 'count' ? {} : { si: toSi(value, unit) }),
  ...(publishedMetric ? { publishedMetric } : {}),
  source,
  status,
});

/** "1.25 in (31.75 mm)"; "10 drops". */
export function formatReference(r: ReferenceValue): string {
  const main = r.unit === 'count' ? r.value : `${r.value} ${r.unit}`;
  const si = r.si ? ` (${r.si.value} ${r.si.unit})` : '';
  const note = r.status === 'regulation_text' ? '' : `, ${referenceStatusLabels[r.status]}`;
  return `${r.what}: ${main}${si}. Source: ${r.source}${note}.`;
}

/** Small-parts cylinder, 16 CFR 1501.4 Figure 1 (same fixture in Canada SOR/2011-17 and EN 71-1). */
const SPC_SOURCE = '16 CFR 1501.4, Figure 1 (metric as printed in Canada SOR/2011-17, Schedule 1)';
export const smallPartsCylinder: readonly ReferenceValue[] = [
  ref('spc_inside_diameter', 'Small-parts cylinder, inside diameter', '1.25', 'in', SPC_SOURCE, 'regulation_text', '31.7 mm'),
  ref('spc_short_depth', 'Small-parts cylinder, depth at the short side of the slanted bottom', '1.00', 'in', SPC_SOURCE, 'regulation_text', '25.4 mm'),
  ref('spc_long_depth', 'Small-parts cylinder, depth at the long side of the slanted bottom', '2.25', 'in', SPC_SOURCE, 'regulation_text', '57.1 mm'),
];

/** Sharp points: 16 CFR 1500.48 (toys for children under 8 years). */
export const sharpPointTest: readonly ReferenceValue[] = [
  ref('sharp_point_force', 'Sharp-point test, force pressing the point into the gauge', '1.00', 'lbf', '16 CFR 1500.48', 'regulation_text', '4.45 N'),
];

export const ageGrades = ['up_to_18_months', 'from_18_to_36_months', 'from_36_to_96_months'] as const;
export type AgeGrade = (typeof ageGrades)[number];

export const ageGradeLabels: Record<AgeGrade, string> = {
  up_to_18_months: '18 months or younger (16 CFR 1500.51)',
  from_18_to_36_months: 'over 18 up to 36 months (16 CFR 1500.52)',
  from_36_to_96_months: 'over 36 up to 96 months (16 CFR 1500.53)',
};

/** Use-and-abuse tests for each age grade, 16 CFR 1500.51-.53 (TRADE-FACTS section 4.4). */
export const abuseTests: Record<AgeGrade, readonly ReferenceValue[]> = {
  up_to_18_months: [
    ref('drop_count', 'Drop test, number of drops', '10', 'count', '16 CFR 1500.51(b); ASTM F963-23 8.7.1 Table 5', 'secondary_source'),
    ref('drop_height', 'Drop test, height', '4.5', 'ft', '16 CFR 1500.51(b); ASTM F963-23 8.7.1 Table 5', 'secondary_source', '1.37 m'),
    ref('torque', 'Torque test', '2', 'in·lbf', '16 CFR 1500.51(e)', 'regulation_text'),
    ref('tension', 'Tension test', '10', 'lbf', '16 CFR 1500.51(f)', 'regulation_text'),
    ref('compression', 'Compression test', '20', 'lbf', '16 CFR 1500.51(g)', 'from_memory'),
    ref('bite', 'Bite test', '25', 'lbf', '16 CFR 1500.51(c), quoted by test-equipment vendors', 'secondary_source'),
  ],
  from_18_to_36_months: [
    ref('drop_count', 'Drop test, number of drops', '4', 'count', '16 CFR 1500.52(b); ASTM F963-23 8.7.1 Table 5', 'secondary_source'),
    ref('drop_height', 'Drop test, height', '3', 'ft', '16 CFR 1500.52(b); ASTM F963-23 8.7.1 Table 5', 'secondary_source'),
    ref('torque', 'Torque test', '3', 'in·lbf', '16 CFR 1500.52(e)', 'from_memory'),
    ref('tension', 'Tension test', '15', 'lbf', '16 CFR 1500.52(f)', 'from_memory'),
    ref('compression', 'Compression test', '25', 'lbf', '16 CFR 1500.52(g)', 'regulation_text'),
    ref('bite', 'Bite test', '50', 'lbf', '16 CFR 1500.52(c), quoted by test-equipment vendors', 'secondary_source'),
  ],
  from_36_to_96_months: [
    ref('drop_count', 'Drop test, number of drops', '4', 'count', '16 CFR 1500.53(b)', 'regulation_text'),
    ref('drop_height', 'Drop test, height', '3', 'ft', '16 CFR 1500.53(b)', 'regulation_text', '0.92 m'),
    ref('torque', 'Torque test', '4', 'in·lbf', '16 CFR 1500.53(e)', 'from_memory'),
    ref('tension', 'Tension test', '15', 'lbf', '16 CFR 1500.53(f)', 'from_memory'),
    ref('compression', 'Compression test', '30', 'lbf', '16 CFR 1500.53(g)', 'from_memory'),
    ref('bite', 'Bite test', '100', 'lbf', '16 CFR 1500.53(c), quoted by test-equipment vendors', 'secondary_source'),
  ],
};

export interface SafetyCaution {
  flag: SafetyFlag;
  title: string;
  /** Plain sentences: what to check and why. */
  sentences: string[];
  references: ReferenceValue[];
}

export const SAFETY_CLOSING =
  'These values are a reminder, not a test plan: have the changed toy tested by an accredited toy-safety laboratory and follow the rules of each market where it is sold (for example 16 CFR and ASTM F963 in the US, EN 71-1 in the EU), in their current editions.';

const cautionsByFlag: Record<SafetyFlag, (grades: readonly AgeGrade[]) => SafetyCaution> = {
  small_part: () => ({
    flag: 'small_part',
    title: 'May create a small part',
    sentences: [
      'For toys for children under 3 years (16 CFR 1501; under 36 months in EN 71-1), no part may fit entirely inside the small-parts cylinder, in any orientation and uncompressed.',
      'The check is made as molded and again on every piece that comes loose after the use-and-abuse tests for the age grade, bite tests excepted (16 CFR 1501.4(b)).',
      'The inch dimensions govern (16 CFR 1501.4(a)); the metric figures in the rule are rounded down.',
      'Toys for children from 3 to 6 years that contain small parts need a choking-hazard warning (16 CFR 1500.19; age band from memory).',
    ],
    references: [...smallPartsCylinder],
  }),
  point_or_edge: () => ({
    flag: 'point_or_edge',
    title: 'May create a point or edge',
    sentences: [
      'Accessible points on toys for children under 8 years are checked with the sharp-point tester before and after the use-and-abuse tests (16 CFR 1500.48).',
      'The federal sharp-edge test (16 CFR 1500.49) covers metal and glass edges only; a plastic edge is judged under ASTM F963 (accessible edges, points and projections; check the clause numbers in the current edition).',
      'A re-cut can also leave a projection a child could fall onto; ASTM F963 covers hazardous projections.',
    ],
    references: [...sharpPointTest],
  }),
  thin_wall: (grades) => ({
    flag: 'thin_wall',
    title: 'Changes a wall a child could break',
    sentences: [
      'A thinner or changed wall can break in the use-and-abuse tests and leave small parts or sharp points and edges (16 CFR 1500.50-.53).',
      'Use the tests for the youngest age grade the toy is meant for; when a toy spans age grades, the most stringent test applies (16 CFR 1500.50(b)).',
      ...grades.map((g) => `Tests for ${ageGradeLabels[g]} are listed below.`),
    ],
    references: grades.flatMap((g) => abuseTests[g].map((r) => ({ ...r, id: `${g}.${r.id}`, what: `${r.what} (${ageGradeLabels[g]})` }))),
  }),
};

export interface FlaggedItem {
  safetyFlags: readonly SafetyFlag[];
}

export interface SafetyReview {
  /** One caution per flag used by any item, in the order small part, point or edge, wall. */
  cautions: SafetyCaution[];
  /** Number of items carrying at least one flag. */
  flaggedItems: number;
  retestRequired: boolean;
  /** Empty when nothing is flagged. */
  closing: string;
}

const flagOrder: readonly SafetyFlag[] = ['small_part', 'point_or_edge', 'thin_wall'];

/** True when any item carries a safety flag: the request then needs a re-test note before it closes. */
export function retestRequired(items: readonly FlaggedItem[]): boolean {
  return items.some((i) => i.safetyFlags.length > 0);
}

/**
 * The cautions for the flags on a request's items. `ageGrades` narrows the use-and-abuse tests to
 * the toy's age grades; by default all three are shown.
 */
export function safetyReview(items: readonly FlaggedItem[], options: { ageGrades?: readonly AgeGrade[] } = {}): SafetyReview {
  const used = new Set(items.flatMap((i) => i.safetyFlags));
  const grades = options.ageGrades && options.ageGrades.length > 0 ? ageGrades.filter((g) => options.ageGrades!.includes(g)) : ageGrades;
  const cautions = flagOrder.filter((f) => used.has(f)).map((f) => cautionsByFlag[f](grades));
  return {
    cautions,
    flaggedItems: items.filter((i) => i.safetyFlags.length > 0).length,
    retestRequired: retestRequired(items),
    closing: cautions.length > 0 ? SAFETY_CLOSING : '',
  };
}
