// The engineer's estimate and plan as a form holds them (text as typed), the Yup rules that mirror
// shared/schemas/numbers.ts (the server's zod schema stays the authority; tests/web/numbers-forms
// checks both give the same verdict), and the conversion to the API's inputs. Money is typed as
// "12,500.00" and converted with parseCents; percents are typed as percents ("3" = 3 %) and stored
// as exact decimal fractions ("0.03"), never through binary floating point.
import * as yup from 'yup';
import { clampFactors } from '@shared/domain/data/clamp-factors';
import { resins } from '@shared/domain/data/resins';
import { Dec } from '@shared/domain/decimal';
import { formatCentsPlain, minorUnitDigits, parseCents } from '@shared/domain/money';
import type { AreaUnit, ForceUnit } from '@shared/domain/clamp-force';
import type { NumbersInputs } from '@shared/domain/request-numbers';
import type { FormedBy, ShrinkConvention } from '@shared/domain/shrinkage';
import {
  clampCheckInput,
  dimensionCheckInput,
  estimateInput,
  numbersInputsSchema,
  planInput,
  type NumbersInputsInput,
} from '@shared/schemas/numbers';

export interface NumbersFormValues {
  modificationCost: string;
  leadDays: string;
  trialRoundsExpected: string;
  newInsertCost: string;
  duplicateToolCost: string;
  plannedUnits: string;
  partsPerUnit: string;
  /** Percent: "3" = 3 %. */
  scrapPercent: string;
  currency: string;
  fob: string;
  freight: string;
  dutyPercent: string;
  wholesale: string;
  retail: string;
  dimensionOn: boolean;
  oldPartMm: string;
  newPartMm: string;
  resinId: string;
  /** Datasheet shrink in percent ("0.55" = 0.55 %); empty: the middle of the resin's range. */
  shrinkPercent: string;
  convention: ShrinkConvention;
  formedBy: FormedBy;
  clampOn: boolean;
  projectedArea: string;
  areaUnit: AreaUnit;
  factorId: string;
  factor: string;
  safetyFactor: string;
  pressTonnage: string;
  pressUnit: ForceUnit;
}

export type NumbersFormField = keyof NumbersFormValues;

const WHOLE = /^\d+$/;
const MONEY = /^(\d+|\d{1,3}(,\d{3})+)(\.\d+)?$/;
const DECIMAL = /^(\d{1,9}(\.\d{1,6})?|\.\d{1,6})$/;
/** A percent typed by a person: up to 4 decimals, so the fraction has at most 6. */
const PERCENT = /^(\d{1,3}(\.\d{1,4})?|\.\d{1,4})$/;

const CURRENCY_OK = (v: string) => {
  if (!/^[A-Za-z]{3}$/.test(v)) return false;
  try {
    minorUnitDigits(v.toUpperCase());
    return true;
  } catch {
    return false;
  }
};

/** The currency the amounts are typed in: the entered one, else the one the figures use now. */
export const formCurrency = (v: Pick<NumbersFormValues, 'currency'>, fallback: string) =>
  CURRENCY_OK(v.currency.trim()) ? v.currency.trim().toUpperCase() : fallback;

/** Exact cents for typed money, or NaN when it is not an amount in this currency. */
export function centsOrNaN(text: string, currency: string): number {
  try {
    return parseCents(text, currency);
  } catch {
    return Number.NaN;
  }
}

/** "3" (percent) -> "0.03" (fraction), exactly. */
export const percentToFraction = (p: string) => new Dec(p.trim()).div(100).toString();
/** "0.03" (fraction) -> "3" (percent), exactly. */
export const fractionToPercent = (f: string) => new Dec(f).times(100).toString();

// ---------------------------------------------------------------------------------------------
// Rules

