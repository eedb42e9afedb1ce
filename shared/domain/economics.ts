import { Dec, assertInteger, formatCount, toDec, type DecimalInput } from './decimal';
import { DEFAULT_CURRENCY, formatCents, percentOfCents } from './money';

/**
 * The numbers behind a mold change: tooling amortised per unit, the price build-up from FOB to
 * retail with the margin at each step, the break-even volume of the modification, and how the
 * modification compares with the alternatives that keep ended products alive.
 *
 * Conventions (TRADE-FACTS 6.1 / 6.2):
 * - money is integer cents; ratios are decimal.js; nothing passes through binary floating point;
 * - contribution per unit = price - variable cost (Stanford EE204 "Basic Quantitative Analysis
 *   for Marketing": C = P - K, BEV = FC / C);
 * - break-even units are rounded UP to a whole unit, so the fixed cost is fully covered
 *   (the Stanford page prints $1B / $235 as 4,255,319, i.e. truncated; we report 4,255,320);
 * - tooling per unit is rounded UP to the whole cent, so the planned run recovers the whole tool;
 * - margin = (price - cost) / price, markup = (price - cost) / cost, both as percent strings with
 *   two decimals, rounded half-up.
 */

// ---------------------------------------------------------------------------------------------
// Engineer's estimate

/** What the tooling engineer estimates for a requested change. Every field may be unknown. */
export interface EngineerEstimate {
  /** Cost of cutting the change into the existing tool. */
  modificationCostCents?: number | null;
  /** Calendar days from approval to parts off the changed tool. */
  leadDays?: number | null;
  /** Trial rounds (T1, T2, ...) the engineer expects before approval. */
  trialRoundsExpected?: number | null;
  /** Cost of cutting the change into a new insert instead, keeping the current one (keeps ended products alive). */
  newInsertCents?: number | null;
  /** Cost of a duplicate tool carrying the change, keeping the current tool as is (keeps ended products alive). */
  duplicateToolCents?: number | null;
}

const ESTIMATE_FIELDS = [
  'modificationCostCents',
  'leadDays',
  'trialRoundsExpected',
  'newInsertCents',
  'duplicateToolCents',
] as const satisfies readonly (keyof EngineerEstimate)[];

/**
 * Problems with an estimate, keyed by field, in the shape of an API `fieldErrors` map.
 * Empty when every given field is a whole number of zero or more.
 */
export function engineerEstimateProblems(estimate: EngineerEstimate): Record<string, string[]> {
  const problems: Record<string, string[]> = {};
  for (const field of ESTIMATE_FIELDS) {
    const value = estimate[field];
    if (value === undefined || value === null) continue;
    if (!Number.isSafeInteger(value) || value < 0) {
      problems[field] = ['Must be a whole number of zero or more'];
    }
  }
  return problems;
}

// ---------------------------------------------------------------------------------------------
// Amortisation

export interface Amortisation {
  toolingCents: number;
  plannedUnits: number;
  /** Tooling cost per unit, rounded UP to the whole cent. */
  perUnitCents: number;
  /** perUnitCents x plannedUnits: never less than the tooling cost. */
  recoveredCents: number;
  /** What the rounding recovers beyond the tooling cost (0 when it divides exactly). */
  overRecoveryCents: number;
  rule: string;
}

export const AMORTISATION_RULE =
  'Tooling cost divided by the planned units, rounded up to the whole cent so the planned run recovers the whole cost.';

/** Spread a tooling cost over the planned units ($50,000 over 50,000 parts = $1.00 a part). */
export function amortisePerUnit(toolingCents: number, plannedUnits: number): Amortisation {
  assertInteger(toolingCents, 'toolingCents', { min: 0 });
  assertInteger(plannedUnits, 'plannedUnits', { min: 1 });
  const perUnitCents = new Dec(toolingCents).div(plannedUnits).ceil().toNumber();
  const recovered = new Dec(perUnitCents).times(plannedUnits).toNumber();
  return {
    toolingCents,
    plannedUnits,
    perUnitCents,
    recoveredCents: recovered,
    overRecoveryCents: recovered - toolingCents,
    rule: AMORTISATION_RULE,
  };
}

// ---------------------------------------------------------------------------------------------
// Margins and the price build-up

/** Percent string with two decimals, half-up: ratio 0.5 -> "50.00". */
function percentString(ratio: Dec): string {
  return ratio.times(100).toFixed(2, Dec.ROUND_HALF_UP);
}

