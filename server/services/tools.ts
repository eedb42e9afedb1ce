// Tools: list and search, detail, create and edit, retention decisions and the retention list.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { handlingFor } from '../../shared/domain/handling';
import { productMakeability, type BillLineState } from '../../shared/domain/makeability';
import { addCalendarDays, assertRetentionYears, RETENTION_YEARS } from '../../shared/domain/retention';
import { lifeBandOf, ratedLifeFromClass } from '../../shared/domain/tool-life';
import type {
  CreateToolValues,
  ListToolsFilters,
  RetentionDueResponse,
  RetentionSettings,
  Tool,
  ToolDetail,
  ToolListResponse,
  UpdateToolValues,
  retentionDecisionInput,
} from '../../shared/schemas/registry';
import type { z } from 'zod';
import type { Actor } from '../lib/auth';
import { AppError } from '../lib/errors';
import { BillOfPartsModel, CompanySettingModel, PartModel, ProductModel, ToolModel, ToolRevisionModel } from '../models';
import { recordAudit } from './audit';
import { changesHoldingTool, holdingWords } from './tool-changes';
import { openChangesOf } from './request-numbers';
import {
  RETENTION_SETTING_KEY,
  assertEditable,
  checkBrandAndFactory,
  containsPattern,
  decodeCursor,
  encodeCursor,
  findVisibleTool,
  retentionYears,
  scopeOf,
  staleVersion,
  toPartDto,
  toRevisionDto,
  toToolDto,
  toolIncludes,
  toolViewFor,
  type Scope,
  type ToolView,
  toolAuditRecord,
} from './registry-common';

// ---------------------------------------------------------------------------------------------
// Filtering in SQL (the same rules as shared/domain/tool-life.ts and retention.ts)

/** Life band on the exact ratio, as lifeBandOf does. */
export const LIFE_BAND_SQL = `CASE WHEN t.shot_count >= t.rated_shots THEN 'spent'
  WHEN t.shot_count * 100 >= t.rated_shots::bigint * 80 THEN 'worn' ELSE 'fresh' END`;

/** Retention due date, as retentionDueDate does (PostgreSQL clamps 29 February like date-fns addYears). */
export const RETENTION_DUE_SQL = `CASE WHEN t.status = 'disposed' OR t.retention_decision IN ('scrap', 'sell') THEN NULL
  ELSE GREATEST(CASE WHEN t.retention_decision = 'keep_until' THEN t.retention_keep_until END,
                (COALESCE(t.last_run_date, t.build_date) + make_interval(years => :years))::date) END`;

type ToolFilters = Partial<Pick<ListToolsFilters, 'q' | 'brandId' | 'factoryId' | 'status' | 'lifeBand' | 'retentionDue'>> & { retentionDays: number };

function toolWhere(scope: Scope, f: ToolFilters, view: ToolView) {
  const clauses: string[] = [];
  const replacements: Record<string, unknown> = { years: view.years };
  if (scope.factoryId) {
    clauses.push('t.factory_id = :scopeFactoryId');
    replacements.scopeFactoryId = scope.factoryId;
  }
  if (f.q) {
    replacements.q = containsPattern(f.q);
    clauses.push(`(t.code ILIKE :q OR t.name ILIKE :q
      OR EXISTS (SELECT 1 FROM parts p WHERE p.tool_id = t.id AND p.name ILIKE :q)
      OR EXISTS (SELECT 1 FROM bill_of_parts b JOIN products pr ON pr.id = b.product_id
                 WHERE b.tool_id = t.id AND (pr.name ILIKE :q OR pr.sku ILIKE :q)))`);
  }
  if (f.brandId) {
    clauses.push('t.brand_id = :brandId');
    replacements.brandId = f.brandId;
  }
  if (f.factoryId) {
    clauses.push('t.factory_id = :factoryId');
    replacements.factoryId = f.factoryId;
  }
  if (f.status) {
    clauses.push('t.status = :status');
    replacements.status = f.status;
  }
  if (f.lifeBand) {
    clauses.push(`(${LIFE_BAND_SQL}) = :lifeBand`);
    replacements.lifeBand = f.lifeBand;
  }
  if (f.retentionDue !== undefined) {
    replacements.dueBy = addCalendarDays(view.today, f.retentionDays);
    const due = `(${RETENTION_DUE_SQL}) <= :dueBy::date`;
    clauses.push(f.retentionDue ? due : `NOT COALESCE(${due}, false)`);
  }
  return { sql: clauses.length ? clauses.join(' AND ') : 'true', replacements };
}

