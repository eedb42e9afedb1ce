// Loading a change request and shaping it for the API: the impact context of its tool, the
// computed impact and safety review, the summary and detail DTOs, and the audit snapshot.
import type { Transaction } from 'sequelize';
import { computeImpact, type ImpactItem, type ImpactResult } from '../../shared/domain/impact';
import type { RequestState } from '../../shared/domain/lifecycle';
import { retestRequired, safetyReview } from '../../shared/domain/safety';
import { steelDirection } from '../../shared/domain/steel-direction';
import {
  requestRef,
  type Attachment,
  type ImpactContext,
  type ImpactProductDto,
  type RequestDetail,
  type RequestItemDto,
  type RequestSummary,
} from '../../shared/schemas/change-requests';
import type { SafetyFlag } from '../../shared/schemas/change-items';
import type { Actor } from '../lib/auth';
import { notFound } from '../lib/errors';
import {
  AttachmentModel,
  BillOfPartsModel,
  BrandModel,
  ChangeItemModel,
  ChangeRequestModel,
  FactoryModel,
  PartModel,
  ProductModel,
  ToolModel,
  UserModel,
} from '../models';
import { canSeeRequest, permissionsFor, type RequestAccessFacts } from './request-access';
import { iso } from './registry-common';
import { loadSignOffs } from './sign-off-chain';
import { contextAsSigned, workflowView } from './workflow-view';
import { gatesFor, loadGateFacts, valueAtRiskOf } from './request-gates';

// ---------------------------------------------------------------------------------------------
// Impact context: the tool, its parts, the products made from it and their bill lines on it

export async function loadImpactContext(toolId: string, transaction?: Transaction): Promise<ImpactContext> {
  const tool = await ToolModel.findByPk(toolId, { transaction });
  if (!tool) throw notFound('Tool');
  // One connection runs one query at a time: inside a transaction, run them in turn.
  const parts = await PartModel.findAll({ where: { toolId }, order: [['name', 'ASC']], transaction });
  const lines = await BillOfPartsModel.findAll({ where: { toolId }, order: [['productId', 'ASC'], ['partId', 'ASC']], transaction });
  const productIds = [...new Set(lines.map((l) => l.productId))];
  const products = productIds.length ? await ProductModel.findAll({ where: { id: productIds }, order: [['sku', 'ASC']], transaction }) : [];
  return {
    tool: {
      id: tool.id,
      code: tool.code,
      name: tool.name,
      currentRevision: tool.currentRevision,
      brandId: tool.brandId,
      factoryId: tool.factoryId,
      weightKg: tool.weightKg,
    },
    parts: parts.map((p) => ({ id: p.id, toolId: p.toolId, name: p.name, resin: p.resin, cavitiesPerShot: p.cavitiesPerShot })),
    products: products.map(toImpactProduct),
    billOfParts: lines.map((l) => ({ productId: l.productId, partId: l.partId, toolId: l.toolId, revision: l.revision, quantityPerUnit: l.quantityPerUnit })),
  };
}

export const toImpactProduct = (p: ProductModel): ImpactProductDto => ({ id: p.id, sku: p.sku, name: p.name, status: p.status, plannedUnits: p.plannedUnits });

const centsOrNull = (v: unknown) => (typeof v === 'number' && Number.isSafeInteger(v) && v >= 0 ? v : null);

/** The impact of these items on the tool (the same function the form runs as the designer types). */
export function impactOf(
  context: ImpactContext,
  items: readonly ImpactItem[],
  movedProductIds: readonly string[],
  estimate: Record<string, unknown> | null | undefined,
): ImpactResult<ImpactProductDto> {
  return computeImpact({
    tool: context.tool,
    items,
    parts: context.parts,
    products: context.products,
    billOfParts: context.billOfParts,
    movedProductIds,
    alternatives: { newInsertCents: centsOrNull(estimate?.newInsertCents), duplicateToolCents: centsOrNull(estimate?.duplicateToolCents) },
  });
}

