import { z } from 'zod';
import type { ImpactResult, BillOfPartsLine, ImpactPart, ImpactProduct, ImpactTool } from '../domain/impact';
import type { SafetyReview } from '../domain/safety';
import type { SteelDirection } from '../domain/steel-direction';
import { requestActions, requestStates } from '../domain/lifecycle';
import { changeItemFields, changeItemInput, changeItemSchema } from './change-items';

// The contract of the change-request API (server and app both import it).

export const requestStatusSchema = z.enum(requestStates);
export type RequestStatus = z.infer<typeof requestStatusSchema>;

/** Human reference of a request: CR-0007. */
export const requestRef = (n: number) => `CR-${String(n).padStart(4, '0')}`;

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { message: 'Use a date like 2027-03-31' });

export const newDerivativeInput = z.object({
  sku: z
    .string()
    .trim()
    .min(3, { message: 'Enter the SKU of the new product' })
    .max(40)
    .regex(/^[A-Za-z0-9-]+$/, { message: 'Use letters, digits and dashes only' }),
  name: z.string().trim().min(2, { message: 'Enter the product name' }).max(120),
});

const requestFields = {
  toolId: z.uuid({ message: 'Pick the tool to change' }),
  title: z.string().trim().min(4, { message: 'Give the change a short title (at least 4 characters)' }).max(160),
  reason: z.string().trim().max(4000, { message: 'Keep the reason under 4000 characters' }).default(''),
  derivativeProductId: z.uuid().nullable().default(null),
  /** Create the derivative product inline: it joins the tool's brand as in_line with 0 planned units. */
  newDerivative: newDerivativeInput.nullable().default(null),
  targetDate: isoDate.nullable().default(null),
  items: z.array(changeItemInput).max(50, { message: 'At most 50 cut items on one request' }).default([]),
  movedProductIds: z.array(z.uuid()).max(200).default([]),
};

export const createRequestInput = z.object(requestFields).superRefine((v, ctx) => {
  if (v.derivativeProductId && v.newDerivative) {
    ctx.addIssue({ code: 'custom', path: ['newDerivative'], message: 'Pick an existing product or create a new one, not both' });
  }
});
export type CreateRequestInput = z.input<typeof createRequestInput>;

/** Edits a draft (designer) or the items during review (engineer). `version` is what the editor saw. */
export const updateRequestInput = z
  .object({
    version: z.number().int().min(0),
    title: requestFields.title,
    reason: requestFields.reason,
    derivativeProductId: z.uuid().nullable(),
    newDerivative: newDerivativeInput.nullable(),
    targetDate: isoDate.nullable(),
    items: z.array(changeItemInput).max(50, { message: 'At most 50 cut items on one request' }),
    movedProductIds: z.array(z.uuid()).max(200),
  })
  .partial()
  .required({ version: true });
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
    canEdit: z.boolean(),
    canEditItems: z.boolean(),
    canUpload: z.boolean(),
    actions: z.array(z.enum(requestActions)),
  }),
});
export type RequestDetail = z.infer<typeof requestDetailSchema>;

export const uploadKindInput = z.object({
  kind: attachmentKindSchema,
  itemId: z.uuid().optional(),
});

export { changeItemFields };
