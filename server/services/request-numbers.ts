// The numbers behind a change request: read the engineer's estimate and plan inputs, load what the
// registry knows (tool life, the derivative's planned units and prices, the affected parts'
// cavities), compute every figure with shared/domain/request-numbers.ts, and save new inputs.
// Also a tool's remaining life against the plans of all its open changes.
//
// Who: every role that may see the request reads the figures, except toolmakers (prices and margins
// stay with the brand and engineering); a tooling engineer changes the inputs during engineering
// review. The estimate lives in change_requests.estimate (the impact reads the costs of the ways to
// keep ended products from it), the rest in change_requests.numbers_inputs.
import { Op, type Sequelize, type Transaction } from 'sequelize';
import { stateLabel, type RequestState } from '../../shared/domain/lifecycle';
import {
  computeRequestNumbers,
  EMPTY_NUMBERS_INPUTS,
  openPlansVersusLife,
  type NumbersFacts,
  type NumbersInputs,
} from '../../shared/domain/request-numbers';
import { requestRef } from '../../shared/schemas/change-requests';
import { numbersInputsSchema, type RequestNumbers, type saveNumbersInput, type ToolOpenPlans } from '../../shared/schemas/numbers';
import type { z } from 'zod';
import type { Actor } from '../lib/auth';
import { AppError, forbidden } from '../lib/errors';
import { BillOfPartsModel, ChangeItemModel, ChangeRequestModel, PartModel, ProductModel, ToolModel } from '../models';
import { recordAudit } from './audit';
import { canSeeRequest } from './request-access';
import { accessFacts, findVisibleRequest } from './request-views';
import { findVisibleTool, iso, staleVersion } from './registry-common';

export type SaveNumbersValues = z.output<typeof saveNumbersInput>;

/** The states in which a change is no longer open (its plan no longer draws on the tool). */
export const FINISHED_STATES: readonly RequestState[] = ['closed', 'declined', 'withdrawn'];

// ---------------------------------------------------------------------------------------------
// Stored inputs

/** The stored inputs, every field present. Anything unreadable is dropped (and reported by `problems`). */
export function storedInputs(r: Pick<ChangeRequestModel, 'estimate' | 'numbersInputs'>): { inputs: NumbersInputs; problems: string[] } {
  const problems: string[] = [];
  const raw = { estimate: r.estimate ?? undefined, ...(r.numbersInputs ?? {}) };
  const parsed = numbersInputsSchema.safeParse(raw);
  if (parsed.success) return { inputs: parsed.data, problems };
  // Keep what still reads, part by part.
  const inputs: NumbersInputs = { ...EMPTY_NUMBERS_INPUTS };
  for (const key of ['estimate', 'plan', 'dimension', 'clamp'] as const) {
    const one = numbersInputsSchema.shape[key].safeParse(raw[key as keyof typeof raw]);
    if (one.success) (inputs as unknown as Record<string, unknown>)[key] = one.data;
    else problems.push(`The stored ${key} could not be read and is left out; enter it again.`);
  }
  return { inputs, problems };
}

const toStored = (inputs: NumbersInputs) => ({
  estimate: { ...inputs.estimate } as Record<string, unknown>,
  numbersInputs: { plan: inputs.plan, dimension: inputs.dimension, clamp: inputs.clamp } as Record<string, unknown>,
});

// ---------------------------------------------------------------------------------------------
// Registry facts