/** Margin on price, (price - cost) / price, as a percent string ("50.00"); null when the price is 0. */
export function marginPercent(costCents: number, priceCents: number): string | null {
  assertInteger(costCents, 'costCents');
  assertInteger(priceCents, 'priceCents');
  if (priceCents === 0) return null;
  return percentString(new Dec(priceCents - costCents).div(priceCents));
}

/** Markup on cost, (price - cost) / cost, as a percent string ("100.00"); null when the cost is 0. */
export function markupPercent(costCents: number, priceCents: number): string | null {
  assertInteger(costCents, 'costCents');
  assertInteger(priceCents, 'priceCents');
  if (costCents === 0) return null;
  return percentString(new Dec(priceCents - costCents).div(costCents));
}

/**
 * The price that gives at least `targetMarginPercent` on `costCents`: cost / (1 - m), rounded UP
 * to the cent so the margin is never below the target. Keystone: cost $10.00 at 50 % -> $20.00.
 */
export function priceForMargin(costCents: number, targetMarginPercent: DecimalInput): number {
  assertInteger(costCents, 'costCents', { min: 0 });
  const m = toDec(targetMarginPercent, 'targetMarginPercent');
  if (m.isNegative() || m.gte(100)) throw new RangeError('targetMarginPercent must be at least 0 and below 100');
  return new Dec(costCents).div(new Dec(1).minus(m.div(100))).ceil().toNumber();
}

export interface PriceBuildUpInput {
  /** Free-on-board price per unit paid to the factory. */
  fobCents: number;
  /** Ocean/air freight, insurance and handling per unit to the brand's warehouse. */
  freightPerUnitCents: number;
  /** Import duty as a percent of FOB ("6.5" = 6.5 %). */
  dutyPercent: DecimalInput;
  /** The brand's selling price to the retailer. */
  wholesaleCents: number;
  /** The shelf price. */
  retailCents: number;
  /** The factory's own unit cost, when known: adds the factory's margin as the first step. */
  factoryCostCents?: number | null;
}

export type PriceStage = 'factory' | 'brand' | 'retailer';

export interface PriceStep {
  stage: PriceStage;
  label: string;
  costCents: number;
  priceCents: number;
  marginCents: number;
  /** (price - cost) / price, percent string with two decimals; null when the price is 0. */
  marginPercent: string | null;
  /** (price - cost) / cost, percent string with two decimals; null when the cost is 0. */
  markupPercent: string | null;
}

export interface PriceBuildUp {
  fobCents: number;
  freightPerUnitCents: number;
  dutyPercent: string;
  /** FOB x duty percent, rounded half-up to the cent. */
  dutyCents: number;
  /** FOB + freight + duty. */
  landedCents: number;
  wholesaleCents: number;
  retailCents: number;
  steps: PriceStep[];
  /** Retail as a multiple of FOB, two decimals ("4.00"); null when FOB is 0. */
  retailToFobMultiple: string | null;
  rule: string;
}

export const PRICE_BUILD_UP_RULE =
  'Landed = FOB + freight + duty (duty = FOB x duty %, half-up to the cent). Margin = (price - cost) / price; markup = (price - cost) / cost; percentages to two decimals, half-up.';

function step(stage: PriceStage, label: string, costCents: number, priceCents: number): PriceStep {
  return {
    stage,
    label,
    costCents,
    priceCents,
    marginCents: priceCents - costCents,
    marginPercent: marginPercent(costCents, priceCents),
    markupPercent: markupPercent(costCents, priceCents),
  };
}

