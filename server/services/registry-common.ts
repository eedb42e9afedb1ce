// Helpers shared by the registry services: who may see what, DTO mapping, the retention setting,
// keyset cursors and literal search patterns.
import type { Transaction } from 'sequelize';
import { RETENTION_YEARS, RETENTION_WINDOW_DAYS, retentionSummary, todayInZone } from '../../shared/domain/retention';
import { toolLife } from '../../shared/domain/tool-life';
import type { Part, Product, Revision, Tool } from '../../shared/schemas/registry';
import type { Actor } from '../lib/auth';
import { AppError, notFound } from '../lib/errors';
import { BrandModel, CompanySettingModel, FactoryModel, type PartModel, type ProductModel, ToolModel, type ToolRevisionModel, UserModel } from '../models';

export const RETENTION_SETTING_KEY = 'retention_years';

/** The company's retention period in years (the stored setting, or the default when unset or out of range). */
export async function retentionYears(transaction?: Transaction): Promise<number> {
  const row = await CompanySettingModel.findByPk(RETENTION_SETTING_KEY, { transaction });
  const v = row?.value;
  return typeof v === 'number' && Number.isInteger(v) && v >= RETENTION_YEARS.min && v <= RETENTION_YEARS.max ? v : RETENTION_YEARS.default;
}

/** What the caller can see: toolmakers only their own factory's tools; company roles every tool. */
export interface Scope {
  factoryId: string | null;
}
export const scopeOf = (actor: Actor): Scope => ({ factoryId: actor.role === 'toolmaker' ? (actor.factoryId ?? '00000000-0000-0000-0000-000000000000') : null });
export const canSeeTool = (scope: Scope, tool: { factoryId: string }) => scope.factoryId === null || scope.factoryId === tool.factoryId;

export const toolIncludes = [
  { model: BrandModel, as: 'brand', attributes: ['id', 'code', 'name'] },
  { model: FactoryModel, as: 'factory', attributes: ['id', 'name'] },
  { model: UserModel, as: 'decider', attributes: ['id', 'name'] },
];

/** Context every tool DTO needs: the retention period and the caller's today. */
export interface ToolView {
  years: number;
  today: string;
  windowDays: number;
}

export async function toolViewFor(actor: Actor, transaction?: Transaction): Promise<ToolView> {
  return { years: await retentionYears(transaction), today: todayInZone(actor.timeZone), windowDays: RETENTION_WINDOW_DAYS };
}

/**
 * A tool the caller may see, or 404. A toolmaker asking for another factory's tool gets the same
 * 404 as for a tool that does not exist, so existence does not leak.
 */
export async function findVisibleTool(actor: Actor, id: string, opts: { transaction?: Transaction; lock?: boolean; include?: boolean } = {}) {
  const tool = await ToolModel.findByPk(id, {
    transaction: opts.transaction,
    ...(opts.lock && opts.transaction ? { lock: opts.transaction.LOCK.UPDATE } : {}),
    ...(opts.include === false ? {} : { include: opts.lock ? [] : toolIncludes }),
  });
  if (!tool || !canSeeTool(scopeOf(actor), tool)) throw notFound('Tool');
  if (opts.lock && opts.include !== false) await tool.reload({ include: toolIncludes, transaction: opts.transaction });
  return tool;
}

export function assertEditable(tool: ToolModel) {
  if (tool.status === 'disposed') {
    const when = tool.retentionDecidedAt ? ` on ${tool.retentionDecidedAt.toISOString().slice(0, 10)}` : '';
    throw new AppError(
      'wrong_state',
      `Tool ${tool.code} was disposed${when}. Its record stays for reference and can no longer be changed.`,
      409,
    );
  }
}

export const iso = (d: Date | string) => (typeof d === 'string' ? d : d.toISOString());