/** Loads what the figures need about the request's tool, derivative, affected and ended products. */
export async function loadNumbersFacts(
  r: Pick<ChangeRequestModel, 'id' | 'toolId' | 'derivativeProductId' | 'endedProductIds'>,
  transaction?: Transaction,
): Promise<NumbersFacts> {
  const tool = await ToolModel.findByPk(r.toolId, { attributes: ['id', 'code', 'ratedShots', 'shotCount', 'ratedShotsSource', 'currency'], transaction });
  if (!tool) throw new AppError('not_found', 'Tool was not found', 404);
  const derivative = r.derivativeProductId ? await ProductModel.findByPk(r.derivativeProductId, { transaction }) : null;
  const items = await ChangeItemModel.findAll({ where: { requestId: r.id }, attributes: ['partId', 'position'], order: [['position', 'ASC']], transaction });
  const partIds = [...new Set(items.map((i) => i.partId))];
  const parts = partIds.length ? await PartModel.findAll({ where: { id: partIds }, transaction }) : [];
  const byId = new Map(parts.map((p) => [p.id, p]));
  const lines =
    derivative && partIds.length
      ? await BillOfPartsModel.findAll({ where: { productId: derivative.id, partId: partIds }, order: [['revision', 'DESC']], transaction })
      : [];
  const ended = r.endedProductIds.length
    ? await ProductModel.findAll({ where: { id: r.endedProductIds }, attributes: ['id', 'sku', 'name', 'plannedUnits'], order: [['sku', 'ASC']], transaction })
    : [];
  return {
    tool: {
      id: tool.id,
      code: tool.code,
      ratedShots: tool.ratedShots,
      shotCount: tool.shotCount,
      ratedShotsSource: tool.ratedShotsSource,
      currency: tool.currency.trim(),
    },
    derivative: derivative
      ? {
          id: derivative.id,
          sku: derivative.sku,
          name: derivative.name,
          plannedUnits: derivative.plannedUnits,
          fobCents: derivative.fobCents,
          wholesaleCents: derivative.wholesaleCents,
          retailCents: derivative.retailCents,
          currency: derivative.currency.trim(),
        }
      : null,
    parts: partIds
      .map((id) => byId.get(id))
      .filter((p): p is PartModel => !!p)
      .map((p) => ({
        id: p.id,
        name: p.name,
        resin: p.resin,
        cavitiesPerShot: p.cavitiesPerShot,
        // The derivative's newest bill line for the part (lines are ordered newest revision first).
        derivativeQuantityPerUnit: lines.find((l) => l.partId === p.id)?.quantityPerUnit ?? null,
      })),
    ended: ended.map((p) => ({ id: p.id, sku: p.sku, name: p.name, plannedUnits: p.plannedUnits })),
  };
}

// ---------------------------------------------------------------------------------------------
// Who may read and change

function assertMayRead(actor: Actor) {
  if (actor.role === 'toolmaker') {
    throw forbidden('The figures behind a change (prices, margins and costs) are kept to the brand and engineering.');
  }
}

/** Why the caller may not change the inputs now, or null when they may. */
export function numbersEditRefusal(actor: Actor, r: ChangeRequestModel): AppError | null {
  if (actor.role !== 'engineer') return forbidden('Only a tooling engineer enters the estimate and the plan, during engineering review.');
  if (r.tool?.status === 'disposed') return new AppError('wrong_state', 'The tool of this request was disposed: its record can no longer be changed.', 409);
  if (r.status !== 'engineering_review') {
    return new AppError(
      'wrong_state',
      `This request is now "${stateLabel(r.status)}": the estimate and the plan are entered during engineering review. Ask for it to be returned to engineering review to change them.`,
      409,
    );
  }
  return null;
}

function readOnlyReason(actor: Actor, r: ChangeRequestModel): string | null {
  const refusal = numbersEditRefusal(actor, r);
  if (!refusal) return null;
  if (actor.role === 'brand_lead') return 'The tooling engineer enters these figures; you see what you approve.';
  return refusal.message;
}

// ---------------------------------------------------------------------------------------------
// Read and save

async function numbersOf(actor: Actor, r: ChangeRequestModel, transaction?: Transaction): Promise<RequestNumbers> {
  const { inputs, problems } = storedInputs(r);
  const facts = await loadNumbersFacts(r, transaction);
  const result = computeRequestNumbers(inputs, facts);
  const refusal = readOnlyReason(actor, r);
  return {
    requestId: r.id,
    version: r.version,
    status: r.status,
    canEdit: refusal === null,
    readOnlyReason: refusal,
    inputs,
    facts,
    result: problems.length ? { ...result, problems: [...problems, ...result.problems] } : result,
    updatedAt: iso(r.updatedAt),
  };
}