const money = (what: string) =>
  yup
    .string()
    .trim()
    .test('money', `Use an amount like 12,500.00 for the ${what} (no currency sign)`, (v) => !v || MONEY.test(v))
    .test('cents', 'Too many decimal places for this currency', function check(v) {
      if (!v || !MONEY.test(v)) return true;
      const currency = CURRENCY_OK(String(this.parent.currency ?? '').trim()) ? String(this.parent.currency).trim().toUpperCase() : 'USD';
      return Number.isSafeInteger(centsOrNaN(v, currency));
    });

const whole = (min: number, max: number, message: string) =>
  yup
    .string()
    .trim()
    .test('whole', message, (v) => !v || WHOLE.test(v))
    .test('range', message, (v) => !v || !WHOLE.test(v) || (Number(v) >= min && Number(v) <= max));

const percent = (message: string, below: string) =>
  yup
    .string()
    .trim()
    .test('percent', message, (v) => !v || (PERCENT.test(v) && new Dec(v).lt(below)));

const decimal = (message: string, ok: (d: InstanceType<typeof Dec>) => boolean) =>
  yup
    .string()
    .trim()
    .test('decimal', message, (v) => !v || (DECIMAL.test(v) && ok(new Dec(v))));

const whenOn = (flag: 'dimensionOn' | 'clampOn', schema: yup.StringSchema, required: string) =>
  schema.when(flag, { is: true, then: (s) => s.required(required) });

export const numbersFormSchema = yup.object({
  modificationCost: money('cost of the cut'),
  leadDays: whole(0, Number.MAX_SAFE_INTEGER, 'Use a whole number of days'),
  trialRoundsExpected: whole(0, Number.MAX_SAFE_INTEGER, 'Use a whole number of trial rounds'),
  newInsertCost: money('new insert'),
  duplicateToolCost: money('duplicate tool'),
  plannedUnits: whole(1, 1_000_000_000, 'Use a whole number from 1 to 1,000,000,000, or leave it empty'),
  partsPerUnit: whole(1, 1000, 'Use a whole number from 1 to 1,000'),
  scrapPercent: percent('Use a percent below 100, like 3', '100'),
  currency: yup
    .string()
    .trim()
    .test('currency', 'Use a 3-letter ISO 4217 code, e.g. USD', (v) => !v || CURRENCY_OK(v)),
  fob: money('FOB price'),
  freight: money('freight'),
  dutyPercent: decimal('Use a percent like 6.5 (at most 1000)', (d) => d.lte(1000)),
  wholesale: money('wholesale price'),
  retail: money('retail price'),
  dimensionOn: yup.boolean(),
  oldPartMm: whenOn('dimensionOn', decimal('Use millimetres above zero, like 31.2', (d) => d.gt(0)), 'Enter the part dimension now'),
  newPartMm: whenOn('dimensionOn', decimal('Use millimetres above zero, like 32.0', (d) => d.gt(0)), 'Enter the part dimension after the change'),
  resinId: yup
    .string()
    .when('dimensionOn', { is: true, then: (s) => s.required('Pick the resin').oneOf(resins.map((r) => r.id), 'Pick the resin') }),
  shrinkPercent: percent('Use a percent below 10, like 0.55', '10'),
  convention: yup.string().oneOf(['astm_d955', 'shop_shortcut']),
  formedBy: yup.string().oneOf(['recess', 'protrusion']),
  clampOn: yup.boolean(),
  projectedArea: whenOn('clampOn', decimal('Use an area above zero, like 41.5', (d) => d.gt(0)), 'Enter the projected area'),
  areaUnit: yup.string().oneOf(['cm2', 'in2']),
  factorId: yup
    .string()
    .when('clampOn', { is: true, then: (s) => s.required('Pick a clamp factor').oneOf(clampFactors.map((f) => f.id), 'Pick a clamp factor') }),
  factor: decimal('Use a factor above zero', (d) => d.gt(0)),
  safetyFactor: whenOn('clampOn', decimal('Use a multiplier from 1 to 3, like 1.1', (d) => d.gte(1) && d.lte(3)), 'Enter the safety factor (1 = none)'),
  pressTonnage: decimal('Use the press rating, above zero', (d) => d.gt(0)),
  pressUnit: yup.string().oneOf(['short_tons', 'tonnes_force', 'kn']),
});

