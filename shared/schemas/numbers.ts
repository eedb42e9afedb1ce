import { z } from 'zod';
import { clampFactors } from '../domain/data/clamp-factors';
import { resins } from '../domain/data/resins';
import { Dec } from '../domain/decimal';
import { engineerEstimateProblems } from '../domain/economics';
import { minorUnitDigits } from '../domain/money';
import type { NumbersFacts, OpenPlansVerdict, RequestNumbersResult } from '../domain/request-numbers';
import { requestStatusSchema } from './change-requests';

// The contract of the numbers behind a change: the engineer's estimate and plan inputs (PUT),
// the figures computed from them (GET), and a tool's life against all open plans.

const MAX_UNITS = 1_000_000_000;

/** A whole number of cents, days or rounds; the rule is economics.ts's engineerEstimateProblems. */
const estimateNumber = z.number({ message: 'Must be a whole number of zero or more' }).nullable().default(null);

/**
 * The engineer's estimate. Every field may be empty (null) while it is unknown. The check is the
 * same function the screens and the computations use (engineerEstimateProblems).
 */
export const estimateInput = z
  .object({
    modificationCostCents: estimateNumber,
    leadDays: estimateNumber,
    trialRoundsExpected: estimateNumber,
    newInsertCents: estimateNumber,
    duplicateToolCents: estimateNumber,
  })
  .superRefine((e, ctx) => {
    for (const [field, messages] of Object.entries(engineerEstimateProblems(e))) {
      for (const message of messages) ctx.addIssue({ code: 'custom', path: [field], message });
    }
  });
export type EstimateInput = z.input<typeof estimateInput>;

const cents = z
  .number({ message: 'Use whole cents' })
  .int({ message: 'Use whole cents' })
  .min(0, { message: 'Must be zero or more' })
  .max(Number.MAX_SAFE_INTEGER, { message: 'Too large' })
  .nullable()
  .default(null);

/** A decimal typed as text ("0.03", "6.5"): digits, one optional point, no sign or exponent. */
const DECIMAL_TEXT = /^(\d{1,9}(\.\d{1,6})?|\.\d{1,6})$/;
const decimalText = (message: string) => z.string().trim().regex(DECIMAL_TEXT, { message });

/** The decimal a text holds, or null (zod runs every check even after the pattern failed). */
const decimalOf = (v: string) => (DECIMAL_TEXT.test(v) ? new Dec(v) : null);

const fractionBelow = (limit: string, message: string) =>
  decimalText(message).refine((v) => decimalOf(v)?.lt(limit) ?? false, { message });

const positiveDecimal = (message: string) => decimalText(message).refine((v) => decimalOf(v)?.gt(0) ?? false, { message });

const currencyCode = z
  .string()
  .trim()
  .transform((v) => v.toUpperCase())
  .refine(
    (v) => {
      if (!/^[A-Z]{3}$/.test(v)) return false;
      try {
        minorUnitDigits(v);
        return true;
      } catch {
        return false;
      }
    },
    { message: 'Use a 3-letter ISO 4217 code, e.g. USD' },
  );

/**
 * What the engineer plans for the derivative. A field left empty (null) takes the registry's value
 * where there is one (the derivative's planned units and prices, its bill of parts), else it is
 * unknown; freight, duty and scrap left empty count as zero and the figures say so.
 */
export const planInput = z.object({
  plannedUnits: z
    .number({ message: 'Use a whole number of units' })
    .int({ message: 'Use a whole number of units' })
    .min(1, { message: 'Plan at least 1 unit, or leave it empty to use the product\'s planned units' })
    .max(MAX_UNITS, { message: 'At most 1,000,000,000 units' })
    .nullable()
    .default(null),
  partsPerUnit: z
    .number({ message: 'Use a whole number' })
    .int({ message: 'Use a whole number' })
    .min(1, { message: 'At least 1' })
    .max(1000, { message: 'At most 1,000' })
    .nullable()
    .default(null),
  /** Fraction of good parts, "0.03" = 3 %. */
  scrapRate: fractionBelow('1', 'Scrap is a fraction below 1: 0.03 means 3 %').nullable().default(null),
  fobCents: cents,
  freightPerUnitCents: cents,
  /** Percent of FOB, "6.5" = 6.5 %. */
  dutyPercent: decimalText('Use a percent like 6.5')
    .refine((v) => decimalOf(v)?.lte(1000) ?? false, { message: 'At most 1000 %' })
    .nullable()
    .default(null),
  wholesaleCents: cents,
  retailCents: cents,
  currency: currencyCode.nullable().default(null),
});
export type PlanInput = z.input<typeof planInput>;

export const resinIds = resins.map((r) => r.id) as [string, ...string[]];
export const clampFactorIds = clampFactors.map((f) => f.id) as [string, ...string[]];
export const shrinkConventions = ['astm_d955', 'shop_shortcut'] as const;
export const formedByValues = ['recess', 'protrusion'] as const;
export const areaUnits = ['cm2', 'in2'] as const;
export const forceUnits = ['short_tons', 'tonnes_force', 'kn'] as const;

