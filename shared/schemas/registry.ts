import { z } from 'zod';
import { boundedDate } from './dates';
import { RETENTION_WINDOW_DAYS, RETENTION_YEARS } from '../domain/retention';

/**
 * The tool registry: tools, parts, products, the bill of parts and tool revisions.
 * DTOs (what the API returns) and inputs (what it accepts; server-owned fields left out).
 */

// ---------------------------------------------------------------------------------------------
// Vocabularies

export const constructions = ['aluminium', 'pre_hardened_steel', 'hardened_steel', 'stainless'] as const;
export const constructionSchema = z.enum(constructions);
export type Construction = z.infer<typeof constructionSchema>;
export const constructionLabels: Record<Construction, string> = {
  aluminium: 'Aluminium',
  pre_hardened_steel: 'Pre-hardened steel',
  hardened_steel: 'Hardened steel',
  stainless: 'Stainless steel',
};

export const toolStatuses = ['active', 'idle', 'in_change', 'retained', 'disposed'] as const;
export const toolStatusSchema = z.enum(toolStatuses);
export type ToolStatus = z.infer<typeof toolStatusSchema>;
export const toolStatusLabels: Record<ToolStatus, string> = {
  active: 'In production',
  idle: 'Idle',
  in_change: 'Being changed',
  retained: 'Kept in storage',
  disposed: 'Disposed',
};
/** Statuses a person may set by editing; `in_change` comes from a change request, `disposed` from a retention decision. */
export const editableToolStatuses = ['active', 'idle', 'retained'] as const;
export const editableToolStatusSchema = z.enum(editableToolStatuses, {
  message: 'Pick active, idle or retained: "being changed" is set by a change request and "disposed" by a retention decision',
});

export const productStatuses = ['in_line', 'reissue_planned', 'retired'] as const;
export const productStatusSchema = z.enum(productStatuses);
export type ProductStatus = z.infer<typeof productStatusSchema>;
export const productStatusLabels: Record<ProductStatus, string> = {
  in_line: 'In the line',
  reissue_planned: 'Reissue planned',
  retired: 'Retired',
};

export const lifeBands = ['fresh', 'worn', 'spent'] as const;
export const lifeBandSchema = z.enum(lifeBands);
export type LifeBandValue = z.infer<typeof lifeBandSchema>;
export const lifeBandLabels: Record<LifeBandValue, string> = {
  fresh: 'Good life left',
  worn: 'Over 80 % used',
  spent: 'Past rated life',
};

export const retentionDecisions = ['keep_until', 'scrap', 'sell'] as const;
export const retentionDecisionSchema = z.enum(retentionDecisions);
export type RetentionDecision = z.infer<typeof retentionDecisionSchema>;
export const retentionDecisionLabels: Record<RetentionDecision, string> = {
  keep_until: 'Keep until a date',
  scrap: 'Scrap',
  sell: 'Sell',
};

export const retentionStates = ['decided', 'no_date', 'overdue', 'due_soon', 'not_due'] as const;
export const retentionStateSchema = z.enum(retentionStates);

// ---------------------------------------------------------------------------------------------
// Field rules shared by inputs and CSV rows

export const isoDateSchema = z.iso.date({ message: 'Use a calendar date, YYYY-MM-DD' });
export const toolCodeSchema = z
  .string()
  .trim()
  .toUpperCase()
  .regex(/^[A-Z0-9]+(?:-[A-Z0-9]+)*$/, { message: 'Use letters, digits and single hyphens, e.g. KB-T-0412' })
  .min(3, { message: 'Use at least 3 characters' })
  .max(32, { message: 'Use at most 32 characters' });
export const skuSchema = z
  .string()
  .trim()
  .toUpperCase()
  .regex(/^[A-Z0-9]+(?:[-_.][A-Z0-9]+)*$/, { message: 'Use letters, digits and single - _ . separators, e.g. SR-2041' })
  .min(2, { message: 'Use at least 2 characters' })
  .max(40, { message: 'Use at most 40 characters' });
export const currencySchema = z
  .string()
  .trim()
  .toUpperCase()
  .regex(/^[A-Z]{3}$/, { message: 'Use a 3-letter ISO 4217 code, e.g. USD' });
