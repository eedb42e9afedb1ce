// Change requests: create a draft, edit it (designer) or its cut items during review (engineer),
// read the detail with its computed impact, and list with filters and keyset pages.
// The sign-off workflow (transitions, signatures, mail) builds on these in its own service.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { z } from 'zod';
import {
  type createRequestInput,
  type EditableRequestField,
  type ImpactContext,
  type listRequestsQuery,
  type RequestDetail,
  type RequestListResponse,
  type requestItemInput,
  type updateRequestInput,
} from '../../shared/schemas/change-requests';
import type { Actor } from '../lib/auth';
import { AppError } from '../lib/errors';
import { ChangeItemModel, ChangeRequestModel, ProductModel, type ToolModel } from '../models';
import { recordAudit } from './audit';
import { editableFieldsFor, editRefusal, visibilitySql } from './request-access';
import {
  accessFacts,
  auditSnapshot,
  buildDetail,
  computedFields,
  findVisibleRequest,
  impactOf,
  loadImpactContext,
  loadItems,
  toSummary,
} from './request-views';
import { assertEditable, containsPattern, findVisibleTool, staleVersion } from './registry-common';

export type CreateRequestValues = z.output<typeof createRequestInput>;
export type UpdateRequestValues = z.output<typeof updateRequestInput>;
export type RequestItemValues = z.output<typeof requestItemInput>;
export type ListRequestsValues = z.output<typeof listRequestsQuery>;

const invalid = (message: string, fieldErrors: Record<string, string[]>) => new AppError('validation_failed', message, 400, fieldErrors);

// ---------------------------------------------------------------------------------------------
// Checks against the registry (the zod schemas have already checked the shapes)

/** Every item's part must be a part of the request's tool; every moved product must be made from it. */
function checkAgainstTool(context: ImpactContext, items: readonly RequestItemValues[] | undefined, moved: readonly string[] | undefined) {
  const fieldErrors: Record<string, string[]> = {};
  const partIds = new Set(context.parts.map((p) => p.id));
  items?.forEach((item, i) => {
    if (!partIds.has(item.partId)) fieldErrors[`items.${i}.partId`] = [`Pick a part of tool ${context.tool.code}`];
  });
  const productIds = new Set(context.billOfParts.map((l) => l.productId));
  moved?.forEach((id, i) => {
    if (!productIds.has(id)) fieldErrors[`movedProductIds.${i}`] = [`This product is not made from tool ${context.tool.code}`];
  });
  if (Object.keys(fieldErrors).length) {
    throw invalid(`Some items or products do not belong to tool ${context.tool.code}: check the highlighted fields`, fieldErrors);
  }
}

async function checkDerivative(productId: string, transaction: Transaction) {
  const p = await ProductModel.findByPk(productId, { attributes: ['id', 'status'], transaction });
  if (!p) throw invalid('Pick an existing product as the derivative, or create a new one', { derivativeProductId: ['Unknown product'] });
  if (p.status === 'retired') throw invalid('A retired product cannot be the derivative of a change', { derivativeProductId: ['This product is retired'] });
}

/** Creates the derivative product inline: the tool's brand, in line, 0 planned units. */
async function createDerivative(actor: Actor, tool: ToolModel, input: { sku: string; name: string }, transaction: Transaction) {
  const sku = input.sku.toUpperCase();
  if (await ProductModel.findOne({ where: { sku }, attributes: ['id'], transaction })) {
    throw new AppError('conflict', `A product with SKU ${sku} already exists: pick it as the derivative instead`, 409, {
      'newDerivative.sku': ['Already in use: pick the existing product'],
    });
  }
  const p = await ProductModel.create({ sku, name: input.name, brandId: tool.brandId, status: 'in_line', fobCents: null, wholesaleCents: null, retailCents: null }, { transaction });
  await recordAudit(transaction, actor, 'product.create', 'product', p.id, null, {
    sku: p.sku,
    name: p.name,
    brandId: p.brandId,
    status: p.status,
    plannedUnits: p.plannedUnits,
    createdFor: 'change_request_derivative',
  });
  return p.id;
}

// ---------------------------------------------------------------------------------------------
// Items

/**
 * Makes the request's items equal to `items`, in order: an item with the id of an existing item is
 * updated in place (its attachments stay linked), a new one is created, a missing one is removed.
 */