async function loadTools(ids: string[], transaction?: Transaction) {
  if (!ids.length) return [];
  const rows = await ToolModel.findAll({ where: { id: ids }, include: toolIncludes, transaction });
  const byId = new Map(rows.map((r) => [r.id, r]));
  return ids.map((id) => byId.get(id)!).filter(Boolean);
}

export async function listTools(sequelize: Sequelize, actor: Actor, f: ListToolsFilters): Promise<ToolListResponse> {
  const view = { ...(await toolViewFor(actor)), windowDays: f.retentionDays };
  const { sql, replacements } = toolWhere(scopeOf(actor), f, view);
  const after = decodeCursor(f.cursor);
  const rows = await sequelize.query<{ id: string; code: string }>(
    `SELECT t.id, t.code FROM tools t WHERE ${sql} ${after !== undefined ? 'AND t.code > :after' : ''} ORDER BY t.code ASC LIMIT :limit`,
    { type: QueryTypes.SELECT, replacements: { ...replacements, after, limit: f.limit + 1 } },
  );
  const page = rows.slice(0, f.limit);
  const tools = await loadTools(page.map((r) => r.id));
  return {
    data: tools.map((t) => toToolDto(t, view)),
    meta: { nextCursor: rows.length > f.limit ? encodeCursor(page[page.length - 1]!.code) : null },
  };
}

/** Every tool matching the filters, in code order (for the CSV export). */
export async function allMatchingTools(sequelize: Sequelize, actor: Actor, f: ToolFilters): Promise<Tool[]> {
  const view = { ...(await toolViewFor(actor)), windowDays: f.retentionDays };
  const { sql, replacements } = toolWhere(scopeOf(actor), f, view);
  const rows = await sequelize.query<{ id: string }>(`SELECT t.id FROM tools t WHERE ${sql} ORDER BY t.code ASC`, {
    type: QueryTypes.SELECT,
    replacements,
  });
  const out: Tool[] = [];
  for (let i = 0; i < rows.length; i += 500) {
    const tools = await loadTools(rows.slice(i, i + 500).map((r) => r.id));
    out.push(...tools.map((t) => toToolDto(t, view)));
  }
  return out;
}

export async function listRetentionDue(sequelize: Sequelize, actor: Actor, days: number): Promise<RetentionDueResponse> {
  const view = { ...(await toolViewFor(actor)), windowDays: days };
  const { sql, replacements } = toolWhere(scopeOf(actor), { retentionDue: true, retentionDays: days }, view);
  const rows = await sequelize.query<{ id: string }>(
    `SELECT t.id FROM tools t WHERE ${sql} ORDER BY (${RETENTION_DUE_SQL}) ASC, t.code ASC LIMIT 1000`,
    { type: QueryTypes.SELECT, replacements },
  );
  const tools = await loadTools(rows.map((r) => r.id));
  return { data: tools.map((t) => toToolDto(t, view)), meta: { days, years: view.years, today: view.today } };
}

// ---------------------------------------------------------------------------------------------
// Detail

/** Bill lines of the given products with their tools, for "can it still be made?". */
export async function billStatesFor(productIds: string[], scope: Scope, transaction?: Transaction) {
  const lines = productIds.length
    ? await BillOfPartsModel.findAll({
        where: { productId: productIds },
        include: [
          { model: PartModel, as: 'part', attributes: ['id', 'name'] },
          { model: ToolModel, as: 'tool', attributes: ['id', 'code', 'status', 'currentRevision', 'shotCount', 'ratedShots', 'factoryId'] },
        ],
        transaction,
      })
    : [];
  const byProduct = new Map<string, BillLineState[]>();
  for (const l of lines) {
    const state: BillLineState = {
      partName: l.part!.name,
      toolCode: l.tool!.code,
      toolStatus: l.tool!.status,
      toolCurrentRevision: l.tool!.currentRevision,
      revision: l.revision,
      lifeBand: lifeBandOf(l.tool!.ratedShots, l.tool!.shotCount),
      hidden: scope.factoryId !== null && l.tool!.factoryId !== scope.factoryId,
    };
    const list = byProduct.get(l.productId) ?? [];
    list.push(state);
    byProduct.set(l.productId, list);
  }
  return (productId: string) => productMakeability(byProduct.get(productId) ?? []);
}