// ---------------------------------------------------------------------------------------------
// Inputs -> form

/** Stored cents as people type them: 680000 -> "6,800.00". */
const centsText = (c: number | null, currency: string) => (c === null ? '' : formatCentsPlain(c, currency));
const numText = (n: number | null) => (n === null ? '' : String(n));

export function toFormValues(inputs: NumbersInputs, currency: string): NumbersFormValues {
  const { estimate: e, plan: p, dimension: d, clamp: c } = inputs;
  return {
    modificationCost: centsText(e.modificationCostCents, currency),
    leadDays: numText(e.leadDays),
    trialRoundsExpected: numText(e.trialRoundsExpected),
    newInsertCost: centsText(e.newInsertCents, currency),
    duplicateToolCost: centsText(e.duplicateToolCents, currency),
    plannedUnits: numText(p.plannedUnits),
    partsPerUnit: numText(p.partsPerUnit),
    scrapPercent: p.scrapRate === null ? '' : fractionToPercent(p.scrapRate),
    currency: p.currency ?? '',
    fob: centsText(p.fobCents, currency),
    freight: centsText(p.freightPerUnitCents, currency),
    dutyPercent: p.dutyPercent ?? '',
    wholesale: centsText(p.wholesaleCents, currency),
    retail: centsText(p.retailCents, currency),
    dimensionOn: d !== null,
    oldPartMm: d?.oldPartMm ?? '',
    newPartMm: d?.newPartMm ?? '',
    resinId: d?.resinId ?? '',
    shrinkPercent: d?.shrink ? fractionToPercent(d.shrink) : '',
    convention: d?.convention ?? 'astm_d955',
    formedBy: d?.formedBy ?? 'recess',
    clampOn: c !== null,
    projectedArea: c?.projectedArea ?? '',
    areaUnit: c?.areaUnit ?? 'cm2',
    factorId: c?.factorId ?? '',
    factor: c?.factor ?? '',
    safetyFactor: c?.safetyFactor ?? '1.1',
    pressTonnage: c?.pressTonnage ?? '',
    pressUnit: c?.pressUnit ?? 'short_tons',
  };
}

// ---------------------------------------------------------------------------------------------
// Form -> inputs

const blank = (v: string) => v.trim() === '';

/** Typed text to the API value: '' -> null; anything that does not convert stays as given (the schema then refuses it). */
function convertMoney(v: string, currency: string): number | string | null {
  if (blank(v)) return null;
  const c = centsOrNaN(v.trim(), currency);
  return Number.isFinite(c) ? c : v;
}
function convertWhole(v: string): number | string | null {
  if (blank(v)) return null;
  return WHOLE.test(v.trim()) ? Number(v.trim()) : v;
}
function convertPercent(v: string): string | null {
  if (blank(v)) return null;
  return PERCENT.test(v.trim()) ? percentToFraction(v) : v;
}
const text = (v: string) => (blank(v) ? null : v.trim());

