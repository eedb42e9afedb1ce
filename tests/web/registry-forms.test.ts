// The tool forms' Yup rules (client UX) and the server's zod inputs (the authority) must give the
// same verdict on the same input; and the payload helpers must send exactly what changed.
import { createToolInput, retentionDecisionInput, updateProductInput, updateToolInput } from '@shared/schemas/registry';
import { productFormFrom, productFormSchema, toUpdateProductPayload, type ProductFormValues } from '@/features/products/forms';
import {
  centsOrNaN,
  emptyToolForm,
  isCalendarDate,
  retentionFormSchema,
  toCreateToolPayload,
  toolCreateFormSchema,
  toolEditFormSchema,
  toolFormFrom,
  toRetentionPayload,
  toUpdateToolPayload,
  type RetentionFormValues,
  type ToolFormValues,
} from '@/features/tools/forms';

const BRAND = '7d8a3f0e-2b5c-4c1a-9e3f-0a1b2c3d4e5f';
const FACTORY = '0f1e2d3c-4b5a-4697-8887-a6b5c4d3e2f1';

const valid: ToolFormValues = {
  ...emptyToolForm,
  code: 'KB-T-0600',
  name: 'Ranger Finch head',
  brandId: BRAND,
  factoryId: FACTORY,
  construction: 'pre_hardened_steel',
  moldClass: '103',
  cavityCount: '4',
  weightKg: '380',
  buildCost: '18,500.00',
  currency: 'USD',
  buildDate: '2024-02-29',
  shotCount: '12000',
  lastRunDate: '2025-02-28',
  storageLocation: 'Bay C, rack 4',
};

const yupOk = (schema: { isValidSync: (v: unknown) => boolean }, v: unknown) => schema.isValidSync(v);

describe('new tool form rules', () => {
  it.each<[string, Partial<ToolFormValues>]>([
    ['a complete tool', {}],
    ['a lower-case code (the server upper-cases it)', { code: 'kb-t-0601' }],
    ['a code with a double hyphen', { code: 'KB--T' }],
    ['a two-character code', { code: 'KB' }],
    ['no name', { name: '   ' }],
    ['no brand', { brandId: '' }],
    ['no construction', { construction: '' }],
    ['mold class 106', { moldClass: '106' }],
    ['mold class 101', { moldClass: '101' }],
    ['own rated shots with their source', { ratedShots: '450000', ratedShotsSource: 'Mold maker quotation HQ-22-118' }],
    ['own rated shots without a source', { ratedShots: '450000', ratedShotsSource: '' }],
    ['rated shots of zero', { ratedShots: '0', ratedShotsSource: 'Quotation' }],
    ['rated shots with a decimal point', { ratedShots: '4.5', ratedShotsSource: 'Quotation' }],
    ['zero cavities', { cavityCount: '0' }],
    ['1001 cavities', { cavityCount: '1001' }],
    ['a weight of 0 kg', { weightKg: '0' }],
    ['a weight of 850.5 kg', { weightKg: '850.5' }],
    ['a weight over 200 t', { weightKg: '200001' }],
    ['no weight', { weightKg: '' }],
    ['a build cost with three decimals', { buildCost: '18500.005' }],
    ['a build cost with a currency sign', { buildCost: '$18,500' }],
    ['a yen build cost with decimals', { buildCost: '18500.50', currency: 'JPY' }],
    ['a yen build cost in whole yen', { buildCost: '1850000', currency: 'JPY' }],
    ['a two-letter currency', { currency: 'US' }],
    ['30 February', { buildDate: '2025-02-30', lastRunDate: '' }],
    ['29 February in a leap year', { buildDate: '2024-02-29', lastRunDate: '' }],
    ['a last run before the build', { buildDate: '2024-03-01', lastRunDate: '2024-02-28' }],
    ['a negative shot count', { shotCount: '-1' }],
    ['a status of disposed', { status: 'disposed' }],
    ['a status of idle', { status: 'idle' }],
    ['a 161-character location', { storageLocation: 'x'.repeat(161) }],
  ])('when the form holds %s, then yup and zod agree', (_name, change) => {
    const v = { ...valid, ...change };
    expect(yupOk(toolCreateFormSchema, v)).toBe(createToolInput.safeParse(toCreateToolPayload(v)).success);
  });

  it('when the build cost is typed with grouping, then the payload carries exact cents', () => {
    // 18,500.00 USD = 1,850,000 cents (USD has 2 minor digits, ISO 4217).
    expect(toCreateToolPayload(valid)).toMatchObject({ buildCostCents: 1_850_000, shotCount: 12_000, moldClass: 103, weightKg: 380 });
    // 0.1 + 0.2 style amounts stay exact: 0.29 USD is 29 cents, not 28.999...
    expect(centsOrNaN('0.29', 'USD')).toBe(29);
  });

  it('when no rated shots are typed, then neither they nor the source are sent (the class figure applies)', () => {
    const payload = toCreateToolPayload({ ...valid, ratedShotsSource: 'ignored' });
    expect(payload).not.toHaveProperty('ratedShots');
    expect(payload).not.toHaveProperty('ratedShotsSource');
  });
});