export async function getToolDetail(actor: Actor, id: string): Promise<ToolDetail> {
  const tool = await findVisibleTool(actor, id);
  const view = await toolViewFor(actor);
  const [parts, revisions, lines] = await Promise.all([
    PartModel.findAll({ where: { toolId: id }, order: [['name', 'ASC']] }),
    ToolRevisionModel.findAll({ where: { toolId: id }, order: [['number', 'DESC']] }),
    BillOfPartsModel.findAll({
      where: { toolId: id },
      include: [
        { model: ProductModel, as: 'product', attributes: ['id', 'sku', 'name', 'status'] },
        { model: PartModel, as: 'part', attributes: ['id', 'name'] },
      ],
      order: [['revision', 'DESC']],
    }),
  ]);
  const makeability = await billStatesFor([...new Set(lines.map((l) => l.productId))], scopeOf(actor));
  const productCount = new Map<string, Set<string>>();
  for (const l of lines) productCount.set(l.partId, (productCount.get(l.partId) ?? new Set()).add(l.productId));

  const revisionProducts = (number: number) => {
    const byProduct = new Map<string, typeof lines>();
    for (const l of lines.filter((x) => x.revision === number)) byProduct.set(l.productId, [...(byProduct.get(l.productId) ?? []), l]);
    return [...byProduct.values()]
      .map((ls) => {
        const p = ls[0]!.product!;
        const m = makeability(p.id);
        return {
          id: p.id,
          sku: p.sku,
          name: p.name,
          status: p.status,
          parts: ls.map((l) => ({ partId: l.partId, partName: l.part!.name, quantityPerUnit: l.quantityPerUnit })).sort((a, b) => a.partName.localeCompare(b.partName)),
          moldableFromThisTool: tool.status !== 'disposed' && number === tool.currentRevision,
          canBeMade: m.canBeMade,
          reason: m.reason,
        };
      })
      .sort((a, b) => a.sku.localeCompare(b.sku));
  };

  return {
    ...toToolDto(tool, view),
    parts: parts.map((p) => ({ ...toPartDto(p), productCount: productCount.get(p.id)?.size ?? 0 })),
    revisions: revisions.map((r) => ({ ...toRevisionDto(r), isCurrent: r.number === tool.currentRevision, products: revisionProducts(r.number) })),
    openChanges: await openChangesOf(actor, tool.id),
    handling: handlingFor(tool.weightKg),
  };
}

// ---------------------------------------------------------------------------------------------
// Create and edit

function ratedLifeOrError(moldClass: number) {
  const life = ratedLifeFromClass(moldClass);
  if (!life) {
    throw new AppError('validation_failed', `Mold class ${moldClass} has no published figure: enter the rated shots and their source`, 400, {
      ratedShots: ['Enter the rated shots (e.g. from the mold maker)'],
    });
  }
  return life;
}

async function partCavities(toolId: string, transaction?: Transaction, excludePartId?: string) {
  const parts = await PartModel.findAll({ where: { toolId }, attributes: ['id', 'cavitiesPerShot'], transaction });
  return parts.filter((p) => p.id !== excludePartId).reduce((s, p) => s + p.cavitiesPerShot, 0);
}

/** Creates the tool and its revision 1 ("as built"). Shared by the API, the CSV import and the seed. */
export async function insertTool(actor: Actor | null, input: CreateToolValues, today: string, transaction: Transaction) {
  const rated = input.ratedShots !== undefined ? { ratedShots: input.ratedShots, source: input.ratedShotsSource! } : ratedLifeOrError(input.moldClass);
  const tool = await ToolModel.create(
    {
      code: input.code,
      name: input.name,
      brandId: input.brandId,
      factoryId: input.factoryId,
      construction: input.construction,
      moldClass: input.moldClass,
      ratedShots: rated.ratedShots,
      ratedShotsSource: rated.source,
      cavityCount: input.cavityCount,
      weightKg: input.weightKg,
      buildCostCents: input.buildCostCents,
      currency: input.currency,
      buildDate: input.buildDate,
      shotCount: input.shotCount,
      lastRunDate: input.lastRunDate,
      status: input.status,
      storageLocation: input.storageLocation,
      currentRevision: 1,
    },
    { transaction },
  );
  await ToolRevisionModel.create({ toolId: tool.id, number: 1, madeOn: input.buildDate ?? today, changeRequestId: null, note: 'As built' }, { transaction });
  return tool;
}

