// The gates before a signature (shared/domain/gates.ts) and the value at risk
// (shared/domain/value-at-risk.ts) of a request: loads what they look at from the request and the
// registry. The workflow refuses a gated action with 422; the request detail lists the gaps.
import type { Transaction } from 'sequelize';
import { gapsAsFieldErrors, gateGaps, gateRefusalMessage, type GateFacts, type GateGap } from '../../shared/domain/gates';
import type { ImpactResult } from '../../shared/domain/impact';
import { lifecycle, requestActions, type RequestAction } from '../../shared/domain/lifecycle';
import { minorUnitDigits } from '../../shared/domain/money';
import { valueAtRisk, type ValueAtRiskResult } from '../../shared/domain/value-at-risk';
import type { ImpactProductDto } from '../../shared/schemas/change-requests';
import { estimateInput } from '../../shared/schemas/numbers';
import { AppError } from '../lib/errors';
import { ProductModel, ToolModel, type ChangeItemModel, type ChangeRequestModel } from '../models';

function validCurrency(code: string | null | undefined): string | null {
  const c = (code ?? '').trim().toUpperCase();
  if (!/^[A-Z]{3}$/.test(c)) return null;
  try {
    minorUnitDigits(c);
    return c;
  } catch {
    return null;
  }
}

export interface GateContext {
  facts: GateFacts;
  tool: { shotCount: number; ratedShots: number };
}

export async function loadGateFacts(
  r: ChangeRequestModel,
  items: readonly ChangeItemModel[],
  impact: ImpactResult<ImpactProductDto>,
  transaction?: Transaction,
): Promise<GateContext> {
  const tool = await ToolModel.findByPk(r.toolId, { attributes: ['id', 'code', 'buildCostCents', 'currency', 'shotCount', 'ratedShots'], transaction });
  // The stored estimate as the numbers screen reads it; an unreadable one counts as not entered.
  const parsed = estimateInput.safeParse(r.estimate ?? {});
  const estimate = parsed.success ? parsed.data : { modificationCostCents: null, leadDays: null, newInsertCents: null, duplicateToolCents: null };
  const plan = (r.numbersInputs as { plan?: { currency?: unknown } } | null)?.plan;
  const derivative = r.derivativeProductId ? await ProductModel.findByPk(r.derivativeProductId, { attributes: ['id', 'currency'], transaction }) : null;
  const entered = validCurrency(typeof plan?.currency === 'string' ? plan.currency : null);
  const fromProduct = validCurrency(derivative?.currency);
  const code = entered ?? fromProduct ?? validCurrency(tool?.currency) ?? 'USD';
  const endedIds = impact.endedProducts.map((p) => p.id);
  const ended = endedIds.length
    ? await ProductModel.findAll({ where: { id: endedIds }, attributes: ['id', 'sku', 'name', 'plannedUnits', 'fobCents', 'wholesaleCents', 'currency'], order: [['sku', 'ASC']], transaction })
    : [];
  return {
    facts: {
      items: items.map((i) => ({ position: i.position, partName: i.part?.name ?? 'part', effect: i.effect ?? null, method: i.method ?? null })),
      estimate: {
        modificationCostCents: estimate.modificationCostCents,
        leadDays: estimate.leadDays,
        newInsertCents: estimate.newInsertCents,
        duplicateToolCents: estimate.duplicateToolCents,
      },
      currency: { code, known: !!(entered ?? fromProduct) },
      derivativeProductId: r.derivativeProductId ?? null,
      noDerivativeReason: r.noDerivativeReason ?? null,
      tool: { id: r.toolId, code: tool?.code ?? '', buildCostCents: tool?.buildCostCents ?? null },
      endedProducts: ended.map((p) => ({
        id: p.id,
        sku: p.sku,
        name: p.name,
        plannedUnits: p.plannedUnits,
        fobCents: p.fobCents,
        wholesaleCents: p.wholesaleCents,
        currency: p.currency.trim(),
      })),
    },
    tool: { shotCount: tool?.shotCount ?? 0, ratedShots: tool?.ratedShots ?? 0 },
  };
}

/** The gaps of each gated action that the request's state allows (the screens list them). */
export function gatesFor(r: Pick<ChangeRequestModel, 'status'>, facts: GateFacts): Partial<Record<RequestAction, GateGap[]>> {
  const out: Partial<Record<RequestAction, GateGap[]>> = {};
  for (const a of requestActions) {
    const rule = lifecycle.actions[a];
    if (rule.gate && rule.from.includes(r.status)) out[a] = gateGaps(rule.gate, facts);
  }
  return out;
}

/** Refuses a gated action whose gate has gaps: 422 with one field error per gap. */
export function assertGatePassed(action: RequestAction, facts: GateFacts) {
  const gate = lifecycle.actions[action].gate;
  if (!gate) return;
  const gaps = gateGaps(gate, facts);
  if (gaps.length) throw new AppError('gate_not_passed', gateRefusalMessage(gate, gaps), 422, gapsAsFieldErrors(gaps));
}

/** The value at risk, once every figure it needs exists (null otherwise, or when nothing is ended). */
export function valueAtRiskOf(ctx: GateContext): ValueAtRiskResult | null {
  const f = ctx.facts;
  if (f.endedProducts.length === 0) return null;
  const { modificationCostCents: cut, newInsertCents: insert, duplicateToolCents: dup } = f.estimate;
  if (cut === null || insert === null || dup === null || f.tool.buildCostCents === null) return null;
  const products = [];
  for (const p of f.endedProducts) {
    if (p.fobCents === null || p.wholesaleCents === null || p.currency.toUpperCase() !== f.currency.code) return null;
    products.push({ id: p.id, sku: p.sku, name: p.name, plannedUnits: p.plannedUnits, fobCents: p.fobCents, wholesaleCents: p.wholesaleCents });
  }
  return valueAtRisk({
    currency: f.currency.code,
    products,
    tool: { code: f.tool.code, buildCostCents: f.tool.buildCostCents, shotCount: ctx.tool.shotCount, ratedShots: ctx.tool.ratedShots },
    cutCents: cut,
    newInsertCents: insert,
    duplicateToolCents: dup,
  });
}