export async function getRequestNumbers(actor: Actor, id: string): Promise<RequestNumbers> {
  assertMayRead(actor);
  return numbersOf(actor, await findVisibleRequest(actor, id));
}

export async function saveRequestNumbers(sequelize: Sequelize, actor: Actor, id: string, input: SaveNumbersValues): Promise<RequestNumbers> {
  return sequelize.transaction(async (transaction) => {
    const r = await findVisibleRequest(actor, id, { transaction, lock: true });
    const refusal = numbersEditRefusal(actor, r);
    if (refusal) throw refusal;
    if (input.version !== r.version) throw staleVersion('change request', await numbersOf(actor, r, transaction));

    const { version: _seen, ...values } = input;
    const before = { estimate: r.estimate, numbersInputs: r.numbersInputs };
    const after = toStored(values);
    if (JSON.stringify(storedInputs(r).inputs) === JSON.stringify(values)) return numbersOf(actor, r, transaction);

    r.estimate = after.estimate;
    r.numbersInputs = after.numbersInputs;
    // The version the editor saw (checked above under the row lock); Sequelize adds it to the WHERE
    // clause and bumps it, so a concurrent write can never be silently overwritten.
    r.set('version', input.version, { raw: true });
    r.changed('updatedAt', true);
    await r.save({ transaction });
    await recordAudit(transaction, actor, 'change_request.numbers', 'change_request', r.id, before, after);
    return numbersOf(actor, await findVisibleRequest(actor, r.id, { transaction }), transaction);
  });
}

// ---------------------------------------------------------------------------------------------
// A tool's open changes and their life against all open plans

/** The tool's changes that are still open and that the caller may see, oldest first (for the tool detail). */
export async function openChangesOf(actor: Actor, toolId: string, transaction?: Transaction) {
  const rows = await ChangeRequestModel.findAll({
    where: { toolId, status: { [Op.notIn]: [...FINISHED_STATES] } },
    attributes: ['id', 'title', 'status', 'submitterId', 'acceptedByRoles', 'number'],
    include: [{ association: 'tool', attributes: ['id', 'brandId', 'factoryId', 'status'] }],
    order: [['number', 'ASC']],
    transaction,
  });
  return rows.filter((r) => canSeeRequest(actor, accessFacts(r))).map((r) => ({ id: r.id, title: r.title, status: r.status }));
}

export async function getToolOpenPlans(actor: Actor, toolId: string): Promise<ToolOpenPlans> {
  const tool = await findVisibleTool(actor, toolId, { include: false });
  const requests = await ChangeRequestModel.findAll({
    where: { toolId, status: { [Op.notIn]: [...FINISHED_STATES] } },
    include: [
      { association: 'tool', attributes: ['id', 'brandId', 'factoryId', 'status'] },
      { association: 'derivativeProduct', attributes: ['id', 'sku', 'name'] },
    ],
    order: [['number', 'ASC']],
  });
  const visible = requests.filter((r) => canSeeRequest(actor, accessFacts(r)));
  const plans: ToolOpenPlans['plans'] = [];
  for (const r of visible) {
    const { inputs } = storedInputs(r);
    const result = computeRequestNumbers(inputs, await loadNumbersFacts(r));
    const plan = result.run.plan;
    const governing = result.run.parts.find((p) => p.partId === result.run.governingPartId);
    plans.push({
      requestId: r.id,
      ref: requestRef(r.number),
      title: r.title,
      status: r.status,
      derivative: r.derivativeProduct ? { id: r.derivativeProduct.id, sku: r.derivativeProduct.sku, name: r.derivativeProduct.name } : null,
      plannedUnits: result.plan.plannedUnits.value,
      shotsNeeded: plan?.shotsNeeded ?? null,
      governingPart: governing?.partName ?? null,
      summary: plan?.summary ?? null,
    });
  }
  return {
    tool: { id: tool.id, code: tool.code, ratedShots: tool.ratedShots, shotCount: tool.shotCount, ratedShotsSource: tool.ratedShotsSource },
    plans,
    total: openPlansVersusLife(tool.ratedShots - tool.shotCount, plans),
  };
}
