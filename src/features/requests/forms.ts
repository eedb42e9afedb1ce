// The request form: its values, the Yup rules (UX only; they mirror shared/schemas/change-requests.ts
// and change-items.ts, and the server's zod schemas stay the authority), the payloads sent to the API,
// and the way server field errors ("items.2.size") land back on the form.
// tests/web/request-forms.test.ts compares the Yup and zod verdicts on the same inputs.
import Decimal from 'decimal.js';
import { setIn } from 'formik';
import * as yup from 'yup';
import { computeImpact, type ImpactItem, type ImpactResult } from '@shared/domain/impact';
import { safetyReview, type SafetyReview } from '@shared/domain/safety';
import { checkItemConsistency } from '@shared/domain/steel-direction';
import {
  imageRoles,
  itemMethods,
  markShapes,
  partEffects,
  safetyFlags as safetyFlagValues,
  sizeUnits,
  type ImageRole,
  type ItemMethod,
  type MarkShape,
  type PartEffect,
  type RegionMark,
  type SafetyFlag,
  type SizeUnit,
} from '@shared/schemas/change-items';
import type {
  CreateRequestInput,
  EditableRequestField,
  ImpactContext,
  ImpactProductDto,
  RequestDetail,
  RequestItemInput,
  UpdateRequestInput,
} from '@shared/schemas/change-requests';

export type DerivativeMode = 'none' | 'existing' | 'new';

/** A mark as the form holds it: percentages of the image as typed (the API stores fractions). */
export interface RegionFormValues {
  imageRole: ImageRole;
  shape: MarkShape;
  x: string;
  y: string;
  w: string;
  h: string;
}

export interface ItemFormValues {
  /** Local key for lists and uploads; the server id once saved. */
  key: string;
  id?: string;
  partId: string;
  effect: PartEffect | null;
  method: ItemMethod | null;
  size: string;
  unit: SizeUnit;
  note: string;
  safetyFlags: SafetyFlag[];
  region: RegionFormValues | null;
}

export interface ToolChoice {
  id: string;
  code: string;
  name: string;
}

export interface ProductChoice {
  id: string;
  sku: string;
  name: string;
}

export interface RequestFormValues {
  tool: ToolChoice | null;
  title: string;
  reason: string;
  derivativeMode: DerivativeMode;
  derivative: ProductChoice | null;
  newDerivative: { sku: string; name: string };
  targetDate: string;
  items: ItemFormValues[];
  movedProductIds: string[];
}

let keySeq = 0;
export const newItemKey = () => `new-${Date.now().toString(36)}-${(keySeq++).toString(36)}`;

export const emptyItem = (): ItemFormValues => ({
  key: newItemKey(),
  partId: '',
  effect: null,
  method: null,
  size: '',
  unit: 'mm',
  note: '',
  safetyFlags: [],
  region: null,
});

export const emptyRequestValues = (): RequestFormValues => ({
  tool: null,
  title: '',
  reason: '',
  derivativeMode: 'none',
  derivative: null,
  newDerivative: { sku: '', name: '' },
  targetDate: '',
  items: [emptyItem()],
  movedProductIds: [],
});

// ---------------------------------------------------------------------------------------------
// Fractions <-> percentages

/** 0.325 -> "32.5" (at most two decimals). */
export const toPercent = (fraction: number) => new Decimal(fraction).times(100).toDecimalPlaces(2).toString();

/** "32.5" -> 0.325; NaN when the text is not a number. */
export const fromPercent = (pct: string): number => {
  const t = pct.trim();
  if (!/^\d{1,3}(\.\d{1,4})?$/.test(t)) return Number.NaN;
  return new Decimal(t).div(100).toDecimalPlaces(6).toNumber();
};

export const regionToForm = (r: RegionMark): RegionFormValues => ({
  imageRole: r.imageRole,
  shape: r.shape,
  x: toPercent(r.x),
  y: toPercent(r.y),
  w: toPercent(r.w),
  h: toPercent(r.h),
});

export const regionFromForm = (r: RegionFormValues): RegionMark => ({
  imageRole: r.imageRole,
  shape: r.shape,
  x: fromPercent(r.x),
  y: fromPercent(r.y),
  w: fromPercent(r.w),
  h: fromPercent(r.h),
});

// ---------------------------------------------------------------------------------------------
// From the API