/** The stored results of the computations (kept on every save for filters and sign-offs). */
export function computedFields(impact: ImpactResult<ImpactProductDto>, items: readonly { safetyFlags: readonly SafetyFlag[] }[]) {
  return {
    irreversible: impact.irreversible,
    endedProductIds: impact.endedProducts.map((p) => p.id),
    retestRequired: retestRequired(items),
  };
}

// ---------------------------------------------------------------------------------------------
// Loading

const requestIncludes = [
  {
    model: ToolModel,
    as: 'tool',
    attributes: ['id', 'code', 'name', 'brandId', 'factoryId', 'currentRevision', 'weightKg', 'status', 'retentionDecidedAt'],
    include: [
      { model: BrandModel, as: 'brand', attributes: ['id', 'code', 'name'] },
      { model: FactoryModel, as: 'factory', attributes: ['id', 'name'] },
    ],
  },
  { model: UserModel, as: 'submitter', attributes: ['id', 'name'] },
  { model: ProductModel, as: 'derivativeProduct', attributes: ['id', 'sku', 'name'] },
];

export const accessFacts = (r: ChangeRequestModel): RequestAccessFacts => ({
  status: r.status,
  submitterId: r.submitterId,
  tool: { brandId: r.tool!.brandId, factoryId: r.tool!.factoryId, status: r.tool!.status },
  acceptedByRoles: r.acceptedByRoles,
  cutSheetReceivedAt: r.cutSheetReceivedAt ?? null,
});

/**
 * The request with its tool, brand, factory, submitter and derivative, if the caller may see it;
 * otherwise 404 (the same answer as for a request that does not exist). With `lock`, the row is
 * locked for update in the transaction first.
 */
export async function findVisibleRequest(actor: Actor, id: string, opts: { transaction?: Transaction; lock?: boolean } = {}) {
  if (opts.lock && opts.transaction) {
    const locked = await ChangeRequestModel.findByPk(id, { transaction: opts.transaction, lock: opts.transaction.LOCK.UPDATE });
    if (!locked) throw notFound('Change request');
  }
  const row = await ChangeRequestModel.findByPk(id, { include: requestIncludes, transaction: opts.transaction });
  if (!row || !canSeeRequest(actor, accessFacts(row))) throw notFound('Change request');
  return row;
}

export async function loadItems(requestId: string, transaction?: Transaction) {
  return ChangeItemModel.findAll({
    where: { requestId },
    include: [{ model: PartModel, as: 'part', attributes: ['id', 'name'] }],
    order: [['position', 'ASC']],
    transaction,
  });
}

/** Attachments without their bytes. */
export async function loadAttachments(requestId: string, transaction?: Transaction) {
  return AttachmentModel.findAll({
    where: { requestId },
    attributes: { exclude: ['data', 'thumbnail'] },
    include: [{ model: UserModel, as: 'uploader', attributes: ['id', 'name'] }],
    order: [['createdAt', 'ASC'], ['id', 'ASC']],
    transaction,
  });
}

// ---------------------------------------------------------------------------------------------
// DTOs

export function toItemDto(i: ChangeItemModel): RequestItemDto {
  return {
    id: i.id,
    requestId: i.requestId,
    position: i.position,
    partId: i.partId,
    partName: i.part?.name ?? '',
    effect: i.effect,
    method: i.method,
    size: i.size,
    unit: i.unit,
    note: i.note,
    safetyFlags: i.safetyFlags,
    ...(i.region ? { region: i.region } : {}),
    steel: steelDirection(i),
  };
}

export function toAttachmentDto(a: AttachmentModel, uploader?: { id: string; name: string }): Attachment {
  const by = uploader ?? a.uploader;
  return {
    id: a.id,
    kind: a.kind,
    itemId: a.itemId,
    filename: a.filename,
    contentType: a.contentType,
    size: a.size,
    sha256: a.sha256,
    width: a.width,
    height: a.height,
    url: `/api/attachments/${a.id}`,
    thumbnailUrl: `/api/attachments/${a.id}/thumbnail`,
    uploadedBy: { id: by?.id ?? a.uploadedBy, name: by?.name ?? '' },
    createdAt: iso(a.createdAt),
  };
}

