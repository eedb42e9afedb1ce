// Yup rules for the product form, mirroring updateProductInput in shared/schemas/registry.ts (the
// server's zod schema stays the authority; tests/web/registry-forms.test.ts compares verdicts).
// Prices are typed in the currency's major unit and sent as exact integer cents.
import * as yup from 'yup';
import { centsToDecimalString, parseCents } from '@shared/domain/money';
import { productStatuses, type Product, type ProductStatus, type UpdateProductInput } from '@shared/schemas/registry';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const MONEY = /^(\d+|\d{1,3}(,\d{3})+)(\.\d+)?$/;

export interface ProductFormValues {
  sku: string;
  name: string;
  brandId: string;
  status: ProductStatus;
  fob: string;
  wholesale: string;
  retail: string;
  currency: string;
  plannedUnits: string;
}

/** Exact cents for the typed amount, NaN when it is not an amount in that currency. */
function centsOrNaN(text: string, currency: string): number {
  try {
    return parseCents(text, currency.trim().toUpperCase() || 'USD');
  } catch {
    return Number.NaN;
  }
}

const money = () =>
  yup
    .string()
    .trim()
    .test('money', `Use an amount like 12.99 (no currency sign)`, (v) => !v || MONEY.test(v))
    .test('cents', `Too many decimal places for this currency`, function check(v) {
      return !v || !MONEY.test(v) || Number.isFinite(centsOrNaN(v, String(this.parent.currency ?? 'USD')));
    });

export const productFormSchema = yup.object({
  sku: yup
    .string()
    .trim()
    .required('Enter the SKU, e.g. SR-2041')
    .matches(/^[A-Za-z0-9]+(?:[-_.][A-Za-z0-9]+)*$/, 'Use letters, digits and single - _ . separators, e.g. SR-2041')
    .min(2, 'Use at least 2 characters')
    .max(40, 'Use at most 40 characters'),
  name: yup.string().trim().required('Enter the product name').max(160, 'Use at most 160 characters'),
  brandId: yup.string().required('Pick the brand').matches(UUID, 'Pick the brand'),
  status: yup.string().required('Pick a status').oneOf(productStatuses, 'Pick a status'),
  currency: yup.string().trim().required('Enter the currency, e.g. USD').matches(/^[A-Za-z]{3}$/, 'Use a 3-letter ISO 4217 code, e.g. USD'),
  fob: money(),
  wholesale: money(),
  retail: money().test('order', 'Retail price is below the wholesale price', function check(v) {
    const cur = String(this.parent.currency ?? 'USD');
    const w = String(this.parent.wholesale ?? '').trim();
    if (!v || !w) return true;
    const r = centsOrNaN(v, cur);
    const wc = centsOrNaN(w, cur);
    return !Number.isFinite(r) || !Number.isFinite(wc) || r >= wc;
  }),
  plannedUnits: yup
    .string()
    .trim()
    .required('Enter the planned units (0 when none)')
    .matches(/^\d+$/, 'Use a whole number (digits only)')
    .test('range', 'At most 2,000,000,000', (v) => !v || !/^\d+$/.test(v) || Number(v) <= 2_000_000_000),
});

export function productFormFrom(p: Product): ProductFormValues {
  const m = (c: number | null) => (c === null ? '' : centsToDecimalString(c, p.currency));
  return {
    sku: p.sku,
    name: p.name,
    brandId: p.brand.id,
    status: p.status,
    fob: m(p.fobCents),
    wholesale: m(p.wholesaleCents),
    retail: m(p.retailCents),
    currency: p.currency,
    plannedUnits: String(p.plannedUnits),
  };
}

function convert(v: ProductFormValues) {
  const cur = v.currency.trim().toUpperCase();
  const cents = (s: string) => (s.trim() === '' ? null : centsOrNaN(s, cur));
  return {
    sku: v.sku.trim(),
    name: v.name.trim(),
    brandId: v.brandId,
    status: v.status,
    fobCents: cents(v.fob),
    wholesaleCents: cents(v.wholesale),
    retailCents: cents(v.retail),
    currency: cur,
    plannedUnits: v.plannedUnits.trim() === '' ? Number.NaN : Number(v.plannedUnits.trim()),
  };
}

/**
 * Only what changed, plus the version loaded. When any price or the currency changes, all three
 * prices and the currency go together, so the server checks retail against wholesale as a whole.
 */
export function toUpdateProductPayload(initial: ProductFormValues, v: ProductFormValues, version: number): UpdateProductInput {
  const before = convert(initial);
  const after = convert(v);
  const out: Record<string, unknown> = { version };
  for (const k of ['sku', 'name', 'brandId', 'status', 'plannedUnits'] as const) if (!Object.is(before[k], after[k])) out[k] = after[k];
  const priceKeys = ['fobCents', 'wholesaleCents', 'retailCents', 'currency'] as const;
  if (priceKeys.some((k) => !Object.is(before[k], after[k]))) for (const k of priceKeys) out[k] = after[k];
  return out as UpdateProductInput;
}

/** Server field names that differ from the form's. */
export const productServerFieldMap: Record<string, keyof ProductFormValues> = { fobCents: 'fob', wholesaleCents: 'wholesale', retailCents: 'retail' };
