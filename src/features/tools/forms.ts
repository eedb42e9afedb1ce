// Yup rules for the tool forms. They mirror createToolInput / updateToolInput /
// retentionDecisionInput in shared/schemas/registry.ts (the server's zod schemas stay the
// authority); tests/web/registry-forms.test.ts checks that both give the same verdict.
// The form holds text (what people type); the payload functions turn it into the API's types.
import { format, isValid, parseISO } from 'date-fns';
import * as yup from 'yup';
import { centsToDecimalString, parseCents } from '@shared/domain/money';
import {
  constructions,
  editableToolStatuses,
  retentionDecisions,
  type Construction,
  type CreateToolInput,
  type RetentionDecision,
  type RetentionDecisionInput,
  type Tool,
  type ToolStatus,
  type UpdateToolInput,
} from '@shared/schemas/registry';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const WHOLE = /^\d+$/;
const KG = /^\d+(\.\d+)?$/;
const MONEY = /^(\d+|\d{1,3}(,\d{3})+)(\.\d+)?$/;

export function isCalendarDate(s: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(s)) return false;
  const d = parseISO(s);
  return isValid(d) && format(d, 'yyyy-MM-dd') === s;
}

/** Exact cents for the typed amount in the form's currency, or NaN when it is not an amount. */
export function centsOrNaN(text: string, currency: string): number {
  try {
    return parseCents(text, currency.trim().toUpperCase() || 'USD');
  } catch {
    return Number.NaN;
  }
}

const int = (min: number, max: number, what: string) =>
  yup
    .string()
    .trim()
    .required(`Enter the ${what}`)
    .matches(WHOLE, 'Use a whole number (digits only)')
    .test('range', `Use a number from ${min.toLocaleString('en-US')} to ${max.toLocaleString('en-US')}`, (v) => !v || (Number(v) >= min && Number(v) <= max));

const optionalDate = yup
  .string()
  .trim()
  .test('date', 'Use a calendar date, YYYY-MM-DD', (v) => !v || isCalendarDate(v));

export interface ToolFormValues {
  /** Create only: the code is stamped in the steel and never changes. */
  code: string;
  name: string;
  brandId: string;
  factoryId: string;
  construction: Construction | '';
  moldClass: string;
  ratedShots: string;
  ratedShotsSource: string;
  cavityCount: string;
  weightKg: string;
  /** In the currency's major unit ("18500.00"). */
  buildCost: string;
  currency: string;
  buildDate: string;
  shotCount: string;
  lastRunDate: string;
  status: ToolStatus;
  storageLocation: string;
}

const commonShape = {
  name: yup.string().trim().required('Enter the tool name').max(160, 'Use at most 160 characters'),
  brandId: yup.string().required('Pick the brand').matches(UUID, 'Pick the brand'),
  factoryId: yup.string().required('Pick the factory').matches(UUID, 'Pick the factory'),
  construction: yup.string().required('Pick the construction').oneOf(constructions, 'Pick the construction'),
  moldClass: yup.string().required('Pick a mold class from 101 to 105').matches(/^10[1-5]$/, 'Mold classes run from 101 to 105'),
  ratedShotsSource: yup
    .string()
    .trim()
    .max(500, 'Use at most 500 characters')
    .when('ratedShots', {
      is: (v: string | undefined) => !!v?.trim(),
      then: (s) => s.required("Say where the rated shots come from (e.g. the mold maker's quotation)").min(3, 'Say where the rated shots come from'),
    }),
  cavityCount: int(1, 1000, 'cavity count'),
  weightKg: yup
    .string()
    .trim()
    .test('kg', 'Use kilograms like 850 or 850.5', (v) => !v || KG.test(v))
    .test('range', 'Weight must be above 0 and at most 200,000 kg', (v) => !v || !KG.test(v) || (Number(v) > 0 && Number(v) <= 200_000)),
  currency: yup.string().trim().required('Enter the currency, e.g. USD').matches(/^[A-Za-z]{3}$/, 'Use a 3-letter ISO 4217 code, e.g. USD'),
  buildCost: yup
    .string()
    .trim()
    .test('money', 'Use an amount like 18500.00 or 18,500.00 (no currency sign)', (v) => !v || MONEY.test(v))
    .test('cents', 'Too many decimal places for this currency', function check(v) {
      return !v || !MONEY.test(v) || Number.isFinite(centsOrNaN(v, String(this.parent.currency ?? 'USD')));
    }),
  buildDate: optionalDate,
  shotCount: int(0, Number.MAX_SAFE_INTEGER, 'shot count'),
  lastRunDate: optionalDate.test('order', 'The last run cannot be before the build date', function check(v) {
    const build = String(this.parent.buildDate ?? '').trim();
    return !v || !build || !isCalendarDate(v) || !isCalendarDate(build) || v >= build;
  }),
  status: yup.string().required('Pick a status').oneOf([...editableToolStatuses], 'Pick active, idle or retained'),
  storageLocation: yup.string().trim().max(160, 'Use at most 160 characters'),
};

const ratedShotsRule = yup
  .string()
  .trim()
  .test('whole', 'Use a whole number of shots', (v) => !v || WHOLE.test(v))
  .test('range', 'Rated shots must be from 1 to 2,000,000,000', (v) => !v || !WHOLE.test(v) || (Number(v) >= 1 && Number(v) <= 2_000_000_000));

export const toolCreateFormSchema = yup.object({
  code: yup
    .string()
    .trim()
    .required('Enter the tool code, e.g. KB-T-0412')
    .matches(/^[A-Za-z0-9]+(?:-[A-Za-z0-9]+)*$/, 'Use letters, digits and single hyphens, e.g. KB-T-0412')
    .min(3, 'Use at least 3 characters')
    .max(32, 'Use at most 32 characters'),
  ...commonShape,
  /** Empty: take the mold class's published figure. */
  ratedShots: ratedShotsRule,
});