async function writeItems(requestId: string, items: readonly RequestItemValues[], transaction: Transaction) {
  const existing = await ChangeItemModel.findAll({ where: { requestId }, transaction });
  const byId = new Map(existing.map((i) => [i.id, i]));
  const fieldErrors: Record<string, string[]> = {};
  items.forEach((item, i) => {
    if (item.id && !byId.has(item.id)) fieldErrors[`items.${i}.id`] = ['This item is no longer on the request: reload and try again'];
  });
  if (Object.keys(fieldErrors).length) throw invalid('Some items are no longer on the request', fieldErrors);

  const kept = new Set(items.map((i) => i.id).filter(Boolean));
  for (const old of existing) if (!kept.has(old.id)) await old.destroy({ transaction });
  for (const [position, item] of items.entries()) {
    const values = {
      position,
      partId: item.partId,
      effect: item.effect,
      method: item.method,
      size: item.size,
      unit: item.unit,
      note: item.note,
      safetyFlags: [...item.safetyFlags],
      region: item.region ?? null,
    };
    const row = item.id ? byId.get(item.id) : undefined;
    if (row) {
      row.set(values);
      if (row.changed()) await row.save({ transaction });
    } else {
      await ChangeItemModel.create({ requestId, ...values }, { transaction });
    }
  }
}

/** Recomputes and stores irreversible, ended products and re-test flag from the current items. */
async function storeComputed(r: ChangeRequestModel, context: ImpactContext, transaction: Transaction) {
  const items = await loadItems(r.id, transaction);
  const impact = impactOf(context, items, r.movedProductIds, r.estimate);
  r.set(computedFields(impact, items));
  return items;
}

// ---------------------------------------------------------------------------------------------
// Create

/** The tool named by a create, or 400 (it is a field of the body, not the path). */
async function toolForRequest(actor: Actor, toolId: string, transaction: Transaction) {
  const tool = await findVisibleTool(actor, toolId, { transaction, include: false }).catch(() => {
    throw invalid('Pick a tool from the register', { toolId: ['Unknown tool'] });
  });
  assertEditable(tool);
  return tool;
}

/**
 * Inserts a draft with its items and computed impact (no audit). Shared by the API and the seed.
 * The caller checks the role; this checks the record (tool, parts, products).
 */
export async function insertRequest(actor: Actor, input: CreateRequestValues, transaction: Transaction) {
  const tool = await toolForRequest(actor, input.toolId, transaction);
  const context = await loadImpactContext(tool.id, transaction);
  checkAgainstTool(context, input.items, input.movedProductIds);
  if (input.derivativeProductId) await checkDerivative(input.derivativeProductId, transaction);
  const derivativeProductId = input.newDerivative ? await createDerivative(actor, tool, input.newDerivative, transaction) : input.derivativeProductId;

  const impact = impactOf(context, input.items, input.movedProductIds, null);
  const r = await ChangeRequestModel.create(
    {
      toolId: tool.id,
      title: input.title,
      reason: input.reason,
      derivativeProductId,
      noDerivativeReason: derivativeProductId ? null : input.noDerivativeReason,
      targetDate: input.targetDate,
      submitterId: actor.id,
      movedProductIds: [...input.movedProductIds],
      ...computedFields(impact, input.items),
    },
    { transaction },
  );
  await writeItems(r.id, input.items, transaction);
  return { request: r, items: await loadItems(r.id, transaction) };
}

export async function createRequest(sequelize: Sequelize, actor: Actor, input: CreateRequestValues): Promise<RequestDetail> {
  return sequelize.transaction(async (transaction) => {
    const { request, items } = await insertRequest(actor, input, transaction);
    await request.reload({ transaction });
    await recordAudit(transaction, actor, 'change_request.create', 'change_request', request.id, null, auditSnapshot(request, items));
    return buildDetail(actor, await findVisibleRequest(actor, request.id, { transaction }), transaction);
  });
}

// ---------------------------------------------------------------------------------------------
// Update

const fieldLabels: Record<EditableRequestField, string> = {
  title: 'title',
  reason: 'reason',
  derivativeProductId: 'derivative product',
  newDerivative: 'derivative product',
  noDerivativeReason: 'reason for having no product',
  targetDate: 'target date',
  items: 'cut items',
  movedProductIds: 'moved products',
};