export function valuesFromDetail(r: RequestDetail): RequestFormValues {
  return {
    tool: { id: r.tool.id, code: r.tool.code, name: r.tool.name },
    title: r.title,
    reason: r.reason,
    derivativeMode: r.derivativeProduct ? 'existing' : 'none',
    derivative: r.derivativeProduct ? { ...r.derivativeProduct } : null,
    newDerivative: { sku: '', name: '' },
    targetDate: r.targetDate ?? '',
    items: r.items.map((i) => ({
      key: i.id,
      id: i.id,
      partId: i.partId,
      effect: i.effect,
      method: i.method,
      size: i.size,
      unit: i.unit,
      note: i.note,
      safetyFlags: [...i.safetyFlags],
      region: i.region ? regionToForm(i.region) : null,
    })),
    movedProductIds: [...r.movedProductIds],
  };
}

// ---------------------------------------------------------------------------------------------
// To the API

export function itemPayload(i: ItemFormValues): RequestItemInput {
  return {
    ...(i.id ? { id: i.id } : {}),
    partId: i.partId,
    // A missing choice is sent as it is, so the server's verdict matches the form's.
    effect: i.effect as PartEffect,
    method: i.method as ItemMethod,
    size: i.size.trim(),
    unit: i.unit,
    note: i.note.trim(),
    safetyFlags: [...i.safetyFlags],
    ...(i.region ? { region: regionFromForm(i.region) } : {}),
  };
}

export function createPayload(v: RequestFormValues): CreateRequestInput {
  return {
    toolId: v.tool?.id ?? '',
    title: v.title.trim(),
    reason: v.reason.trim(),
    derivativeProductId: v.derivativeMode === 'existing' ? (v.derivative?.id ?? null) : null,
    newDerivative: v.derivativeMode === 'new' ? { sku: v.newDerivative.sku.trim(), name: v.newDerivative.name.trim() } : null,
    targetDate: v.targetDate.trim() || null,
    items: v.items.map(itemPayload),
    movedProductIds: [...v.movedProductIds],
  };
}

/**
 * The PATCH body: only the fields the caller may change now. An autosave leaves a new derivative
 * product out (it is created only when the designer presses Save, never from a half-typed SKU).
 */
export function updatePayload(v: RequestFormValues, version: number, editable: readonly EditableRequestField[], opts: { auto?: boolean } = {}): UpdateRequestInput {
  const all = createPayload(v);
  const out: UpdateRequestInput = { version };
  const may = (f: EditableRequestField) => editable.includes(f);
  if (may('title')) out.title = all.title;
  if (may('reason')) out.reason = all.reason;
  if (may('targetDate')) out.targetDate = all.targetDate ?? null;
  if (may('derivativeProductId')) {
    if (v.derivativeMode === 'new') {
      if (!opts.auto && may('newDerivative')) out.newDerivative = all.newDerivative ?? null;
    } else {
      out.derivativeProductId = all.derivativeProductId ?? null;
    }
  }
  if (may('items')) out.items = all.items;
  if (may('movedProductIds')) out.movedProductIds = all.movedProductIds;
  return out;
}

/** What counts as "changed" between two versions of the form (local keys do not). */
export const comparable = (v: RequestFormValues) =>
  JSON.stringify({ ...createPayload(v), derivativeMode: v.derivativeMode, tool: v.tool?.id ?? null, newDerivative: v.newDerivative });

// ---------------------------------------------------------------------------------------------
// Live computations (the same shared functions the server runs)

/** Items complete enough to compute with: a part of this tool, an effect and a method. */
export function computableItems(v: RequestFormValues, context: ImpactContext | undefined): (ImpactItem & { index: number })[] {
  if (!context) return [];
  const parts = new Set(context.parts.map((p) => p.id));
  return v.items.flatMap((i, index) => (parts.has(i.partId) && i.effect && i.method ? [{ partId: i.partId, effect: i.effect, method: i.method, index }] : []));
}

export function liveImpact(v: RequestFormValues, context: ImpactContext | undefined): ImpactResult<ImpactProductDto> | null {
  if (!context || !v.tool || context.tool.id !== v.tool.id) return null;
  const items = computableItems(v, context);
  const products = new Set(context.products.map((p) => p.id));
  return computeImpact({
    tool: context.tool,
    items,
    parts: context.parts,
    products: context.products,
    billOfParts: context.billOfParts,
    movedProductIds: v.movedProductIds.filter((id) => products.has(id)),
  });
}

export const liveSafety = (v: RequestFormValues): SafetyReview => safetyReview(v.items);