/** FOB -> landed -> wholesale -> retail, with the margin each party keeps. */
export function priceBuildUp(input: PriceBuildUpInput): PriceBuildUp {
  assertInteger(input.fobCents, 'fobCents', { min: 0 });
  assertInteger(input.freightPerUnitCents, 'freightPerUnitCents', { min: 0 });
  assertInteger(input.wholesaleCents, 'wholesaleCents', { min: 0 });
  assertInteger(input.retailCents, 'retailCents', { min: 0 });
  const duty = toDec(input.dutyPercent, 'dutyPercent');
  if (duty.isNegative()) throw new RangeError('dutyPercent must not be negative');

  const dutyCents = percentOfCents(input.fobCents, duty);
  const landedCents = input.fobCents + input.freightPerUnitCents + dutyCents;
  const steps: PriceStep[] = [];
  if (input.factoryCostCents !== undefined && input.factoryCostCents !== null) {
    assertInteger(input.factoryCostCents, 'factoryCostCents', { min: 0 });
    steps.push(step('factory', 'Factory: unit cost to FOB', input.factoryCostCents, input.fobCents));
  }
  steps.push(step('brand', 'Brand: landed cost to wholesale', landedCents, input.wholesaleCents));
  steps.push(step('retailer', 'Retailer: wholesale to retail', input.wholesaleCents, input.retailCents));

  return {
    fobCents: input.fobCents,
    freightPerUnitCents: input.freightPerUnitCents,
    dutyPercent: duty.toString(),
    dutyCents,
    landedCents,
    wholesaleCents: input.wholesaleCents,
    retailCents: input.retailCents,
    steps,
    retailToFobMultiple:
      input.fobCents === 0 ? null : new Dec(input.retailCents).div(input.fobCents).toFixed(2, Dec.ROUND_HALF_UP),
    rule: PRICE_BUILD_UP_RULE,
  };
}

// ---------------------------------------------------------------------------------------------
// Break-even of the modification

export interface BreakEvenInput {
  /** The one-off cost to recover (the modification). */
  fixedCostCents: number;
  /** What each unit sells for, to whoever pays for the change (for a brand: the wholesale price). */
  priceCents: number;
  /** What each unit costs that party (for a brand: the landed cost). */
  variableCostCents: number;
}

export interface BreakEven {
  fixedCostCents: number;
  /** price - variable cost. */
  contributionCents: number;
  /** fixed cost / contribution to four decimals (half-up), for display; null when contribution <= 0. */
  exactUnits: string | null;
  /** Whole units, rounded UP; 0 when there is nothing to recover; null when it never pays back. */
  units: number | null;
  rule: string;
}

export const BREAK_EVEN_RULE =
  'Break-even units = fixed cost / (price - variable cost), rounded up to a whole unit so the cost is fully recovered.';

/** Units to sell before the modification has paid for itself (Stanford EE204: BEV = FC / (P - K)). */
export function breakEvenUnits(input: BreakEvenInput): BreakEven {
  assertInteger(input.fixedCostCents, 'fixedCostCents', { min: 0 });
  assertInteger(input.priceCents, 'priceCents');
  assertInteger(input.variableCostCents, 'variableCostCents');
  const contributionCents = input.priceCents - input.variableCostCents;
  assertInteger(contributionCents, 'contributionCents');
  const base = { fixedCostCents: input.fixedCostCents, contributionCents, rule: BREAK_EVEN_RULE };
  if (input.fixedCostCents === 0) return { ...base, exactUnits: '0.0000', units: 0 };
  if (contributionCents <= 0) return { ...base, exactUnits: null, units: null };
  const quotient = new Dec(input.fixedCostCents).div(contributionCents);
  return { ...base, exactUnits: quotient.toFixed(4, Dec.ROUND_HALF_UP), units: quotient.ceil().toNumber() };
}

export interface PaybackVerdict {
  paysBack: boolean;
  sentence: string;
}

/** The break-even result in words, against the planned volume. */
export function paybackVerdict(breakEven: BreakEven, plannedUnits: number): PaybackVerdict {
  assertInteger(plannedUnits, 'plannedUnits', { min: 0 });
  if (breakEven.units === 0) return { paysBack: true, sentence: 'Nothing to pay back: the change has no cost' };
  if (breakEven.units === null) {
    return {
      paysBack: false,
      sentence: 'Does not pay back at any volume: the price does not exceed the unit cost',
    };
  }
  if (breakEven.units <= plannedUnits) {
    return {
      paysBack: true,
      sentence: `Pays back after ${formatCount(breakEven.units)} units of ${formatCount(plannedUnits)} planned`,
    };
  }
  return {
    paysBack: false,
    sentence: `Does not pay back within the planned units: needs ${formatCount(breakEven.units)}, ${formatCount(plannedUnits)} planned`,
  };
}

// ---------------------------------------------------------------------------------------------
// Modify versus the alternatives

export type ChangeRoute = 'modify' | 'new_insert' | 'duplicate_tool';

export const CHANGE_ROUTE_LABELS: Record<ChangeRoute, string> = {
  modify: 'modifying the tool',
  new_insert: 'a new insert',
  duplicate_tool: 'a duplicate tool',
};