/** Editing: the code is fixed, and the rated shots stay filled in (the source says where they come from). */
export const toolEditFormSchema = yup.object({
  ...commonShape,
  ratedShots: ratedShotsRule.required('Enter the rated shots'),
  // A tool already "being changed" keeps that status; the field is then read-only.
  status: yup.string().required('Pick a status'),
});

export const emptyToolForm: ToolFormValues = {
  code: '',
  name: '',
  brandId: '',
  factoryId: '',
  construction: '',
  moldClass: '',
  ratedShots: '',
  ratedShotsSource: '',
  cavityCount: '',
  weightKg: '',
  buildCost: '',
  currency: 'USD',
  buildDate: '',
  shotCount: '0',
  lastRunDate: '',
  status: 'active',
  storageLocation: '',
};

export function toolFormFrom(t: Tool): ToolFormValues {
  return {
    code: t.code,
    name: t.name,
    brandId: t.brand.id,
    factoryId: t.factory.id,
    construction: t.construction,
    moldClass: String(t.moldClass),
    ratedShots: String(t.ratedShots),
    ratedShotsSource: t.ratedShotsSource,
    cavityCount: String(t.cavityCount),
    weightKg: t.weightKg === null ? '' : String(t.weightKg),
    buildCost: t.buildCostCents === null ? '' : centsToDecimalString(t.buildCostCents, t.currency),
    currency: t.currency,
    buildDate: t.buildDate ?? '',
    shotCount: String(t.shotCount),
    lastRunDate: t.lastRunDate ?? '',
    status: t.status,
    storageLocation: t.storageLocation ?? '',
  };
}

// Text to API values. Bad text becomes NaN (or stays text) so the server's schema refuses it.
const num = (s: string) => (s.trim() === '' ? Number.NaN : Number(s.trim()));
const orNull = (s: string) => (s.trim() === '' ? null : s.trim());
const numOrNull = (s: string) => (s.trim() === '' ? null : Number(s.trim()));
const cents = (v: ToolFormValues) => (v.buildCost.trim() === '' ? null : centsOrNaN(v.buildCost, v.currency));

type Converted = Omit<Required<CreateToolInput>, 'ratedShots' | 'ratedShotsSource'> & { ratedShots?: number; ratedShotsSource?: string };

function convert(v: ToolFormValues): Converted {
  const rated = v.ratedShots.trim();
  return {
    code: v.code.trim(),
    name: v.name.trim(),
    brandId: v.brandId,
    factoryId: v.factoryId,
    construction: v.construction as Construction,
    moldClass: num(v.moldClass),
    ...(rated ? { ratedShots: num(rated), ratedShotsSource: v.ratedShotsSource.trim() } : {}),
    cavityCount: num(v.cavityCount),
    weightKg: numOrNull(v.weightKg),
    buildCostCents: cents(v),
    currency: v.currency.trim().toUpperCase(),
    buildDate: orNull(v.buildDate),
    shotCount: num(v.shotCount),
    lastRunDate: orNull(v.lastRunDate),
    status: v.status as CreateToolInput['status'] & string,
    storageLocation: orNull(v.storageLocation),
  };
}

export function toCreateToolPayload(v: ToolFormValues): CreateToolInput {
  return convert(v);
}

const editableKeys = [
  'name',
  'brandId',
  'factoryId',
  'construction',
  'moldClass',
  'cavityCount',
  'weightKg',
  'buildCostCents',
  'currency',
  'buildDate',
  'shotCount',
  'lastRunDate',
  'status',
  'storageLocation',
] as const;

/**
 * Only what changed, plus the version loaded. The rated shots and their source travel together;
 * left alone, they follow a new mold class on the server when they came from the old class.
 */
export function toUpdateToolPayload(initial: ToolFormValues, v: ToolFormValues, version: number): UpdateToolInput {
  const before = convert(initial);
  const after = convert(v);
  const out: Record<string, unknown> = { version };
  for (const k of editableKeys) {
    if (k === 'status' && !(editableToolStatuses as readonly string[]).includes(v.status)) continue;
    if (!Object.is(before[k], after[k])) out[k] = after[k];
  }
  if (initial.ratedShots.trim() !== v.ratedShots.trim() || initial.ratedShotsSource.trim() !== v.ratedShotsSource.trim()) {
    out.ratedShots = num(v.ratedShots);
    out.ratedShotsSource = v.ratedShotsSource.trim();
  }
  return out as UpdateToolInput;
}

/** Server field names that differ from the form's. */
export const toolServerFieldMap: Record<string, keyof ToolFormValues> = { buildCostCents: 'buildCost' };

// Retention decision

export interface RetentionFormValues {
  decision: RetentionDecision | '';
  keepUntil: string;
  note: string;
}

export const retentionFormSchema = yup.object({
  decision: yup.string().required('Pick keep, scrap or sell').oneOf(retentionDecisions, 'Pick keep, scrap or sell'),
  keepUntil: yup
    .string()
    .trim()
    .when('decision', {
      is: 'keep_until',
      then: (s) => s.required('Pick the date to keep the tool until').test('date', 'Use a calendar date, YYYY-MM-DD', (v) => !v || isCalendarDate(v)),
    }),
  note: yup.string().trim().required('Say why (at least 3 characters)').min(3, 'Say why (at least 3 characters)').max(1000, 'Use at most 1000 characters'),
});

export function toRetentionPayload(v: RetentionFormValues, version: number): RetentionDecisionInput {
  return {
    version,
    decision: v.decision as RetentionDecision,
    keepUntil: v.decision === 'keep_until' ? v.keepUntil.trim() : null,
    note: v.note.trim(),
  };
}