const mm = positiveDecimal('Use millimetres above zero, like 31.2');

export const dimensionCheckInput = z.object({
  oldPartMm: mm,
  newPartMm: mm,
  resinId: z.enum(resinIds, { message: 'Pick a resin from the shrink table' }),
  /** The grade's datasheet shrink as a fraction; empty: the middle of the resin's published range. */
  shrink: fractionBelow('0.1', 'Shrink is a fraction: 0.006 means 0.6 %').nullable().default(null),
  convention: z.enum(shrinkConventions).default('astm_d955'),
  formedBy: z.enum(formedByValues).default('recess'),
});
export type DimensionCheckInput = z.input<typeof dimensionCheckInput>;

export const clampCheckInput = z.object({
  projectedArea: positiveDecimal('Use an area above zero, like 38.5'),
  areaUnit: z.enum(areaUnits).default('cm2'),
  factorId: z.enum(clampFactorIds, { message: 'Pick a clamp factor from the table' }),
  /** A value within the factor's range; empty: its upper end. */
  factor: positiveDecimal('Use a factor above zero').nullable().default(null),
  safetyFactor: decimalText('Use a multiplier like 1.1')
    .refine((v) => (decimalOf(v)?.gte(1) ?? false) && (decimalOf(v)?.lte(3) ?? false), {
      message: 'Use a multiplier from 1 to 3 (1.1 = 10 % margin)',
    })
    .default('1'),
  pressTonnage: positiveDecimal('Use the press rating, above zero').nullable().default(null),
  pressUnit: z.enum(forceUnits).default('short_tons'),
});
export type ClampCheckInput = z.input<typeof clampCheckInput>;

/** Everything stored for a request's numbers (the estimate in `estimate`, the rest in `numbers_inputs`). */
export const numbersInputsSchema = z.object({
  estimate: estimateInput.default({
    modificationCostCents: null,
    leadDays: null,
    trialRoundsExpected: null,
    newInsertCents: null,
    duplicateToolCents: null,
  }),
  plan: planInput.default({
    plannedUnits: null,
    partsPerUnit: null,
    scrapRate: null,
    fobCents: null,
    freightPerUnitCents: null,
    dutyPercent: null,
    wholesaleCents: null,
    retailCents: null,
    currency: null,
  }),
  dimension: dimensionCheckInput.nullable().default(null),
  clamp: clampCheckInput.nullable().default(null),
});
export type NumbersInputsInput = z.input<typeof numbersInputsSchema>;
export type NumbersInputsValues = z.output<typeof numbersInputsSchema>;

/** PUT /api/requests/:id/numbers: the whole set of inputs, with the request version the editor saw. */
export const saveNumbersInput = numbersInputsSchema.extend({ version: z.number().int().min(0) });
export type SaveNumbersInput = z.input<typeof saveNumbersInput>;

const isObject = (v: unknown) => typeof v === 'object' && v !== null;

/** GET (and PUT's answer) /api/requests/:id/numbers. */
export const requestNumbersSchema = z.object({
  requestId: z.uuid(),
  /** The request's version: send it back with a save. */
  version: z.number().int(),
  status: requestStatusSchema,
  /** The caller may change the inputs now (a tooling engineer during engineering review). */
  canEdit: z.boolean(),
  /** Why the inputs are read-only for the caller, in words (null when they may edit). */
  readOnlyReason: z.string().nullable(),
  /** The stored inputs, every field present. */
  inputs: numbersInputsSchema,
  /** The registry values the figures use (the app recomputes with them as the engineer types). */
  facts: z.custom<NumbersFacts>(isObject),
  /** computeRequestNumbers(inputs, facts). */
  result: z.custom<RequestNumbersResult>(isObject),
  updatedAt: z.string(),
});
export type RequestNumbers = z.infer<typeof requestNumbersSchema>;

/** One open change on a tool and the shots its plan needs. */
export const openPlanSchema = z.object({
  requestId: z.uuid(),
  ref: z.string(),
  title: z.string(),
  status: requestStatusSchema,
  derivative: z.object({ id: z.uuid(), sku: z.string(), name: z.string() }).nullable(),
  plannedUnits: z.number().int().nullable(),
  shotsNeeded: z.number().int().nullable(),
  /** The part whose cavities set the shots, when known. */
  governingPart: z.string().nullable(),
  /** This plan alone against the remaining life, in words (null without figures). */
  summary: z.string().nullable(),
});
export type OpenPlan = z.infer<typeof openPlanSchema>;

/** GET /api/tools/:id/open-plans. */
export const toolOpenPlansSchema = z.object({
  tool: z.object({
    id: z.uuid(),
    code: z.string(),
    ratedShots: z.number().int(),
    shotCount: z.number().int(),
    ratedShotsSource: z.string(),
  }),
  plans: z.array(openPlanSchema),
  total: z.custom<OpenPlansVerdict>(isObject),
});
export type ToolOpenPlans = z.infer<typeof toolOpenPlansSchema>;