export const centsSchema = z
  .number({ message: 'Enter an amount in whole cents' })
  .int({ message: 'Use whole cents' })
  .min(0, { message: 'Must not be negative' })
  .max(Number.MAX_SAFE_INTEGER);
export const moldClassSchema = z
  .number({ message: 'Pick a mold class from 101 to 105' })
  .int()
  .min(101, { message: 'Mold classes run from 101 to 105' })
  .max(105, { message: 'Mold classes run from 101 to 105' });
export const shotCountSchema = z.number().int({ message: 'Use a whole number of shots' }).min(0, { message: 'Must not be negative' }).max(Number.MAX_SAFE_INTEGER);
export const ratedShotsSchema = z
  .number()
  .int({ message: 'Use a whole number of shots' })
  .min(1, { message: 'Rated shots must be at least 1' })
  .max(2_000_000_000, { message: 'Rated shots must be at most 2,000,000,000' });
// Stored as numeric(9, 2): at most two decimals, so 0.001 kg (which would be stored as 0) is refused.
export const weightKgSchema = z
  .number()
  .positive({ message: 'Weight must be above 0 kg' })
  .max(200_000, { message: 'Weight must be at most 200,000 kg' })
  .refine((v) => Math.abs(v * 100 - Math.round(v * 100)) < 1e-6, { message: 'Give the weight in kilograms with at most 2 decimals, like 850.5' });
const nameSchema = (what: string, max = 160) => z.string().trim().min(1, { message: `Enter the ${what}` }).max(max, { message: `Use at most ${max} characters` });
const optionalText = (max: number) => z.string().trim().max(max, { message: `Use at most ${max} characters` }).transform((s) => (s === '' ? null : s));

// ---------------------------------------------------------------------------------------------
// DTOs

export const brandRefSchema = z.object({ id: z.string().uuid(), code: z.string(), name: z.string() });
export const factoryRefSchema = z.object({ id: z.string().uuid(), name: z.string() });
export const userRefSchema = z.object({ id: z.string().uuid(), name: z.string() });

export const toolLifeSchema = z.object({
  ratedShots: z.number().int(),
  shotCount: z.number().int(),
  remainingShots: z.number().int(),
  overShots: z.number().int(),
  /** One decimal place, e.g. "82.4"; may exceed "100.0". */
  percentUsed: z.string(),
  band: lifeBandSchema,
  sentence: z.string(),
});
export type ToolLifeDto = z.infer<typeof toolLifeSchema>;

export const retentionDecisionRecordSchema = z.object({
  decision: retentionDecisionSchema,
  keepUntil: isoDateSchema.nullable(),
  decidedBy: userRefSchema.nullable(),
  decidedAt: z.string(),
  note: z.string().nullable(),
});

export const toolRetentionSchema = z.object({
  /** When the keep-or-scrap decision falls due; null when decided or with no dates to count from. */
  dueOn: isoDateSchema.nullable(),
  state: retentionStateSchema,
  daysLeft: z.number().int().nullable(),
  /** The company's retention period used for dueOn. */
  years: z.number().int(),
  decision: retentionDecisionRecordSchema.nullable(),
});
export type ToolRetention = z.infer<typeof toolRetentionSchema>;