/** The fields this update would really change (a form may resend unchanged values). */
function changedFields(r: ChangeRequestModel, input: UpdateRequestValues): EditableRequestField[] {
  const out: EditableRequestField[] = [];
  if (input.title !== undefined && input.title !== r.title) out.push('title');
  if (input.reason !== undefined && input.reason !== r.reason) out.push('reason');
  if (input.targetDate !== undefined && input.targetDate !== r.targetDate) out.push('targetDate');
  if (input.derivativeProductId !== undefined && input.derivativeProductId !== r.derivativeProductId) out.push('derivativeProductId');
  if (input.newDerivative) out.push('newDerivative');
  if (input.noDerivativeReason !== undefined && input.noDerivativeReason !== (r.noDerivativeReason ?? null)) out.push('noDerivativeReason');
  if (input.items !== undefined) out.push('items');
  if (input.movedProductIds !== undefined) out.push('movedProductIds');
  return out;
}

export async function updateRequest(sequelize: Sequelize, actor: Actor, id: string, input: UpdateRequestValues): Promise<RequestDetail> {
  return sequelize.transaction(async (transaction) => {
    const r = await findVisibleRequest(actor, id, { transaction, lock: true });
    const refusal = editRefusal(actor, accessFacts(r));
    if (refusal) throw refusal;
    assertEditable(r.tool!);
    if (input.version !== r.version) throw staleVersion('change request', await buildDetail(actor, r, transaction));

    const allowed = editableFieldsFor(actor, accessFacts(r));
    const notAllowed = changedFields(r, input).filter((f) => !allowed.includes(f));
    if (notAllowed.length) {
      throw new AppError(
        'forbidden',
        `During engineering review the tooling engineer may change only the cut items, moved products and reason, not the ${[...new Set(notAllowed.map((f) => fieldLabels[f]))].join(' or ')}.`,
        403,
        Object.fromEntries(notAllowed.map((f) => [f, ['Only the designer can change this, on a draft']])),
      );
    }

    const before = auditSnapshot(r, await loadItems(r.id, transaction));
    const context = await loadImpactContext(r.toolId, transaction);
    checkAgainstTool(context, input.items, input.movedProductIds);

    if (input.title !== undefined) r.title = input.title;
    if (input.reason !== undefined) r.reason = input.reason;
    if (input.targetDate !== undefined) r.targetDate = input.targetDate;
    if (input.newDerivative) {
      r.derivativeProductId = await createDerivative(actor, r.tool!, input.newDerivative, transaction);
    } else if (input.derivativeProductId !== undefined && input.derivativeProductId !== r.derivativeProductId) {
      if (input.derivativeProductId) await checkDerivative(input.derivativeProductId, transaction);
      r.derivativeProductId = input.derivativeProductId;
    }
    if (input.noDerivativeReason !== undefined) r.noDerivativeReason = input.noDerivativeReason;
    // A request for a product needs no reason for having none.
    if (r.derivativeProductId) r.noDerivativeReason = null;
    if (input.movedProductIds !== undefined) r.movedProductIds = [...input.movedProductIds];
    if (input.items !== undefined) await writeItems(r.id, input.items, transaction);
    const items = await storeComputed(r, context, transaction);

    const after = auditSnapshot(r, items);
    if (JSON.stringify(after) === JSON.stringify(before)) return buildDetail(actor, r, transaction);

    // The version the editor saw (checked above under the row lock); Sequelize adds it to the WHERE
    // clause and bumps it, so a concurrent write can never be silently overwritten.
    r.set('version', input.version, { raw: true });
    r.changed('updatedAt', true);
    await r.save({ transaction });
    await recordAudit(transaction, actor, 'change_request.update', 'change_request', r.id, before, after);
    return buildDetail(actor, await findVisibleRequest(actor, r.id, { transaction }), transaction);
  });
}

// ---------------------------------------------------------------------------------------------
// Read

export async function getRequestDetail(actor: Actor, id: string): Promise<RequestDetail> {
  return buildDetail(actor, await findVisibleRequest(actor, id));
}

/** What the form needs to compute the impact live: only for a tool the caller may see. */
export async function getImpactContext(actor: Actor, toolId: string): Promise<ImpactContext> {
  await findVisibleTool(actor, toolId, { include: false });
  return loadImpactContext(toolId);
}

// ---------------------------------------------------------------------------------------------
// List

interface ListCursor {
  /** updated_at as PostgreSQL prints it (microseconds kept). */
  u: string;
  i: string;
}