/** The API's inputs for these form values (strict: a bad field stays bad, for the server to refuse). */
export function toNumbersPayload(v: NumbersFormValues, fallbackCurrency: string): NumbersInputsInput {
  const currency = formCurrency(v, fallbackCurrency);
  return {
    estimate: {
      modificationCostCents: convertMoney(v.modificationCost, currency),
      leadDays: convertWhole(v.leadDays),
      trialRoundsExpected: convertWhole(v.trialRoundsExpected),
      newInsertCents: convertMoney(v.newInsertCost, currency),
      duplicateToolCents: convertMoney(v.duplicateToolCost, currency),
    } as NumbersInputsInput['estimate'],
    plan: {
      plannedUnits: convertWhole(v.plannedUnits),
      partsPerUnit: convertWhole(v.partsPerUnit),
      scrapRate: convertPercent(v.scrapPercent),
      currency: text(v.currency),
      fobCents: convertMoney(v.fob, currency),
      freightPerUnitCents: convertMoney(v.freight, currency),
      dutyPercent: text(v.dutyPercent),
      wholesaleCents: convertMoney(v.wholesale, currency),
      retailCents: convertMoney(v.retail, currency),
    } as NumbersInputsInput['plan'],
    dimension: v.dimensionOn
      ? {
          oldPartMm: v.oldPartMm.trim(),
          newPartMm: v.newPartMm.trim(),
          resinId: v.resinId,
          shrink: convertPercent(v.shrinkPercent),
          convention: v.convention,
          formedBy: v.formedBy,
        }
      : null,
    clamp: v.clampOn
      ? {
          projectedArea: v.projectedArea.trim(),
          areaUnit: v.areaUnit,
          factorId: v.factorId,
          factor: text(v.factor),
          safetyFactor: v.safetyFactor.trim(),
          pressTonnage: text(v.pressTonnage),
          pressUnit: v.pressUnit,
        }
      : null,
  };
}

/** Keeps the fields the schema accepts and empties the rest. */
function keepValid<T extends Record<string, unknown>>(shape: Record<string, { safeParse: (v: unknown) => { success: boolean } }>, values: T): T {
  return Object.fromEntries(Object.entries(values).map(([k, val]) => [k, shape[k]?.safeParse(val).success ? val : null])) as T;
}

/**
 * The inputs to compute the live figures with while the engineer types: a field that does not
 * read yet counts as empty, and a check with a field that does not read yet is left out.
 */
export function toLiveInputs(v: NumbersFormValues, fallbackCurrency: string): NumbersInputs {
  const p = toNumbersPayload(v, fallbackCurrency);
  const estimate = keepValid(estimateInput.shape, p.estimate as Record<string, unknown>);
  const plan = keepValid(planInput.shape, p.plan as Record<string, unknown>);
  const dimension = p.dimension && dimensionCheckInput.safeParse(p.dimension).success ? p.dimension : null;
  const clamp = p.clamp && clampCheckInput.safeParse(p.clamp).success ? p.clamp : null;
  const parsed = numbersInputsSchema.safeParse({ estimate, plan, dimension, clamp });
  return parsed.success ? parsed.data : numbersInputsSchema.parse({});
}

/** Server field paths -> form fields, for errors the server sends back. */
export const serverFieldMap: Record<string, NumbersFormField> = {
  'estimate.modificationCostCents': 'modificationCost',
  'estimate.leadDays': 'leadDays',
  'estimate.trialRoundsExpected': 'trialRoundsExpected',
  'estimate.newInsertCents': 'newInsertCost',
  'estimate.duplicateToolCents': 'duplicateToolCost',
  'plan.plannedUnits': 'plannedUnits',
  'plan.partsPerUnit': 'partsPerUnit',
  'plan.scrapRate': 'scrapPercent',
  'plan.currency': 'currency',
  'plan.fobCents': 'fob',
  'plan.freightPerUnitCents': 'freight',
  'plan.dutyPercent': 'dutyPercent',
  'plan.wholesaleCents': 'wholesale',
  'plan.retailCents': 'retail',
  'dimension.oldPartMm': 'oldPartMm',
  'dimension.newPartMm': 'newPartMm',
  'dimension.resinId': 'resinId',
  'dimension.shrink': 'shrinkPercent',
  'clamp.projectedArea': 'projectedArea',
  'clamp.factorId': 'factorId',
  'clamp.factor': 'factor',
  'clamp.safetyFactor': 'safetyFactor',
  'clamp.pressTonnage': 'pressTonnage',
};
