import { z } from 'zod';
import { boundedDate } from './dates';
import type { ImpactResult, BillOfPartsLine, ImpactPart, ImpactTool } from '../domain/impact';
import type { SafetyReview } from '../domain/safety';
import type { GateGap } from '../domain/gates';
import type { ValueAtRiskResult } from '../domain/value-at-risk';
import type { SteelDirection } from '../domain/steel-direction';
import { requestActions, requestStates } from '../domain/lifecycle';
import { checkItemConsistency } from '../domain/steel-direction';
import { changeItemFields, changeItemSchema } from './change-items';
import { signOffSchema, workflowInfoSchema } from './sign-offs';

// The contract of the change-request API (server and app both import it).

export const requestStatusSchema = z.enum(requestStates);
export type RequestStatus = z.infer<typeof requestStatusSchema>;

/** Human reference of a request: CR-0007. */
export const requestRef = (n: number) => `CR-${String(n).padStart(4, '0')}`;

/** A real calendar date (2027-02-31 is refused). */
const isoDate = boundedDate('Use a date like 2027-03-31');

export const newDerivativeInput = z.object({
  sku: z
    .string()
    .trim()
    .min(3, { message: 'Enter the SKU of the new product' })
    .max(40)
    .regex(/^[A-Za-z0-9-]+$/, { message: 'Use letters, digits and dashes only' }),
  name: z.string().trim().min(2, { message: 'Enter the product name' }).max(120),
});

/**
 * A cut item as a request form sends it: `changeItemInput` plus the optional `id` of an item already
 * on the request. Items are sent as the whole list; an item with the id of an existing item updates
 * it in place (its attachments stay linked), one without an id is new, and an existing item left out
 * of the list is removed.
 */
export const requestItemInput = changeItemFields.extend({ id: z.uuid().optional() }).superRefine((item, ctx) => {
  const problem = checkItemConsistency(item);
  if (problem) ctx.addIssue({ code: 'custom', path: ['method'], message: problem });
});
export type RequestItemInput = z.input<typeof requestItemInput>;

const itemList = z
  .array(requestItemInput)
  .max(50, { message: 'At most 50 cut items on one request' })
  .superRefine((items, ctx) => {
    const seen = new Set<string>();
    items.forEach((item, i) => {
      if (!item.id) return;
      if (seen.has(item.id)) ctx.addIssue({ code: 'custom', path: [i, 'id'], message: 'This item is listed twice' });
      seen.add(item.id);
    });
  });

const noDerivativeReasonField = z
  .string()
  .trim()
  .max(2000, { message: 'Keep this under 2000 characters' })
  .transform((v) => (v === '' ? null : v));

const reasonField = z.string().trim().max(4000, { message: 'Keep the reason under 4000 characters' });
const movedField = z
  .array(z.uuid())
  .max(200)
  .refine((ids) => new Set(ids).size === ids.length, { message: 'Each product can be moved once' });

const requestFields = {
  toolId: z.uuid({ message: 'Pick the tool to change' }),
  title: z.string().trim().min(4, { message: 'Give the change a short title (at least 4 characters)' }).max(160),
  reason: reasonField.default(''),
  derivativeProductId: z.uuid().nullable().default(null),
  /** Create the derivative product inline: it joins the tool's brand as in_line with 0 planned units. */
  newDerivative: newDerivativeInput.nullable().default(null),
  /** When the change is for no product: why (a fix to the tool, a texture refresh). */
  noDerivativeReason: noDerivativeReasonField.nullable().default(null),
  targetDate: isoDate.nullable().default(null),
  items: itemList.default([]),
  movedProductIds: movedField.default([]),
};

const notBoth = (v: { derivativeProductId?: string | null; newDerivative?: unknown }, ctx: z.RefinementCtx) => {
  if (v.derivativeProductId && v.newDerivative) {
    ctx.addIssue({ code: 'custom', path: ['newDerivative'], message: 'Pick an existing product or create a new one, not both' });
  }
};

export const createRequestInput = z.object(requestFields).superRefine(notBoth);
export type CreateRequestInput = z.input<typeof createRequestInput>;

/**
 * Edits a draft (designer) or, during engineering review, the items, moved products and reason
 * (engineer). Only the fields sent change (no defaults here, so a field left out is kept).
 * `version` is the version the editor saw: a stale one is refused with 409 and the current copy.
 */
export const updateRequestInput = z
  .object({
    version: z.number().int().min(0),
    title: requestFields.title,
    reason: reasonField,
    derivativeProductId: z.uuid().nullable(),
    newDerivative: newDerivativeInput.nullable(),
    noDerivativeReason: noDerivativeReasonField.nullable(),
    targetDate: isoDate.nullable(),
    items: itemList,
    movedProductIds: movedField,
  })
  .partial()
  .required({ version: true })
  .superRefine(notBoth);
export type UpdateRequestInput = z.input<typeof updateRequestInput>;

export const listRequestsQuery = z.object({
  status: requestStatusSchema.optional(),
  toolId: z.uuid().optional(),
  brandId: z.uuid().optional(),
  mine: z.stringbool().optional(),
  irreversible: z.stringbool().optional(),
  q: z.string().trim().max(100).optional(),
  cursor: z.string().max(200).optional(),
  limit: z.coerce.number().int().min(1).max(100).default(25),
});
export type ListRequestsQuery = z.input<typeof listRequestsQuery>;

const personRef = z.object({ id: z.uuid(), name: z.string() });