export function toSummary(r: ChangeRequestModel): RequestSummary {
  const t = r.tool!;
  return {
    id: r.id,
    number: r.number,
    ref: requestRef(r.number),
    title: r.title,
    status: r.status,
    tool: { id: t.id, code: t.code, name: t.name },
    brand: { id: t.brand!.id, name: t.brand!.name },
    irreversible: r.irreversible,
    endedProductCount: r.endedProductIds.length,
    submitter: { id: r.submitter!.id, name: r.submitter!.name },
    stageDueAt: r.stageDueAt ? iso(r.stageDueAt) : null,
    updatedAt: iso(r.updatedAt),
    version: r.version,
  };
}

/** The full request as the caller may see it, computed fresh from the tool's current registry data. */
export async function buildDetail(actor: Actor, r: ChangeRequestModel, transaction?: Transaction): Promise<RequestDetail> {
  const items = await loadItems(r.id, transaction);
  const attachments = await loadAttachments(r.id, transaction);
  // Once released to the factory, the impact is shown as it was signed (workflow-view.ts).
  const context = await contextAsSigned(await loadImpactContext(r.toolId, transaction), r, transaction);
  const impact = impactOf(context, items, r.movedProductIds, r.estimate);
  const t = r.tool!;
  const permissions = permissionsFor(actor, accessFacts(r));
  const view = workflowView({ r, actions: permissions.actions, impact, retestRequired: retestRequired(items), items, tool: t, signOffs: await loadSignOffs(r.id, transaction) });
  const gateContext = await loadGateFacts(r, items, impact, transaction);
  return {
    ...toSummary(r),
    reason: r.reason,
    targetDate: r.targetDate,
    derivativeProduct: r.derivativeProduct ? { id: r.derivativeProduct.id, sku: r.derivativeProduct.sku, name: r.derivativeProduct.name } : null,
    noDerivativeReason: r.noDerivativeReason ?? null,
    tool: {
      id: t.id,
      code: t.code,
      name: t.name,
      currentRevision: t.currentRevision,
      factory: { id: t.factory!.id, name: t.factory!.name },
      weightKg: t.weightKg,
    },
    items: items.map(toItemDto),
    movedProductIds: r.movedProductIds,
    attachments: attachments.map((a) => toAttachmentDto(a)),
    impact,
    safety: safetyReview(items),
    retestRequired: retestRequired(items),
    retestNote: r.retestNote ?? null,
    createdAt: iso(r.createdAt),
    permissions,
    signOffs: view.signOffs,
    workflow: view.workflow,
    gates: gatesFor(r, gateContext.facts),
    // Prices and margins stay with the brand and engineering.
    valueAtRisk: actor.role === 'toolmaker' ? null : valueAtRiskOf(gateContext),
  };
}

export async function detailById(actor: Actor, id: string, transaction?: Transaction) {
  return buildDetail(actor, await findVisibleRequest(actor, id, { transaction }), transaction);
}

/** What the audit trail keeps of a request: its fields and items, without timestamps. */
export function auditSnapshot(r: ChangeRequestModel, items: readonly ChangeItemModel[]) {
  return {
    number: r.number,
    toolId: r.toolId,
    title: r.title,
    reason: r.reason,
    status: r.status as RequestState,
    derivativeProductId: r.derivativeProductId,
    noDerivativeReason: r.noDerivativeReason ?? null,
    targetDate: r.targetDate,
    submitterId: r.submitterId,
    movedProductIds: r.movedProductIds,
    irreversible: r.irreversible,
    endedProductIds: r.endedProductIds,
    retestRequired: r.retestRequired,
    items: items.map((i) => ({
      id: i.id,
      position: i.position,
      partId: i.partId,
      effect: i.effect,
      method: i.method,
      size: i.size,
      unit: i.unit,
      note: i.note,
      safetyFlags: i.safetyFlags,
      region: i.region,
    })),
  };
}