const TIMESTAMP_RE = /^\d{4}-\d{2}-\d{2}[ T]\d{2}:\d{2}:\d{2}(\.\d{1,6})?([+-]\d{2}(:?\d{2})?|Z)$/;
/** A timestamp PostgreSQL will accept: the shape, and a real calendar date and time. */
function isTimestamp(u: string) {
  const m = TIMESTAMP_RE.exec(u);
  if (!m) return false;
  const [y, mo, d, h, mi, se] = [u.slice(0, 4), u.slice(5, 7), u.slice(8, 10), u.slice(11, 13), u.slice(14, 16), u.slice(17, 19)].map(Number);
  const t = new Date(Date.UTC(y!, mo! - 1, d!, h!, mi!, se!));
  return t.getUTCFullYear() === y && t.getUTCMonth() === mo! - 1 && t.getUTCDate() === d && t.getUTCHours() === h && t.getUTCMinutes() === mi && t.getUTCSeconds() === se;
}
const UUID_RE = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function encodeListCursor(c: ListCursor) {
  return Buffer.from(JSON.stringify(c), 'utf8').toString('base64url');
}

export function decodeListCursor(cursor: string | undefined): ListCursor | undefined {
  if (!cursor) return undefined;
  try {
    const v = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8')) as Partial<ListCursor>;
    if (typeof v.u === 'string' && isTimestamp(v.u) && typeof v.i === 'string' && UUID_RE.test(v.i)) {
      return { u: v.u, i: v.i };
    }
  } catch {
    // fall through
  }
  throw invalid('That page cursor is not valid: start again from the first page', { cursor: ['Not a valid cursor'] });
}

/** "CR-0007", "cr7", "7": the request number searched for, if the text is one. */
const refNumber = (q: string) => {
  const m = /^(?:cr-?\s*)?0*(\d{1,9})$/i.exec(q.trim());
  return m ? Number(m[1]) : null;
};

export async function listRequests(sequelize: Sequelize, actor: Actor, f: ListRequestsValues): Promise<RequestListResponse> {
  const vis = visibilitySql(actor);
  const clauses = [vis.sql];
  const replacements: Record<string, unknown> = { ...vis.replacements, limit: f.limit + 1 };
  if (f.status) {
    clauses.push('cr.status = :status');
    replacements.status = f.status;
  }
  if (f.toolId) {
    clauses.push('cr.tool_id = :toolId');
    replacements.toolId = f.toolId;
  }
  if (f.brandId) {
    clauses.push('t.brand_id = :brandId');
    replacements.brandId = f.brandId;
  }
  if (f.mine !== undefined) {
    clauses.push(f.mine ? 'cr.submitter_id = :me' : 'cr.submitter_id <> :me');
    replacements.me = actor.id;
  }
  if (f.irreversible !== undefined) {
    clauses.push('cr.irreversible = :irreversible');
    replacements.irreversible = f.irreversible;
  }
  if (f.q) {
    replacements.q = containsPattern(f.q);
    const n = refNumber(f.q);
    if (n !== null) replacements.qNumber = n;
    clauses.push(`(cr.title ILIKE :q OR t.code ILIKE :q OR t.name ILIKE :q${n !== null ? ' OR cr.number = :qNumber' : ''})`);
  }
  const after = decodeListCursor(f.cursor);
  if (after) {
    clauses.push('(cr.updated_at, cr.id) < (CAST(:afterU AS timestamptz), CAST(:afterI AS uuid))');
    replacements.afterU = after.u;
    replacements.afterI = after.i;
  }
  const rows = await sequelize.query<{ id: string; u: string }>(
    `SELECT cr.id, cr.updated_at::text AS u FROM change_requests cr JOIN tools t ON t.id = cr.tool_id
     WHERE ${clauses.join(' AND ')} ORDER BY cr.updated_at DESC, cr.id DESC LIMIT :limit`,
    { type: QueryTypes.SELECT, replacements },
  );
  const page = rows.slice(0, f.limit);
  const loaded = page.length
    ? await ChangeRequestModel.findAll({
        where: { id: page.map((p) => p.id) },
        include: [
          { association: 'tool', attributes: ['id', 'code', 'name', 'brandId', 'factoryId'], include: [{ association: 'brand', attributes: ['id', 'code', 'name'] }] },
          { association: 'submitter', attributes: ['id', 'name'] },
        ],
      })
    : [];
  const byId = new Map(loaded.map((r) => [r.id, r]));
  const last = page[page.length - 1];
  return {
    data: page.map((p) => toSummary(byId.get(p.id)!)),
    meta: { nextCursor: rows.length > f.limit && last ? encodeListCursor({ u: last.u, i: last.id }) : null },
  };
}