export function toToolDto(t: ToolModel, view: ToolView): Tool {
  const years = view.years;
  const retention = retentionSummary(
    { lastRunDate: t.lastRunDate, buildDate: t.buildDate, years, status: t.status, decision: t.retentionDecision ?? null, keepUntil: t.retentionKeepUntil ?? null },
    view.today,
    view.windowDays,
  );
  const life = toolLife({ ratedShots: t.ratedShots, shotCount: t.shotCount });
  return {
    id: t.id,
    code: t.code,
    name: t.name,
    brand: { id: t.brand!.id, code: t.brand!.code, name: t.brand!.name },
    factory: { id: t.factory!.id, name: t.factory!.name },
    construction: t.construction,
    moldClass: t.moldClass,
    ratedShots: t.ratedShots,
    ratedShotsSource: t.ratedShotsSource,
    cavityCount: t.cavityCount,
    weightKg: t.weightKg,
    buildCostCents: t.buildCostCents,
    currency: t.currency.trim(),
    buildDate: t.buildDate,
    shotCount: t.shotCount,
    lastRunDate: t.lastRunDate,
    status: t.status,
    storageLocation: t.storageLocation,
    currentRevision: t.currentRevision,
    version: t.version,
    readOnly: t.status === 'disposed',
    life,
    retention: {
      ...retention,
      years,
      decision: t.retentionDecision
        ? {
            decision: t.retentionDecision,
            keepUntil: t.retentionKeepUntil ?? null,
            decidedBy: t.decider ? { id: t.decider.id, name: t.decider.name } : null,
            decidedAt: iso(t.retentionDecidedAt!),
            note: t.retentionNote ?? null,
          }
        : null,
    },
    createdAt: iso(t.createdAt),
    updatedAt: iso(t.updatedAt),
  };
}

export const toPartDto = (p: PartModel): Part => ({
  id: p.id,
  toolId: p.toolId,
  name: p.name,
  resin: p.resin,
  cavitiesPerShot: p.cavitiesPerShot,
  createdAt: iso(p.createdAt),
  updatedAt: iso(p.updatedAt),
});

export const toRevisionDto = (r: ToolRevisionModel): Revision => ({
  id: r.id,
  toolId: r.toolId,
  number: r.number,
  madeOn: r.madeOn,
  changeRequestId: r.changeRequestId,
  note: r.note,
  createdAt: iso(r.createdAt),
});

export function toProductDto(p: ProductModel): Product {
  return {
    id: p.id,
    sku: p.sku,
    name: p.name,
    brand: { id: p.brand!.id, code: p.brand!.code, name: p.brand!.name },
    status: p.status,
    fobCents: p.fobCents,
    wholesaleCents: p.wholesaleCents,
    retailCents: p.retailCents,
    currency: p.currency.trim(),
    plannedUnits: p.plannedUnits,
    version: p.version,
    createdAt: iso(p.createdAt),
    updatedAt: iso(p.updatedAt),
  };
}

/** Keyset cursor: the last row's sort key, opaque to clients. */
export function encodeCursor(key: string): string {
  return Buffer.from(JSON.stringify({ k: key }), 'utf8').toString('base64url');
}
export function decodeCursor(cursor: string | undefined): string | undefined {
  if (!cursor) return undefined;
  try {
    const v = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8')) as { k?: unknown };
    if (typeof v.k === 'string' && v.k.length <= 64) return v.k;
  } catch {
    // fall through
  }
  throw new AppError('validation_failed', 'That page cursor is not valid: start again from the first page', 400, { cursor: ['Not a valid cursor'] });
}

/** ILIKE pattern matching the text literally anywhere (%, _ and \ are escaped). */
export const containsPattern = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

export async function checkBrandAndFactory(brandId: string | undefined, factoryId: string | undefined, transaction?: Transaction) {
  const fieldErrors: Record<string, string[]> = {};
  if (brandId && !(await BrandModel.findByPk(brandId, { transaction }))) fieldErrors.brandId = ['Unknown brand'];
  if (factoryId && !(await FactoryModel.findByPk(factoryId, { transaction }))) fieldErrors.factoryId = ['Unknown factory'];
  if (Object.keys(fieldErrors).length) throw new AppError('validation_failed', 'Pick an existing brand and factory', 400, fieldErrors);
}

export function staleVersion(what: string, current: unknown) {
  return new AppError('stale_version', `Someone else changed this ${what} since you loaded it. Here is the current version: review it and try again.`, 409, undefined, {
    current,
  });
}

/** What an audit event keeps of a tool: its own columns, without version, timestamps or joined rows. */
export const toolAuditRecord = (t: ToolModel) => {
  const { version: _v, createdAt: _c, updatedAt: _u, ...rest } = t.get({ plain: true }) as Record<string, unknown>;
  for (const k of ['brand', 'factory', 'decider', 'parts', 'revisions']) delete rest[k];
  return rest;
};

/** What an audit event keeps of a product, as for tools. */
export const productAuditRecord = (p: ProductModel) => {
  const { brand: _b, bill: _l, createdAt: _c, updatedAt: _u, version: _v, ...rest } = p.get({ plain: true }) as Record<string, unknown>;
  return rest;
};