// ---------------------------------------------------------------------------------------------
// Yup rules (mirroring the zod schemas' limits and messages)

const SIZE_PATTERN = /^(?:0|[1-9]\d{0,3})(?:\.\d{1,4})?$/;
const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** A real calendar date written YYYY-MM-DD (2027-02-31 is refused, as the server does). */
export function isCalendarDate(s: string): boolean {
  const m = ISO_DATE.exec(s);
  if (!m) return false;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const t = new Date(Date.UTC(y, mo - 1, d));
  return t.getUTCFullYear() === y && t.getUTCMonth() === mo - 1 && t.getUTCDate() === d;
}

const pct = (what: string) =>
  yup
    .string()
    .trim()
    .required(`Enter the ${what} as a percentage of the image`)
    .test('pct', `${what[0]!.toUpperCase()}${what.slice(1)} must be a number from 0 to 100`, (s) => {
      const f = fromPercent(s ?? '');
      return Number.isFinite(f) && f >= 0 && f <= 1;
    });

const regionSchema = yup
  .object({
    imageRole: yup.mixed<ImageRole>().oneOf(imageRoles).required(),
    shape: yup.mixed<MarkShape>().oneOf(markShapes).required(),
    x: pct('left edge'),
    y: pct('top edge'),
    w: pct('width').test('pos', 'Width must be greater than zero', (s) => fromPercent(s ?? '') > 0),
    h: pct('height').test('pos', 'Height must be greater than zero', (s) => fromPercent(s ?? '') > 0),
  })
  .test('fits', '', function fits(r) {
    if (!r) return true;
    const [x, y, w, h] = [r.x, r.y, r.w, r.h].map((s) => fromPercent(s ?? ''));
    if (x! + w! > 1 + 1e-9) return this.createError({ path: `${this.path}.w`, message: 'The mark runs past the right edge of the image' });
    if (y! + h! > 1 + 1e-9) return this.createError({ path: `${this.path}.h`, message: 'The mark runs past the bottom edge of the image' });
    return true;
  });

export const itemFormSchema = yup.object({
  key: yup.string().required(),
  id: yup.string().optional(),
  partId: yup.string().required('Pick the part this change affects'),
  effect: yup.mixed<PartEffect>().oneOf(partEffects, 'Say what happens to the part').nullable().required('Say what happens to the part'),
  method: yup
    .mixed<ItemMethod>()
    .oneOf(itemMethods, 'Pick how the toolmaker makes the change')
    .nullable()
    .required('Pick how the toolmaker makes the change')
    .test('consistent', '', function consistent(method) {
      const effect = this.parent.effect as PartEffect | null;
      if (!effect || !method) return true;
      const problem = checkItemConsistency({ effect, method });
      return problem ? this.createError({ message: problem }) : true;
    }),
  size: yup
    .string()
    .trim()
    .required('Enter the size or depth of the change, such as 0.8')
    .matches(SIZE_PATTERN, 'Enter the size as a number such as 0.8 (a point, not a comma)')
    .test('positive', 'The size must be greater than zero', (s) => !s || !SIZE_PATTERN.test(s) || new Decimal(s).greaterThan(0)),
  unit: yup.mixed<SizeUnit>().oneOf(sizeUnits).required(),
  note: yup.string().max(2000, 'Keep the note under 2000 characters').defined(),
  safetyFlags: yup.array(yup.mixed<SafetyFlag>().oneOf(safetyFlagValues).required()).required(),
  region: regionSchema.nullable().default(null),
});