describe('edit tool form', () => {
  const tool = {
    id: '11111111-2222-4333-8444-555555555555',
    code: 'KB-T-0412',
    name: 'Ranger Kite head',
    brand: { id: BRAND, code: 'SR', name: 'Starling Rangers' },
    factory: { id: FACTORY, name: 'Harbourline Plastics' },
    construction: 'pre_hardened_steel' as const,
    moldClass: 103,
    ratedShots: 500_000,
    ratedShotsSource: 'Class 103 (published figure)',
    cavityCount: 4,
    weightKg: 380,
    buildCostCents: 1_850_000,
    currency: 'USD',
    buildDate: '2021-03-15',
    shotCount: 212_400,
    lastRunDate: '2026-10-21',
    status: 'active' as const,
    storageLocation: 'Harbourline bay C, rack 4',
    currentRevision: 1,
    version: 3,
    readOnly: false,
    life: { ratedShots: 500_000, shotCount: 212_400, remainingShots: 287_600, overShots: 0, percentUsed: '42.5', band: 'fresh' as const, sentence: '' },
    retention: { dueOn: null, state: 'not_due' as const, daysLeft: null, years: 3, decision: null },
    createdAt: '2026-01-01T00:00:00Z',
    updatedAt: '2026-01-01T00:00:00Z',
  };
  const initial = toolFormFrom(tool);

  it('when the loaded tool is shown, then the form holds its values as typed text', () => {
    expect(initial).toMatchObject({ buildCost: '18500.00', shotCount: '212400', moldClass: '103', weightKg: '380' });
    expect(yupOk(toolEditFormSchema, initial)).toBe(true);
  });

  it('when only the shot count changes, then only it and the version are sent', () => {
    expect(toUpdateToolPayload(initial, { ...initial, shotCount: '230000' }, 3)).toEqual({ version: 3, shotCount: 230_000 });
  });

  it('when only the mold class changes, then the rated shots are left for the server to follow the class', () => {
    const payload = toUpdateToolPayload(initial, { ...initial, moldClass: '102' }, 3);
    expect(payload).toEqual({ version: 3, moldClass: 102 });
    expect(updateToolInput.safeParse(payload).success).toBe(true);
  });

  it('when the rated shots change, then their source travels with them', () => {
    const payload = toUpdateToolPayload(initial, { ...initial, ratedShots: '450000', ratedShotsSource: 'Quotation HQ-22-118' }, 3);
    expect(payload).toEqual({ version: 3, ratedShots: 450_000, ratedShotsSource: 'Quotation HQ-22-118' });
  });

  it('when the tool is being changed, then its status is never sent', () => {
    const locked = toolFormFrom({ ...tool, status: 'in_change' });
    expect(toUpdateToolPayload(locked, { ...locked, name: 'Ranger Kite head v2' }, 3)).toEqual({ version: 3, name: 'Ranger Kite head v2' });
  });

  it.each<[string, Partial<ToolFormValues>]>([
    ['a new name', { name: 'Ranger Kite head (2)' }],
    ['a blank name', { name: '' }],
    ['cleared rated shots', { ratedShots: '', ratedShotsSource: 'x' }],
    ['rated shots with a one-letter source', { ratedShots: '450000', ratedShotsSource: 'Q' }],
    ['a cleared weight (not recorded)', { weightKg: '' }],
    ['a weight of -5', { weightKg: '-5' }],
    ['a cleared build cost', { buildCost: '' }],
    ['status retained', { status: 'retained' }],
  ])('when the edit holds %s, then yup and zod agree', (_n, change) => {
    const v = { ...initial, ...change };
    expect(yupOk(toolEditFormSchema, v)).toBe(updateToolInput.safeParse(toUpdateToolPayload(initial, v, 3)).success);
  });
});