export interface Savings {
  alternative: Exclude<ChangeRoute, 'modify'>;
  alternativeCents: number;
  modificationCents: number;
  /** alternative - modification: positive when modifying is cheaper. */
  savingsCents: number;
  sentence: string;
}

/** How much modifying saves (or costs extra) against one alternative, in cents and in words. */
export function savingsVersus(
  modificationCents: number,
  alternative: Exclude<ChangeRoute, 'modify'>,
  alternativeCents: number,
  currency: string = DEFAULT_CURRENCY,
): Savings {
  assertInteger(modificationCents, 'modificationCents', { min: 0 });
  assertInteger(alternativeCents, 'alternativeCents', { min: 0 });
  const savingsCents = alternativeCents - modificationCents;
  const label = CHANGE_ROUTE_LABELS[alternative];
  const sentence =
    savingsCents > 0
      ? `Modifying saves ${formatCents(savingsCents, currency)} against ${label} (${formatCents(alternativeCents, currency)})`
      : savingsCents < 0
        ? `Modifying costs ${formatCents(-savingsCents, currency)} more than ${label} (${formatCents(alternativeCents, currency)})`
        : `Modifying costs the same as ${label} (${formatCents(alternativeCents, currency)})`;
  return { alternative, alternativeCents, modificationCents, savingsCents, sentence };
}

export interface AlternativesComparison {
  versusNewInsert: Savings | null;
  versusDuplicateTool: Savings | null;
  /** The cheapest route among those with a cost; null when no cost is known. Ties go to modify, then insert. */
  cheapest: ChangeRoute | null;
}

/**
 * Compare modifying with the alternatives that keep ended products alive. The cheapest route is
 * only the cheapest: modifying ends the products that still need the current revision.
 */
export function compareAlternatives(
  estimate: EngineerEstimate,
  currency: string = DEFAULT_CURRENCY,
): AlternativesComparison {
  const mod = estimate.modificationCostCents ?? null;
  const insert = estimate.newInsertCents ?? null;
  const duplicate = estimate.duplicateToolCents ?? null;
  const costs: [ChangeRoute, number | null][] = [
    ['modify', mod],
    ['new_insert', insert],
    ['duplicate_tool', duplicate],
  ];
  let cheapest: ChangeRoute | null = null;
  let best = Infinity;
  for (const [route, cost] of costs) {
    if (cost === null) continue;
    assertInteger(cost, route, { min: 0 });
    if (cost < best) {
      best = cost;
      cheapest = route;
    }
  }
  return {
    versusNewInsert: mod !== null && insert !== null ? savingsVersus(mod, 'new_insert', insert, currency) : null,
    versusDuplicateTool:
      mod !== null && duplicate !== null ? savingsVersus(mod, 'duplicate_tool', duplicate, currency) : null,
    cheapest,
  };
}

// ---------------------------------------------------------------------------------------------
// Everything a change's economics panel shows

export interface ModificationEconomicsInput {
  estimate: EngineerEstimate;
  plannedUnits: number;
  /** Price per unit to whoever pays for the change (for a brand: wholesale). Null when not known yet. */
  priceCents: number | null;
  /** Variable cost per unit to that party (for a brand: landed cost). Null when not known yet. */
  variableCostCents: number | null;
  currency?: string;
}

export interface ModificationEconomics {
  /** The modification spread over the planned units; null without a modification cost or planned units. */
  amortisation: Amortisation | null;
  breakEven: BreakEven | null;
  verdict: PaybackVerdict | null;
  alternatives: AlternativesComparison;
}

/** All the economics of one change that can be computed from what is known so far. */
export function modificationEconomics(input: ModificationEconomicsInput): ModificationEconomics {
  assertInteger(input.plannedUnits, 'plannedUnits', { min: 0 });
  const mod = input.estimate.modificationCostCents ?? null;
  const amortisation = mod !== null && input.plannedUnits > 0 ? amortisePerUnit(mod, input.plannedUnits) : null;
  const breakEven =
    mod !== null && input.priceCents !== null && input.variableCostCents !== null
      ? breakEvenUnits({ fixedCostCents: mod, priceCents: input.priceCents, variableCostCents: input.variableCostCents })
      : null;
  return {
    amortisation,
    breakEven,
    verdict: breakEven ? paybackVerdict(breakEven, input.plannedUnits) : null,
    alternatives: compareAlternatives(input.estimate, input.currency),
  };
}