export const requestFormSchema = yup.object({
  tool: yup
    .object({ id: yup.string().required(), code: yup.string().required(), name: yup.string().required() })
    .nullable()
    .required('Pick the tool to change'),
  title: yup
    .string()
    .trim()
    .required('Give the change a short title (at least 4 characters)')
    .min(4, 'Give the change a short title (at least 4 characters)')
    .max(160, 'Keep the title under 160 characters'),
  reason: yup.string().trim().max(4000, 'Keep the reason under 4000 characters').defined(),
  derivativeMode: yup.mixed<DerivativeMode>().oneOf(['none', 'existing', 'new']).required(),
  derivative: yup
    .object({ id: yup.string().required(), sku: yup.string().required(), name: yup.string().required() })
    .nullable()
    .when('derivativeMode', {
      is: 'existing',
      then: (s) => s.required('Pick the product, or choose "Create a new product"'),
    }),
  newDerivative: yup.object({
    sku: yup
      .string()
      .trim()
      .test('sku', '', function sku(v) {
        if (this.options.context?.mode !== 'new') return true;
        const t = (v ?? '').trim();
        if (t.length < 3) return this.createError({ message: 'Enter the SKU of the new product' });
        if (t.length > 40) return this.createError({ message: 'Keep the SKU under 40 characters' });
        if (!/^[A-Za-z0-9-]+$/.test(t)) return this.createError({ message: 'Use letters, digits and dashes only' });
        return true;
      }),
    name: yup
      .string()
      .trim()
      .test('name', '', function name(v) {
        if (this.options.context?.mode !== 'new') return true;
        const t = (v ?? '').trim();
        if (t.length < 2) return this.createError({ message: 'Enter the product name' });
        if (t.length > 120) return this.createError({ message: 'Keep the name under 120 characters' });
        return true;
      }),
  }),
  targetDate: yup
    .string()
    .trim()
    .defined()
    .test('date', 'Use a date like 2027-03-31', (s) => !s || isCalendarDate(s)),
  items: yup.array(itemFormSchema).max(50, 'At most 50 cut items on one request').required(),
  movedProductIds: yup.array(yup.string().required()).required(),
});

/** Validates with the derivative mode in the context (the new-product fields count only then). */
export const validateRequestForm = (v: RequestFormValues) => requestFormSchema.validate(v, { abortEarly: false, context: { mode: v.derivativeMode } });
export const isRequestFormValid = (v: RequestFormValues) => requestFormSchema.isValidSync(v, { context: { mode: v.derivativeMode } });

/** Yup's error list as Formik's nested error object. */
export function yupToFormErrors(e: unknown): Record<string, unknown> {
  let out: Record<string, unknown> = {};
  if (e instanceof yup.ValidationError) {
    const list = e.inner.length ? e.inner : [e];
    for (const err of list) {
      if (err.path && getPath(out, err.path) === undefined) out = setIn(out, err.path, err.message);
    }
  }
  return out;
}

function getPath(obj: unknown, path: string): unknown {
  return path
    .replace(/\[(\d+)\]/g, '.$1')
    .split('.')
    .reduce<unknown>((o, k) => (o && typeof o === 'object' ? (o as Record<string, unknown>)[k] : undefined), obj);
}

// ---------------------------------------------------------------------------------------------
// Server field errors -> form errors

/** Where a server field path lands on the form ("toolId" -> "tool", "items.2.region.w" -> "items.2.region.w"). */
export function formPathOf(serverPath: string): string | null {
  const parts = serverPath.split('.');
  const head = parts[0];
  switch (head) {
    case 'toolId':
      return 'tool';
    case 'title':
    case 'reason':
    case 'targetDate':
      return head;
    case 'derivativeProductId':
      return 'derivative';
    case 'newDerivative':
      return parts[1] === 'sku' || parts[1] === 'name' ? `newDerivative.${parts[1]}` : 'newDerivative.sku';
    case 'movedProductIds':
      return 'movedProductIds';
    case 'items': {
      const i = Number(parts[1]);
      if (!Number.isInteger(i) || i < 0) return null;
      const field = parts[2];
      if (!field) return null;
      if (field === 'region') return parts[3] && ['x', 'y', 'w', 'h'].includes(parts[3]) ? `items.${i}.region.${parts[3]}` : `items.${i}.region.x`;
      if (['partId', 'effect', 'method', 'size', 'unit', 'note', 'safetyFlags'].includes(field)) return `items.${i}.${field}`;
      return `items.${i}.partId`;
    }
    default:
      return null;
  }
}

/**
 * Splits server field errors into Formik errors (nested) and the messages that have no field on
 * the form (shown in the form's banner).
 */
export function serverErrorsToForm(fieldErrors: Record<string, string[]>): { errors: Record<string, unknown>; touched: Record<string, unknown>; other: string[] } {
  let errors: Record<string, unknown> = {};
  let touched: Record<string, unknown> = {};
  const other: string[] = [];
  for (const [key, messages] of Object.entries(fieldErrors)) {
    const message = messages[0];
    if (!message) continue;
    const path = formPathOf(key);
    if (!path) {
      other.push(message);
      continue;
    }
    if (getPath(errors, path) === undefined) {
      errors = setIn(errors, path, message);
      touched = setIn(touched, path, true);
    }
  }
  return { errors, touched, other };
}