export const requestSummarySchema = z.object({
  id: z.uuid(),
  number: z.number().int(),
  ref: z.string(),
  title: z.string(),
  status: requestStatusSchema,
  tool: z.object({ id: z.uuid(), code: z.string(), name: z.string() }),
  brand: z.object({ id: z.uuid(), name: z.string() }),
  irreversible: z.boolean(),
  endedProductCount: z.number().int(),
  submitter: personRef,
  stageDueAt: z.string().nullable(),
  updatedAt: z.string(),
  version: z.number().int(),
});
export type RequestSummary = z.infer<typeof requestSummarySchema>;

export const requestListResponseSchema = z.object({
  data: z.array(requestSummarySchema),
  meta: z.object({ nextCursor: z.string().nullable() }),
});
export type RequestListResponse = z.infer<typeof requestListResponseSchema>;

/** The fields of a request that an edit can change (updateRequestInput without `version`). */
export const editableRequestFields = ['title', 'reason', 'derivativeProductId', 'newDerivative', 'noDerivativeReason', 'targetDate', 'items', 'movedProductIds'] as const;
export type EditableRequestField = (typeof editableRequestFields)[number];

export const attachmentKinds = ['before', 'after', 'sample', 'other'] as const;
export const attachmentKindSchema = z.enum(attachmentKinds);
export type AttachmentKind = z.infer<typeof attachmentKindSchema>;

export const attachmentSchema = z.object({
  id: z.uuid(),
  kind: attachmentKindSchema,
  itemId: z.uuid().nullable(),
  filename: z.string(),
  contentType: z.string(),
  size: z.number().int(),
  sha256: z.string(),
  width: z.number().int().nullable(),
  height: z.number().int().nullable(),
  url: z.string(),
  thumbnailUrl: z.string(),
  uploadedBy: personRef,
  createdAt: z.string(),
});
export type Attachment = z.infer<typeof attachmentSchema>;

export const impactProductDto = z.object({
  id: z.uuid(),
  sku: z.string(),
  name: z.string(),
  status: z.enum(['in_line', 'reissue_planned', 'retired']),
  plannedUnits: z.number().int(),
});
export type ImpactProductDto = z.infer<typeof impactProductDto>;

/** Everything the form needs to compute the impact as the designer types (same function as the server). */
export const impactContextSchema = z.object({
  tool: z.custom<ImpactTool & { name: string; brandId: string; factoryId: string; weightKg: number | null }>((v) => typeof v === 'object' && v !== null),
  parts: z.array(z.custom<ImpactPart & { resin: string | null; cavitiesPerShot: number }>((v) => typeof v === 'object' && v !== null)),
  products: z.array(impactProductDto),
  billOfParts: z.array(z.custom<BillOfPartsLine>((v) => typeof v === 'object' && v !== null)),
});
export type ImpactContext = z.infer<typeof impactContextSchema>;

export const requestItemDto = changeItemSchema.extend({
  partName: z.string(),
  steel: z.custom<SteelDirection>((v) => typeof v === 'object' && v !== null),
});
export type RequestItemDto = z.infer<typeof requestItemDto>;

export const requestDetailSchema = requestSummarySchema.extend({
  reason: z.string(),
  targetDate: z.string().nullable(),
  derivativeProduct: z.object({ id: z.uuid(), sku: z.string(), name: z.string() }).nullable(),
  /** Why the change is for no product (null: not said). */
  noDerivativeReason: z.string().nullable(),
  tool: z.object({
    id: z.uuid(),
    code: z.string(),
    name: z.string(),
    currentRevision: z.number().int(),
    factory: z.object({ id: z.uuid(), name: z.string() }),
    weightKg: z.number().nullable(),
  }),
  items: z.array(requestItemDto),
  movedProductIds: z.array(z.uuid()),
  attachments: z.array(attachmentSchema),
  impact: z.custom<ImpactResult<ImpactProductDto>>((v) => typeof v === 'object' && v !== null),
  safety: z.custom<SafetyReview>((v) => typeof v === 'object' && v !== null),
  retestRequired: z.boolean(),
  retestNote: z.string().nullable(),
  createdAt: z.string(),
  /** What the caller may do now (the server re-checks every one of them). */
  permissions: z.object({
    /** May change the request's own fields (the submitter on a draft). */
    canEdit: z.boolean(),
    /** May change the cut items (the submitter on a draft, an engineer during review). */
    canEditItems: z.boolean(),
    /** Exactly which fields of updateRequestInput the caller may change now (empty: none). */
    editableFields: z.array(z.enum(editableRequestFields)),
    canUpload: z.boolean(),
    /** Which attachment kinds the caller may upload (and delete) now. */
    uploadKinds: z.array(attachmentKindSchema),
    actions: z.array(z.enum(requestActions)),
  }),
  /** The sign-off timeline, oldest first (optional: added by the sign-off workflow). */
  signOffs: z.array(signOffSchema).optional(),
  /** Due date, who it waits for, what each of my actions needs, the irreversible guard. */
  workflow: workflowInfoSchema.optional(),
  /** What is still missing before each gated action the request's state allows (gates.ts). */
  gates: z.partialRecord(z.enum(requestActions), z.array(z.custom<GateGap>((v) => typeof v === 'object' && v !== null))).optional(),
  /** What the products the change ends are worth beside the ways to keep them (null until every figure exists). */
  valueAtRisk: z.custom<ValueAtRiskResult>((v) => typeof v === 'object' && v !== null).nullable().optional(),
});
export type RequestDetail = z.infer<typeof requestDetailSchema>;

/** The text fields sent with an upload (multipart/form-data, the file in field `file`). */
export const uploadKindInput = z.object({
  kind: attachmentKindSchema,
  // A form sends an empty field for "no item".
  itemId: z.preprocess((v) => (v === '' ? undefined : v), z.uuid({ message: 'Pick an item of this request' }).optional()),
});
export type UploadKindInput = z.input<typeof uploadKindInput>;

export { changeItemFields };