describe('retention decision form', () => {
  it.each<[string, RetentionFormValues]>([
    ['keep until a date with a reason', { decision: 'keep_until', keepUntil: '2027-06-30', note: 'Possible reissue' }],
    ['keep without a date', { decision: 'keep_until', keepUntil: '', note: 'Possible reissue' }],
    ['keep until 31 June', { decision: 'keep_until', keepUntil: '2027-06-31', note: 'Possible reissue' }],
    ['scrap with a reason', { decision: 'scrap', keepUntil: '', note: 'Retired figure' }],
    ['scrap with a date left in the box', { decision: 'scrap', keepUntil: '2027-06-30', note: 'Retired figure' }],
    ['sell with a two-letter reason', { decision: 'sell', keepUntil: '', note: 'ok' }],
    ['no decision', { decision: '', keepUntil: '', note: 'Retired figure' }],
  ])('when the form holds %s, then yup and zod agree', (_n, v) => {
    expect(yupOk(retentionFormSchema, v)).toBe(retentionDecisionInput.safeParse(toRetentionPayload(v, 0)).success);
  });
});

describe('calendar dates', () => {
  it.each([
    ['2024-02-29', true], // 2024 is a leap year (divisible by 4, not by 100)
    ['2100-02-29', false], // 2100 is not (divisible by 100, not by 400): Gregorian rule
    ['2000-02-29', true], // 2000 is (divisible by 400)
    ['2025-04-31', false],
    ['2025-4-03', false],
  ])('when the text is %s, then it is a calendar date: %s', (text, ok) => {
    expect(isCalendarDate(text)).toBe(ok);
  });
});

describe('product form', () => {
  const product = {
    id: '11111111-2222-4333-8444-666666666666',
    sku: 'SR-1001',
    name: 'Ranger Kite',
    brand: { id: BRAND, code: 'SR', name: 'Starling Rangers' },
    status: 'reissue_planned' as const,
    fobCents: 310,
    wholesaleCents: 650,
    retailCents: 1299,
    currency: 'USD',
    plannedUnits: 40_000,
    version: 2,
    createdAt: '2026-01-01T00:00:00Z',
    updatedAt: '2026-01-01T00:00:00Z',
  };
  const initial = productFormFrom(product);

  it('when the loaded product is shown, then prices read as typed amounts', () => {
    // 1299 cents = 12.99 USD (2 minor digits, ISO 4217).
    expect(initial).toMatchObject({ fob: '3.10', wholesale: '6.50', retail: '12.99', plannedUnits: '40000' });
  });

  it('when only the retail price changes, then all prices and the currency travel together', () => {
    expect(toUpdateProductPayload(initial, { ...initial, retail: '13.49' }, 2)).toEqual({
      version: 2,
      fobCents: 310,
      wholesaleCents: 650,
      retailCents: 1349,
      currency: 'USD',
    });
  });

  it('when only the status changes, then only it and the version are sent', () => {
    expect(toUpdateProductPayload(initial, { ...initial, status: 'retired' }, 2)).toEqual({ version: 2, status: 'retired' });
  });

  it.each<[string, Partial<ProductFormValues>]>([
    ['a new name', { name: 'Ranger Kite (2027)' }],
    ['a blank name', { name: ' ' }],
    ['a lower-case SKU', { sku: 'sr-1001b' }],
    ['a SKU with a space', { sku: 'SR 1001' }],
    ['retail below wholesale', { retail: '5.99' }],
    ['retail equal to wholesale', { retail: '6.50' }],
    ['a price with three decimals', { fob: '3.105' }],
    ['a price with a currency sign', { fob: '$3.10' }],
    ['a cleared FOB cost', { fob: '' }],
    ['a grouped wholesale price', { wholesale: '1,250.00', retail: '2,499.00' }],
    ['negative planned units', { plannedUnits: '-5' }],
    ['no planned units', { plannedUnits: '' }],
    ['a lower-case currency', { currency: 'eur' }],
    ['an unknown status', { status: 'paused' as ProductFormValues['status'] }],
  ])('when the form holds %s, then yup and zod agree', (_n, change) => {
    const v = { ...initial, ...change };
    expect(yupOk(productFormSchema, v)).toBe(updateProductInput.safeParse(toUpdateProductPayload(initial, v, 2)).success);
  });
});