export const toolSchema = z.object({
  id: z.string().uuid(),
  code: z.string(),
  name: z.string(),
  brand: brandRefSchema,
  factory: factoryRefSchema,
  construction: constructionSchema,
  moldClass: z.number().int(),
  ratedShots: z.number().int(),
  ratedShotsSource: z.string(),
  cavityCount: z.number().int(),
  weightKg: z.number().nullable(),
  buildCostCents: z.number().int().nullable(),
  currency: z.string(),
  buildDate: isoDateSchema.nullable(),
  shotCount: z.number().int(),
  lastRunDate: isoDateSchema.nullable(),
  status: toolStatusSchema,
  storageLocation: z.string().nullable(),
  currentRevision: z.number().int(),
  /** Send back on every edit (optimistic locking). */
  version: z.number().int(),
  /** Disposed tools stay on record but refuse every edit. */
  readOnly: z.boolean(),
  life: toolLifeSchema,
  retention: toolRetentionSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Tool = z.infer<typeof toolSchema>;

export const partSchema = z.object({
  id: z.string().uuid(),
  toolId: z.string().uuid(),
  name: z.string(),
  resin: z.string(),
  cavitiesPerShot: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Part = z.infer<typeof partSchema>;

export const revisionSchema = z.object({
  id: z.string().uuid(),
  toolId: z.string().uuid(),
  number: z.number().int(),
  madeOn: isoDateSchema,
  /** The change request that made this revision (null for the tool as built, or history entered by hand). */
  changeRequestId: z.string().uuid().nullable(),
  note: z.string().nullable(),
  createdAt: z.string(),
});
export type Revision = z.infer<typeof revisionSchema>;

export const productSchema = z.object({
  id: z.string().uuid(),
  sku: z.string(),
  name: z.string(),
  brand: brandRefSchema,
  status: productStatusSchema,
  fobCents: z.number().int().nullable(),
  wholesaleCents: z.number().int().nullable(),
  retailCents: z.number().int().nullable(),
  currency: z.string(),
  plannedUnits: z.number().int(),
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Product = z.infer<typeof productSchema>;

export const billEntrySchema = z.object({
  id: z.string().uuid(),
  productId: z.string().uuid(),
  partId: z.string().uuid(),
  toolId: z.string().uuid(),
  revision: z.number().int(),
  quantityPerUnit: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type BillEntry = z.infer<typeof billEntrySchema>;

export const blockerSchema = z.object({
  kind: z.enum(['no_bill', 'tool_disposed', 'revision_superseded', 'revision_not_made']),
  toolCode: z.string().nullable(),
  partName: z.string().nullable(),
  message: z.string(),
});
export const makeabilitySchema = z.object({
  canBeMade: z.boolean(),
  reason: z.string(),
  blockers: z.array(blockerSchema),
  warnings: z.array(z.string()),
});
export type MakeabilityDto = z.infer<typeof makeabilitySchema>;

export const handlingSchema = z.object({
  weightKg: z.number().nullable(),
  weightKnown: z.boolean(),
  heavy: z.boolean(),
  summary: z.string(),
  caution: z.string(),
});

/** A product as seen from one tool revision. */
export const revisionProductSchema = z.object({
  id: z.string().uuid(),
  sku: z.string(),
  name: z.string(),
  status: productStatusSchema,
  /** The parts of this tool the product needs at this revision. */
  parts: z.array(z.object({ partId: z.string().uuid(), partName: z.string(), quantityPerUnit: z.number().int() })),
  /** This tool, as it is now, can mold those parts (the revision is current and the tool is not disposed). */
  moldableFromThisTool: z.boolean(),
  /** The whole product, all its tools considered. */
  canBeMade: z.boolean(),
  reason: z.string(),
});

/** The tool's change requests that are not closed, declined or withdrawn, as far as the caller may see them. */
export const openChangeSchema = z.object({ id: z.string().uuid(), title: z.string(), status: z.string() });

export const toolDetailSchema = toolSchema.extend({
  parts: z.array(partSchema.extend({ productCount: z.number().int() })),
  /** Newest first; each with the products bound to that revision. */
  revisions: z.array(revisionSchema.extend({ isCurrent: z.boolean(), products: z.array(revisionProductSchema) })),
  openChanges: z.array(openChangeSchema),
  handling: handlingSchema,
});
export type ToolDetail = z.infer<typeof toolDetailSchema>;

export const productBillLineSchema = z.object({
  id: z.string().uuid(),
  revision: z.number().int(),
  quantityPerUnit: z.number().int(),
  part: z.object({ id: z.string().uuid(), name: z.string(), resin: z.string(), cavitiesPerShot: z.number().int() }),
  tool: z.object({
    id: z.string().uuid(),
    code: z.string(),
    name: z.string(),
    status: toolStatusSchema,
    currentRevision: z.number().int(),
    factory: factoryRefSchema,
    life: toolLifeSchema,
  }),
  /** The tool can mold this part for this product now. */
  moldable: z.boolean(),
  problem: z.string().nullable(),
});

export const productDetailSchema = productSchema.extend({
  bill: z.array(productBillLineSchema),
  /** The tools the product depends on, with the revisions it needs from each. */
  tools: z.array(
    z.object({
      id: z.string().uuid(),
      code: z.string(),
      name: z.string(),
      status: toolStatusSchema,
      currentRevision: z.number().int(),
      revisionsNeeded: z.array(z.number().int()),
    }),
  ),
  makeability: makeabilitySchema,
  /** Bill lines on tools the caller may not see (toolmakers see their own factory only); counted in makeability. */
  hiddenLines: z.number().int(),
});
export type ProductDetail = z.infer<typeof productDetailSchema>;

export const pageMetaSchema = z.object({ nextCursor: z.string().nullable() });
export const toolListResponse = z.object({ data: z.array(toolSchema), meta: pageMetaSchema });
export type ToolListResponse = z.infer<typeof toolListResponse>;
export const productListItemSchema = productSchema.extend({ canBeMade: z.boolean(), toolCodes: z.array(z.string()) });
export type ProductListItem = z.infer<typeof productListItemSchema>;
export const productListResponse = z.object({ data: z.array(productListItemSchema), meta: pageMetaSchema });
export type ProductListResponse = z.infer<typeof productListResponse>;
export const retentionDueResponse = z.object({
  data: z.array(toolSchema),
  meta: z.object({ days: z.number().int(), years: z.number().int(), today: isoDateSchema }),
});
export type RetentionDueResponse = z.infer<typeof retentionDueResponse>;

export const retentionSettingsSchema = z.object({
  years: z.number().int(),
  min: z.number().int(),
  max: z.number().int(),
  default: z.number().int(),
});
export type RetentionSettings = z.infer<typeof retentionSettingsSchema>;

// ---------------------------------------------------------------------------------------------
// List queries (query-string values arrive as text)

const limitSchema = z.coerce.number().int().min(1).max(100).default(25);
const searchSchema = z.string().trim().max(100).optional().transform((s) => (s ? s : undefined));
const emptyToUndefined = (v: unknown) => (v === '' ? undefined : v);

export const listToolsQuery = z.object({
  /** Matches tool code or name, a part name, or a product name or SKU (case-insensitive, anywhere in the text). */
  q: searchSchema,
  brandId: z.preprocess(emptyToUndefined, z.string().uuid().optional()),
  factoryId: z.preprocess(emptyToUndefined, z.string().uuid().optional()),
  status: z.preprocess(emptyToUndefined, toolStatusSchema.optional()),
  lifeBand: z.preprocess(emptyToUndefined, lifeBandSchema.optional()),
  /** Only tools whose keep-or-scrap decision falls due within retentionDays (overdue included). */
  retentionDue: z.preprocess(emptyToUndefined, z.stringbool().optional()),
  retentionDays: z.coerce.number().int().min(1).max(3650).default(RETENTION_WINDOW_DAYS),
  /** Opaque; from meta.nextCursor of the previous page. */
  cursor: z.preprocess(emptyToUndefined, z.string().max(200).optional()),
  limit: limitSchema,
});
export type ListToolsQuery = z.input<typeof listToolsQuery>;
export type ListToolsFilters = z.output<typeof listToolsQuery>;

export const listProductsQuery = z.object({
  /** Matches SKU or name, or the code of a tool it depends on. */
  q: searchSchema,
  brandId: z.preprocess(emptyToUndefined, z.string().uuid().optional()),
  status: z.preprocess(emptyToUndefined, productStatusSchema.optional()),
  toolId: z.preprocess(emptyToUndefined, z.string().uuid().optional()),
  cursor: z.preprocess(emptyToUndefined, z.string().max(200).optional()),
  limit: limitSchema,
});
export type ListProductsQuery = z.input<typeof listProductsQuery>;

export const retentionDueQuery = z.object({
  days: z.coerce.number().int().min(1).max(3650).default(RETENTION_WINDOW_DAYS),
});

// ---------------------------------------------------------------------------------------------
// Inputs

const toolEditable = {
  name: nameSchema('tool name'),
  brandId: z.string().uuid({ message: 'Pick the brand' }),
  factoryId: z.string().uuid({ message: 'Pick the factory' }),
  construction: constructionSchema,
  moldClass: moldClassSchema,
  /** Leave out to take the mold class's published figure. */
  ratedShots: ratedShotsSchema,
  /** Where the rated shots come from; required with ratedShots. */
  ratedShotsSource: z.string().trim().min(3, { message: 'Say where the rated shots come from' }).max(500),
  cavityCount: z.number().int().min(1, { message: 'A tool has at least 1 cavity' }).max(1000),
  weightKg: weightKgSchema.nullable(),
  buildCostCents: centsSchema.nullable(),
  currency: currencySchema,
  buildDate: boundedDate().nullable(),
  shotCount: shotCountSchema,
  lastRunDate: boundedDate().nullable(),
  status: editableToolStatusSchema,
  storageLocation: optionalText(160).nullable(),
};

function ratedShotsNeedSource(v: { ratedShots?: number; ratedShotsSource?: string }, ctx: z.RefinementCtx) {
  if (v.ratedShots !== undefined && !v.ratedShotsSource) {
    ctx.addIssue({ code: 'custom', path: ['ratedShotsSource'], message: 'Say where the rated shots come from (e.g. the mold maker\'s quotation)' });
  }
}

function datesInOrder(v: { buildDate?: string | null; lastRunDate?: string | null }, ctx: z.RefinementCtx) {
  if (v.buildDate && v.lastRunDate && v.lastRunDate < v.buildDate) {
    ctx.addIssue({ code: 'custom', path: ['lastRunDate'], message: 'The last run cannot be before the build date' });
  }
}

export const createToolInput = z
  .object({
    code: toolCodeSchema,
    name: toolEditable.name,
    brandId: toolEditable.brandId,
    factoryId: toolEditable.factoryId,
    construction: toolEditable.construction,
    moldClass: toolEditable.moldClass,
    ratedShots: toolEditable.ratedShots.optional(),
    ratedShotsSource: toolEditable.ratedShotsSource.optional(),
    cavityCount: toolEditable.cavityCount,
    weightKg: toolEditable.weightKg.default(null),
    buildCostCents: toolEditable.buildCostCents.default(null),
    currency: toolEditable.currency.default('USD'),
    buildDate: toolEditable.buildDate.default(null),
    shotCount: toolEditable.shotCount.default(0),
    lastRunDate: toolEditable.lastRunDate.default(null),
    status: toolEditable.status.default('active'),
    storageLocation: toolEditable.storageLocation.default(null),
  })
  .superRefine(ratedShotsNeedSource)
  .superRefine(datesInOrder);
export type CreateToolInput = z.input<typeof createToolInput>;
export type CreateToolValues = z.output<typeof createToolInput>;

/** Every field optional except version. The tool code is steel-stamped on the mold and never changes. */
export const updateToolInput = z
  .object({
    version: z.number({ message: 'Send the version you loaded' }).int().min(0),
    name: toolEditable.name.optional(),
    brandId: toolEditable.brandId.optional(),
    factoryId: toolEditable.factoryId.optional(),
    construction: toolEditable.construction.optional(),
    moldClass: toolEditable.moldClass.optional(),
    ratedShots: toolEditable.ratedShots.optional(),
    ratedShotsSource: toolEditable.ratedShotsSource.optional(),
    cavityCount: toolEditable.cavityCount.optional(),
    weightKg: toolEditable.weightKg.optional(),
    buildCostCents: toolEditable.buildCostCents.optional(),
    currency: toolEditable.currency.optional(),
    buildDate: toolEditable.buildDate.optional(),
    shotCount: toolEditable.shotCount.optional(),
    lastRunDate: toolEditable.lastRunDate.optional(),
    status: toolEditable.status.optional(),
    storageLocation: toolEditable.storageLocation.optional(),
  })
  .strict()
  .superRefine(ratedShotsNeedSource)
  .superRefine(datesInOrder);
export type UpdateToolInput = z.input<typeof updateToolInput>;
export type UpdateToolValues = z.output<typeof updateToolInput>;

export const retentionDecisionInput = z
  .object({
    version: z.number({ message: 'Send the version you loaded' }).int().min(0),
    decision: retentionDecisionSchema,
    /** Required for keep_until: a date after today. */
    keepUntil: boundedDate().nullable().optional(),
    note: z.string().trim().min(3, { message: 'Say why (at least 3 characters)' }).max(1000),
  })
  .superRefine((v, ctx) => {
    if (v.decision === 'keep_until' && !v.keepUntil) ctx.addIssue({ code: 'custom', path: ['keepUntil'], message: 'Pick the date to keep the tool until' });
    if (v.decision !== 'keep_until' && v.keepUntil) ctx.addIssue({ code: 'custom', path: ['keepUntil'], message: 'Only a keep decision takes a date' });
  });
export type RetentionDecisionInput = z.input<typeof retentionDecisionInput>;

export const retentionYearsInput = z.object({
  years: z
    .number({ message: `Enter a whole number of years from ${RETENTION_YEARS.min} to ${RETENTION_YEARS.max}` })
    .int({ message: 'Use whole years' })
    .min(RETENTION_YEARS.min, { message: `At least ${RETENTION_YEARS.min} years` })
    .max(RETENTION_YEARS.max, { message: `At most ${RETENTION_YEARS.max} years` }),
});
export type RetentionYearsInput = z.infer<typeof retentionYearsInput>;

export const createPartInput = z.object({
  name: nameSchema('part name', 120),
  resin: z.string().trim().min(2, { message: 'Enter the resin, e.g. ABS' }).max(60),
  cavitiesPerShot: z.number().int().min(1, { message: 'A part takes at least 1 cavity' }).max(1000),
});
export type CreatePartInput = z.input<typeof createPartInput>;
export const updatePartInput = createPartInput.partial().strict();
export type UpdatePartInput = z.input<typeof updatePartInput>;

function pricesInOrder(v: { fobCents?: number | null; wholesaleCents?: number | null; retailCents?: number | null }, ctx: z.RefinementCtx) {
  if (v.wholesaleCents != null && v.retailCents != null && v.retailCents < v.wholesaleCents) {
    ctx.addIssue({ code: 'custom', path: ['retailCents'], message: 'Retail price is below the wholesale price' });
  }
}

const productEditable = {
  sku: skuSchema,
  name: nameSchema('product name'),
  brandId: z.string().uuid({ message: 'Pick the brand' }),
  status: productStatusSchema,
  fobCents: centsSchema.nullable(),
  wholesaleCents: centsSchema.nullable(),
  retailCents: centsSchema.nullable(),
  currency: currencySchema,
  plannedUnits: z.number().int().min(0, { message: 'Must not be negative' }).max(2_000_000_000),
};

export const createProductInput = z
  .object({
    ...productEditable,
    status: productEditable.status.default('in_line'),
    fobCents: productEditable.fobCents.default(null),
    wholesaleCents: productEditable.wholesaleCents.default(null),
    retailCents: productEditable.retailCents.default(null),
    currency: productEditable.currency.default('USD'),
    plannedUnits: productEditable.plannedUnits.default(0),
  })
  .superRefine(pricesInOrder);
export type CreateProductInput = z.input<typeof createProductInput>;
export type CreateProductValues = z.output<typeof createProductInput>;

export const updateProductInput = z
  .object({
    version: z.number({ message: 'Send the version you loaded' }).int().min(0),
    sku: productEditable.sku.optional(),
    name: productEditable.name.optional(),
    brandId: productEditable.brandId.optional(),
    status: productEditable.status.optional(),
    fobCents: productEditable.fobCents.optional(),
    wholesaleCents: productEditable.wholesaleCents.optional(),
    retailCents: productEditable.retailCents.optional(),
    currency: productEditable.currency.optional(),
    plannedUnits: productEditable.plannedUnits.optional(),
  })
  .strict()
  .superRefine(pricesInOrder);
export type UpdateProductInput = z.input<typeof updateProductInput>;
export type UpdateProductValues = z.output<typeof updateProductInput>;

export const createBillEntryInput = z.object({
  partId: z.string().uuid({ message: 'Pick the part' }),
  /** Leave out to bind to the tool's current revision. */
  revision: z.number().int().min(1).optional(),
  quantityPerUnit: z.number().int().min(1, { message: 'At least 1 per unit' }).max(1000).default(1),
});
export type CreateBillEntryInput = z.input<typeof createBillEntryInput>;
export const updateBillEntryInput = z
  .object({
    revision: z.number().int().min(1),
    quantityPerUnit: z.number().int().min(1, { message: 'At least 1 per unit' }).max(1000),
  })
  .partial()
  .strict();
export type UpdateBillEntryInput = z.input<typeof updateBillEntryInput>;

// ---------------------------------------------------------------------------------------------
// CSV import and export
//
// One CSV per kind, with a header row; column order is free, names are case-insensitive, cells
// are trimmed. An empty cell (or a missing optional column) means "not given": a new record takes
// the default, an existing one keeps its stored value (the CSV never clears a value). Money columns
// are amounts in the currency's major unit with at most its minor digits ("45000.00" or
// "45,000.00" USD), parsed exactly, never through floating point. Dates are YYYY-MM-DD.
// A row whose key already exists updates that record (tools by code, parts by tool code + part
// name, products by SKU, bill lines by SKU + tool code + part name).

export const importKinds = ['tools', 'parts', 'products', 'bill'] as const;
export const importKindSchema = z.enum(importKinds);
export type ImportKind = z.infer<typeof importKindSchema>;

export const importQuery = z.object({
  kind: importKindSchema,
  /** true (the default): check and preview only; false: apply every row in one transaction, or none. */
  dryRun: z.preprocess(emptyToUndefined, z.stringbool().default(true)),
});

const cell = z.string().trim();
const optionalCell = z
  .string()
  .trim()
  .optional()
  .transform((s) => (s ? s : undefined));
const intCell = (field: z.ZodNumber) =>
  z
    .string()
    .trim()
    .regex(/^\d+$/, { message: 'Use a whole number (digits only)' })
    .transform((s) => Number(s))
    .pipe(field);
const optionalIntCell = (field: z.ZodNumber) => z.union([z.undefined(), z.literal('').transform(() => undefined), intCell(field)]).optional();
const optionalDateCell = z.union([z.undefined(), z.literal('').transform(() => undefined), boundedDate()]).optional();
/** Money as typed: "45000.00"; turned into cents by the importer once the row's currency is known. */
const moneyCell = z.union([z.undefined(), z.literal('').transform(() => undefined), z.string().trim().regex(/^(\d+|\d{1,3}(,\d{3})+)(\.\d+)?$/, { message: 'Use an amount like 45000.00 or 45,000.00 (no currency sign)' })]).optional();

export const toolCsvRow = z.object({
  code: toolCodeSchema,
  name: nameSchema('tool name'),
  brand_code: cell.toUpperCase().min(1, { message: 'Enter the brand code' }),
  factory: cell.min(1, { message: 'Enter the factory name' }),
  construction: cell.toLowerCase().pipe(constructionSchema),
  mold_class: intCell(moldClassSchema),
  rated_shots: optionalIntCell(ratedShotsSchema),
  // the same rules as the API's tool fields (one rule whichever way a tool is written)
  rated_shots_source: optionalCell.pipe(toolEditable.ratedShotsSource.optional()),
  cavity_count: intCell(toolEditable.cavityCount),
  weight_kg: z.union([
    z.undefined(),
    z.literal('').transform(() => undefined),
    z.string().trim().regex(/^\d+(\.\d{1,2})?$/, { message: 'Use kilograms like 850 or 850.5' }).transform(Number).pipe(weightKgSchema),
  ]).optional(),
  build_cost: moneyCell,
  currency: z.union([z.undefined(), z.literal('').transform(() => undefined), currencySchema]).optional(),
  build_date: optionalDateCell,
  shot_count: optionalIntCell(shotCountSchema),
  last_run_date: optionalDateCell,
  /** active, idle or retained; in_change and disposed are accepted only where the tool already has them (re-imported exports). */
  status: z.union([z.undefined(), z.literal('').transform(() => undefined), cell.toLowerCase().pipe(toolStatusSchema)]).optional(),
  storage_location: optionalCell.pipe(z.string().max(160, { message: 'Use at most 160 characters' }).optional()),
});
export type ToolCsvRow = z.output<typeof toolCsvRow>;

export const partCsvRow = z.object({
  tool_code: toolCodeSchema,
  part_name: nameSchema('part name', 120),
  resin: cell.min(2, { message: 'Enter the resin, e.g. ABS' }).max(60),
  cavities_per_shot: intCell(z.number().int().min(1, { message: 'A part takes at least 1 cavity' }).max(1000)),
});
export type PartCsvRow = z.output<typeof partCsvRow>;

export const productCsvRow = z.object({
  sku: skuSchema,
  name: nameSchema('product name'),
  brand_code: cell.toUpperCase().min(1, { message: 'Enter the brand code' }),
  status: z.union([z.undefined(), z.literal('').transform(() => undefined), cell.toLowerCase().pipe(productStatusSchema)]).optional(),
  fob: moneyCell,
  wholesale: moneyCell,
  retail: moneyCell,
  currency: z.union([z.undefined(), z.literal('').transform(() => undefined), currencySchema]).optional(),
  planned_units: optionalIntCell(z.number().int().min(0).max(2_000_000_000)),
});
export type ProductCsvRow = z.output<typeof productCsvRow>;

export const billCsvRow = z.object({
  sku: skuSchema,
  tool_code: toolCodeSchema,
  part_name: nameSchema('part name', 120),
  revision: optionalIntCell(z.number().int().min(1)),
  quantity_per_unit: optionalIntCell(z.number().int().min(1, { message: 'At least 1 per unit' }).max(1000)),
});
export type BillCsvRow = z.output<typeof billCsvRow>;

// The import's columns are the row schemas' keys; a column is required when its cell may not be left out.
const columnsOfRow = <S extends z.ZodRawShape>(row: z.ZodObject<S>) => Object.keys(row.shape) as (keyof S & string)[];
const requiredOfRow = (row: z.ZodObject<z.ZodRawShape>) => columnsOfRow(row).filter((column) => !z.safeParse(row.shape[column]!, undefined).success);

export const toolCsvColumns = columnsOfRow(toolCsvRow);
/** Extra columns in the export; accepted and ignored by the import, so an export can be re-imported. */
export const toolCsvExportOnlyColumns = ['current_revision', 'remaining_shots', 'percent_used', 'life_band', 'retention_due_on'] as const;
export const partCsvColumns = columnsOfRow(partCsvRow);
export const productCsvColumns = columnsOfRow(productCsvRow);
export const billCsvColumns = columnsOfRow(billCsvRow);
/** The columns of each kind's file, as the template and the import screen list them. */
export const csvColumnsOf: Record<ImportKind, readonly string[]> = { tools: toolCsvColumns, parts: partCsvColumns, products: productCsvColumns, bill: billCsvColumns };
export const requiredCsvColumns: Record<ImportKind, readonly string[]> = {
  tools: requiredOfRow(toolCsvRow),
  parts: requiredOfRow(partCsvRow),
  products: requiredOfRow(productCsvRow),
  bill: requiredOfRow(billCsvRow),
};

export const importRowSchema = z.object({
  /** Line number in the file (the header is line 1). */
  line: z.number().int(),
  /** The row's natural key as written, e.g. "KB-T-0412" or "KB-T-0412 / Head". */
  key: z.string(),
  action: z.enum(['create', 'update', 'unchanged', 'error']),
  errors: z.array(z.object({ column: z.string().nullable(), message: z.string() })),
});
export type ImportRow = z.infer<typeof importRowSchema>;

export const importReportSchema = z.object({
  kind: importKindSchema,
  dryRun: z.boolean(),
  /** True only when a real run wrote every row. */
  applied: z.boolean(),
  totalRows: z.number().int(),
  created: z.number().int(),
  updated: z.number().int(),
  unchanged: z.number().int(),
  errorRows: z.number().int(),
  /** Problems with the file as a whole (missing or unknown columns, unreadable CSV). */
  fileErrors: z.array(z.string()),
  rows: z.array(importRowSchema),
});
export type ImportReport = z.infer<typeof importReportSchema>;