export async function createTool(sequelize: Sequelize, actor: Actor, input: CreateToolValues): Promise<Tool> {
  await checkBrandAndFactory(input.brandId, input.factoryId);
  if (await ToolModel.findOne({ where: { code: input.code }, attributes: ['id'] })) {
    throw new AppError('conflict', `A tool with code ${input.code} already exists`, 409, { code: ['Already in use'] });
  }
  const view = await toolViewFor(actor);
  return sequelize.transaction(async (transaction) => {
    const created = await insertTool(actor, input, view.today, transaction);
    await created.reload({ include: toolIncludes, transaction });
    const dto = toToolDto(created, view);
    await recordAudit(transaction, actor, 'tool.create', 'tool', created.id, null, dto);
    return dto;
  });
}

/** The stored fields an edit may change, for before/after in the audit trail. */
const auditable = toolAuditRecord;

export async function updateTool(sequelize: Sequelize, actor: Actor, id: string, input: UpdateToolValues): Promise<Tool> {
  await checkBrandAndFactory(input.brandId, input.factoryId);
  const view = await toolViewFor(actor);
  return sequelize.transaction(async (transaction) => {
    const tool = await findVisibleTool(actor, id, { transaction, lock: true });
    assertEditable(tool);
    if (input.version !== tool.version) throw staleVersion('tool', toToolDto(tool, view));
    const before = auditable(tool);
    const { version: _version, ...changes } = input;

    if (changes.moldClass !== undefined && changes.moldClass !== tool.moldClass && changes.ratedShots === undefined) {
      // The rated life follows the class unless someone entered their own figure for this tool.
      const old = ratedLifeFromClass(tool.moldClass);
      if (old && old.ratedShots === tool.ratedShots && old.source === tool.ratedShotsSource) {
        const next = ratedLifeOrError(changes.moldClass);
        changes.ratedShots = next.ratedShots;
        changes.ratedShotsSource = next.source;
      }
    }
    if (changes.cavityCount !== undefined) {
      const used = await partCavities(tool.id, transaction);
      if (changes.cavityCount < used) {
        throw new AppError('validation_failed', `The parts of this tool already take ${used} cavities`, 400, {
          cavityCount: [`At least ${used}: the parts of this tool take ${used} cavities per shot`],
        });
      }
    }
    const buildDate = changes.buildDate !== undefined ? changes.buildDate : tool.buildDate;
    const lastRunDate = changes.lastRunDate !== undefined ? changes.lastRunDate : tool.lastRunDate;
    if (buildDate && lastRunDate && lastRunDate < buildDate) {
      throw new AppError('validation_failed', 'The last run cannot be before the build date', 400, { lastRunDate: ['Before the build date'] });
    }
    if (changes.status !== undefined && changes.status !== tool.status) {
      const holding = await changesHoldingTool(tool.id, transaction);
      if (holding.length) {
        throw new AppError('wrong_state', `Tool ${tool.code} stays "being changed" until ${holdingWords(holding)} is closed or cancelled. Finish or cancel that change first.`, 409, {
          status: ['Stays "being changed" while a change cleared to cut is open'],
        });
      }
    }
    tool.set(changes as Partial<ToolModel>);
    if (!tool.changed()) return toToolDto(tool, view);
    await tool.save({ transaction });
    await tool.reload({ include: toolIncludes, transaction });
    await recordAudit(transaction, actor, 'tool.update', 'tool', tool.id, before, auditable(tool));
    return toToolDto(tool, view);
  });
}

export async function recordRetentionDecision(
  sequelize: Sequelize,
  actor: Actor,
  id: string,
  input: z.output<typeof retentionDecisionInput>,
): Promise<Tool> {
  const view = await toolViewFor(actor);
  return sequelize.transaction(async (transaction) => {
    const tool = await findVisibleTool(actor, id, { transaction, lock: true });
    assertEditable(tool);
    if (input.version !== tool.version) throw staleVersion('tool', toToolDto(tool, view));
    if (input.decision === 'keep_until' && input.keepUntil! <= view.today) {
      throw new AppError('validation_failed', 'Keep the tool until a date after today', 400, { keepUntil: ['Pick a date after today'] });
    }
    if (input.decision !== 'keep_until') {
      const holding = await changesHoldingTool(tool.id, transaction);
      if (tool.status === 'in_change' || holding.length) {
        const which = holding.length ? holdingWords(holding) : 'its change';
        throw new AppError('wrong_state', `Tool ${tool.code} is being changed: close or cancel ${which} before scrapping or selling it`, 409);
      }
    }
    const before = auditable(tool);
    tool.set({
      retentionDecision: input.decision,
      retentionKeepUntil: input.decision === 'keep_until' ? input.keepUntil! : null,
      retentionDecidedBy: actor.id,
      retentionDecidedAt: new Date(),
      retentionNote: input.note,
      // Scrapped or sold, the tool leaves the company: its record stays, read-only.
      status: input.decision === 'keep_until' ? (tool.status === 'idle' ? 'retained' : tool.status) : 'disposed',
    });
    await tool.save({ transaction });
    await tool.reload({ include: toolIncludes, transaction });
    await recordAudit(transaction, actor, 'tool.retention_decision', 'tool', tool.id, before, auditable(tool));
    return toToolDto(tool, view);
  });
}

// ---------------------------------------------------------------------------------------------
// Parts

export async function createPart(sequelize: Sequelize, actor: Actor, toolId: string, input: { name: string; resin: string; cavitiesPerShot: number }) {
  return sequelize.transaction(async (transaction) => {
    const tool = await findVisibleTool(actor, toolId, { transaction, lock: true, include: false });
    assertEditable(tool);
    await checkPartFits(tool, input.name, input.cavitiesPerShot, transaction);
    const part = await PartModel.create({ toolId, ...input }, { transaction });
    await recordAudit(transaction, actor, 'part.create', 'part', part.id, null, toPartDto(part));
    return toPartDto(part);
  });
}

async function checkPartFits(tool: ToolModel, name: string | undefined, cavities: number | undefined, transaction: Transaction, partId?: string) {
  if (name !== undefined) {
    const clash = await PartModel.findOne({ where: { toolId: tool.id, name }, attributes: ['id'], transaction });
    if (clash && clash.id !== partId) throw new AppError('conflict', `Tool ${tool.code} already has a part named "${name}"`, 409, { name: ['Already used on this tool'] });
  }
  if (cavities !== undefined) {
    const used = await partCavities(tool.id, transaction, partId);
    if (used + cavities > tool.cavityCount) {
      throw new AppError('validation_failed', `Tool ${tool.code} has ${tool.cavityCount} cavities and its other parts take ${used}`, 400, {
        cavitiesPerShot: [`At most ${tool.cavityCount - used} on this tool`],
      });
    }
  }
}

export async function updatePart(
  sequelize: Sequelize,
  actor: Actor,
  partId: string,
  input: { name?: string; resin?: string; cavitiesPerShot?: number },
) {
  return sequelize.transaction(async (transaction) => {
    const found = await PartModel.findByPk(partId, { transaction });
    if (!found) throw new AppError('not_found', 'Part was not found', 404);
    const tool = await findVisibleTool(actor, found.toolId, { transaction, lock: true, include: false }).catch(() => {
      throw new AppError('not_found', 'Part was not found', 404);
    });
    assertEditable(tool);
    await checkPartFits(tool, input.name, input.cavitiesPerShot, transaction, partId);
    const part = (await PartModel.findByPk(partId, { transaction, lock: transaction.LOCK.UPDATE }))!;
    const before = toPartDto(part);
    part.set(input);
    if (!part.changed()) return before;
    await part.save({ transaction });
    await recordAudit(transaction, actor, 'part.update', 'part', part.id, before, toPartDto(part));
    return toPartDto(part);
  });
}

// ---------------------------------------------------------------------------------------------
// Retention setting

export async function getRetentionSettings(): Promise<RetentionSettings> {
  return { years: await retentionYears(), min: RETENTION_YEARS.min, max: RETENTION_YEARS.max, default: RETENTION_YEARS.default };
}

export async function setRetentionYears(sequelize: Sequelize, actor: Actor, years: number): Promise<RetentionSettings> {
  assertRetentionYears(years);
  await sequelize.transaction(async (transaction) => {
    const row = await CompanySettingModel.findByPk(RETENTION_SETTING_KEY, { transaction, lock: transaction.LOCK.UPDATE });
    const before = row ? { years: row.value } : null;
    if (row) {
      row.value = years;
      await row.save({ transaction });
    } else {
      await CompanySettingModel.create({ key: RETENTION_SETTING_KEY, value: years }, { transaction });
    }
    await recordAudit(transaction, actor, 'setting.update', 'company_setting', RETENTION_SETTING_KEY, before, { years });
  });
  return getRetentionSettings();
}
