import { assertInteger, Dec, formatCount, toDec } from './decimal';
import { findClampFactor, CLAMP_FACTOR_UNIT_LABELS, type ClampFactor } from './data/clamp-factors';
import { findResin, type ResinShrinkage } from './data/resins';
import { checkClampForce, FORCE_UNIT_LABELS, type AreaUnit, type ClampForceCheck, type ForceUnit } from './clamp-force';
import {
  amortisePerUnit,
  CHANGE_ROUTE_LABELS,
  modificationEconomics,
  priceBuildUp,
  BREAK_EVEN_RULE,
  AMORTISATION_RULE,
  PRICE_BUILD_UP_RULE,
  type AlternativesComparison,
  type Amortisation,
  type BreakEven,
  type ChangeRoute,
  type EngineerEstimate,
  type PaybackVerdict,
  type PriceBuildUp,
} from './economics';
import { DEFAULT_CURRENCY, minorUnitDigits, percentOfCents } from './money';
import { planRun, SHOTS_NEEDED_RULE, type RunPlan } from './run-plan';
import {
  compareConventions,
  SHRINK_CONVENTIONS,
  shrinkMidpoint,
  steelChangeForDimension,
  STEEL_ROUNDING,
  type ConventionComparison,
  type FormedBy,
  type ShrinkConvention,
  type SteelChange,
} from './shrinkage';
import { toolLife, type ToolLife } from './tool-life';

/**
 * Every figure behind one change request, from the engineer's inputs and the registry: the
 * economics of the cut (amortisation, price build-up, break-even and its verdict in words, the
 * alternatives that keep ended products alive), the run plan against the tool's remaining rated
 * life, and the optional engineering checks (shrink-compensated dimension, clamp force).
 *
 * The server computes this for the API; the app runs the SAME function as the engineer types, so
 * the figures on the screen and in the record can never differ. Nothing here throws for a value a
 * person stored: a figure that cannot be computed is left out with the reason in `problems`, and a
 * figure that lacks an input is left out with the input named in `missing`.
 *
 * Conventions beyond those of the functions used (economics.ts, run-plan.ts, shrinkage.ts,
 * clamp-force.ts):
 * - the brand pays for the cut, so break-even counts the brand's contribution per unit of the
 *   derivative: wholesale - landed cost (landed = FOB + freight + duty on FOB);
 * - a value the engineer leaves empty is taken from the registry (the derivative product's planned
 *   units and prices, the derivative's bill of parts for parts per unit); freight, duty and scrap
 *   left empty count as zero and say so in `assumptions`;
 * - one shot fills every cavity of the tool at once, so the run takes as many shots as the affected
 *   part that needs the most.
 */

// ---------------------------------------------------------------------------------------------
// Inputs

/** What the engineer plans for the derivative; null = not entered (take the registry's value, or unknown). */
export interface NumbersPlanInputs {
  plannedUnits: number | null;
  /** How many of each affected part one unit uses; empty: from the derivative's bill of parts, else 1. */
  partsPerUnit: number | null;
  /** Scrap as a fraction of good parts, decimal string ("0.03" = 3 %). */
  scrapRate: string | null;
  fobCents: number | null;
  freightPerUnitCents: number | null;
  /** Import duty as a percent of FOB, decimal string ("6.5" = 6.5 %). */
  dutyPercent: string | null;
  wholesaleCents: number | null;
  retailCents: number | null;
  /** ISO 4217 code of every amount here and in the estimate. */
  currency: string | null;
}

/** A part dimension that the change moves: how much steel to cut or build up. */
export interface DimensionCheckInputs {
  oldPartMm: string;
  newPartMm: string;
  resinId: string;
  /** The grade's datasheet shrink as a fraction ("0.005"); empty: the middle of the resin's published range. */
  shrink: string | null;
  convention: ShrinkConvention;
  formedBy: FormedBy;
}

/** A change of projected area: the clamp force it needs against the press. */
export interface ClampCheckInputs {
  /** Total projected area on the parting plane (all cavities and runner), in `areaUnit`. */
  projectedArea: string;
  areaUnit: AreaUnit;
  /** A factor row of shared/domain/data/clamp-factors.ts. */
  factorId: string;
  /** The value picked within the row's range; empty: the upper end (the cautious choice). */
  factor: string | null;
  /** 1 or more ("1.1" = 10 % margin). */
  safetyFactor: string;
  pressTonnage: string | null;
  pressUnit: ForceUnit;
}

export interface NumbersEstimate {
  modificationCostCents: number | null;
  leadDays: number | null;
  trialRoundsExpected: number | null;
  newInsertCents: number | null;
  duplicateToolCents: number | null;
}

export interface NumbersInputs {
  estimate: NumbersEstimate;
  plan: NumbersPlanInputs;
  dimension: DimensionCheckInputs | null;
  clamp: ClampCheckInputs | null;
}

/** What the registry knows that the figures need (loaded by the server, sent to the app with them). */
export interface NumbersFacts {
  tool: { id: string; code: string; ratedShots: number; shotCount: number; ratedShotsSource: string; currency: string };
  derivative: {
    id: string;
    sku: string;
    name: string;
    plannedUnits: number;
    fobCents: number | null;
    wholesaleCents: number | null;
    retailCents: number | null;
    currency: string;
  } | null;
  /** The parts the cut items change, each once, in item order. */
  parts: { id: string; name: string; resin: string; cavitiesPerShot: number; derivativeQuantityPerUnit: number | null }[];
  /** The products the change ends (they lose the tool): what keeping them alive is for. */
  ended: { id: string; sku: string; name: string; plannedUnits: number }[];
}

export const EMPTY_ESTIMATE: NumbersEstimate = {
  modificationCostCents: null,
  leadDays: null,
  trialRoundsExpected: null,
  newInsertCents: null,
  duplicateToolCents: null,
};

export const EMPTY_PLAN: NumbersPlanInputs = {
  plannedUnits: null,
  partsPerUnit: null,
  scrapRate: null,
  fobCents: null,
  freightPerUnitCents: null,
  dutyPercent: null,
  wholesaleCents: null,
  retailCents: null,
  currency: null,
};

export const EMPTY_NUMBERS_INPUTS: NumbersInputs = { estimate: EMPTY_ESTIMATE, plan: EMPTY_PLAN, dimension: null, clamp: null };

// ---------------------------------------------------------------------------------------------
// Results

/** Where a value used in the figures came from. */
export type ValueSource = 'entered' | 'product' | 'bill' | 'resin_range' | 'factor_range' | 'assumed' | 'none';

export interface Sourced<T> {
  value: T | null;
  from: ValueSource;
}

export interface ResolvedPlan {
  plannedUnits: Sourced<number>;
  scrapRate: Sourced<string>;
  fobCents: Sourced<number>;
  freightPerUnitCents: Sourced<number>;
  dutyPercent: Sourced<string>;
  wholesaleCents: Sourced<number>;
  retailCents: Sourced<number>;
  /** FOB + freight + duty; null without FOB. */
  landedCents: number | null;
  dutyCents: number | null;
  currency: string;
  currencyFrom: ValueSource;
}

export interface RouteCost {
  route: ChangeRoute;
  label: string;
  costCents: number | null;
  /** The cost spread over the planned units (rounded up to the cent); null without both. */
  perUnitCents: number | null;
}

export interface NumbersEconomics {
  amortisation: Amortisation | null;
  buildUp: PriceBuildUp | null;
  breakEven: BreakEven | null;
  verdict: PaybackVerdict | null;
  alternatives: AlternativesComparison;
  routes: RouteCost[];
  /** Planned units of the ended products (what keeping them alive protects). */
  endedPlannedUnits: number;
  rules: { amortisation: string; priceBuildUp: string; breakEven: string; contribution: string };
}

export interface PartRun {
  partId: string;
  partName: string;
  cavitiesPerShot: number;
  partsPerUnit: number;
  partsPerUnitFrom: ValueSource;
  shotsNeeded: number;
}

export interface NumbersRun {
  life: ToolLife;
  /** Rated shots - shot count; negative when the tool already ran past its rating. */
  remainingShots: number;
  parts: PartRun[];
  /** The plan of the part that needs the most shots; null without planned units or parts. */
  plan: RunPlan | null;
  governingPartId: string | null;
  ratedShotsSource: string;
  rule: string;
}

export interface DimensionResult {
  change: SteelChange;
  /** Both conventions for the new dimension, and how far apart they are. */
  conventions: ConventionComparison;
  resin: { id: string; name: string; shrinkMin: string; shrinkMax: string; source: string; note: string | null };
  shrink: string;
  shrinkFrom: ValueSource;
  convention: { id: ShrinkConvention; label: string; formula: string; source: string };
  rounding: string;
  caution: string;
}

export interface ClampResult {
  check: ClampForceCheck;
  factor: { id: string; resinLabel: string; min: string; max: string; unit: string; unitLabel: string; source: string; note: string | null };
  factorUsed: string;
  factorFrom: ValueSource;
}

export interface RequestNumbersResult {
  currency: string;
  estimate: NumbersEstimate;
  plan: ResolvedPlan;
  economics: NumbersEconomics;
  run: NumbersRun;
  dimension: DimensionResult | null;
  clamp: ClampResult | null;
  /** Inputs still needed for the figures left out, in words. */
  missing: string[];
  /** Values counted as zero or taken by rule, in words. */
  assumptions: string[];
  /** Figures that could not be computed from the stored values, in words. */
  problems: string[];
}

export const CONTRIBUTION_RULE =
  'The brand pays for the cut, so each unit of the derivative contributes wholesale - landed cost (landed = FOB + freight + duty on FOB, duty half-up to the cent).';
export const FAMILY_SHOT_RULE = 'One shot fills every cavity of the tool, so the run takes as many shots as the affected part that needs the most.';
export const SHRINK_MIDPOINT_NOTE = 'the middle of the published range: a starting point, not a datasheet value';
export const DIMENSION_CAUTION =
  'Shrink varies with grade, wall, gate and process: confirm the steel size with the toolmaker and the first samples before cutting.';

// ---------------------------------------------------------------------------------------------
// Helpers

const sourced = <T>(entered: T | null, fallback: T | null, fallbackFrom: ValueSource): Sourced<T> =>
  entered !== null ? { value: entered, from: 'entered' } : fallback !== null ? { value: fallback, from: fallbackFrom } : { value: null, from: 'none' };

function validCurrency(code: string | null | undefined): string | null {
  if (!code) return null;
  const c = code.trim().toUpperCase();
  if (!/^[A-Z]{3}$/.test(c)) return null;
  try {
    minorUnitDigits(c);
    return c;
  } catch {
    return null;
  }
}

const message = (e: unknown) => (e instanceof Error ? e.message : String(e));

/** Plain copy of the estimate with every field present (null when not given). */
export function normaliseEstimate(e: EngineerEstimate | null | undefined): NumbersEstimate {
  return {
    modificationCostCents: e?.modificationCostCents ?? null,
    leadDays: e?.leadDays ?? null,
    trialRoundsExpected: e?.trialRoundsExpected ?? null,
    newInsertCents: e?.newInsertCents ?? null,
    duplicateToolCents: e?.duplicateToolCents ?? null,
  };
}

// ---------------------------------------------------------------------------------------------
// The plan with the registry's values filled in

export function resolvePlan(plan: NumbersPlanInputs, facts: NumbersFacts): ResolvedPlan & { assumptions: string[] } {
  const d = facts.derivative;
  const assumptions: string[] = [];
  const productPlanned = d && d.plannedUnits > 0 ? d.plannedUnits : null;
  const enteredCurrency = validCurrency(plan.currency);
  const productCurrency = validCurrency(d?.currency);
  const currency = enteredCurrency ?? productCurrency ?? validCurrency(facts.tool.currency) ?? DEFAULT_CURRENCY;
  const currencyFrom: ValueSource = enteredCurrency ? 'entered' : productCurrency ? 'product' : 'assumed';
  // Product prices are in the product's currency: use them only when that is the currency of the figures.
  const productPrices = d && (productCurrency ?? DEFAULT_CURRENCY) === currency;

  const fob = sourced(plan.fobCents, productPrices ? d.fobCents : null, 'product');
  const wholesale = sourced(plan.wholesaleCents, productPrices ? d.wholesaleCents : null, 'product');
  const retail = sourced(plan.retailCents, productPrices ? d.retailCents : null, 'product');
  if (d && !productPrices && (d.fobCents !== null || d.wholesaleCents !== null)) {
    assumptions.push(`The product's prices are in ${productCurrency ?? DEFAULT_CURRENCY}, not ${currency}: enter the prices in ${currency}.`);
  }
  let freight = sourced(plan.freightPerUnitCents, null, 'none');
  let duty = sourced(plan.dutyPercent, null, 'none');
  let scrap = sourced(plan.scrapRate, null, 'none');
  if (fob.value !== null && freight.value === null) {
    freight = { value: 0, from: 'assumed' };
    assumptions.push('Freight not entered: counted as 0 per unit.');
  }
  if (fob.value !== null && duty.value === null) {
    duty = { value: '0', from: 'assumed' };
    assumptions.push('Duty not entered: counted as 0 %.');
  }
  if (scrap.value === null) {
    scrap = { value: '0', from: 'assumed' };
    assumptions.push('Scrap not entered: counted as 0 %.');
  }
  let dutyCents: number | null = null;
  let landedCents: number | null = null;
  if (fob.value !== null) {
    dutyCents = percentOfCents(fob.value, duty.value ?? '0');
    landedCents = fob.value + (freight.value ?? 0) + dutyCents;
  }
  return {
    plannedUnits: sourced(plan.plannedUnits, productPlanned, 'product'),
    scrapRate: scrap,
    fobCents: fob,
    freightPerUnitCents: freight,
    dutyPercent: duty,
    wholesaleCents: wholesale,
    retailCents: retail,
    landedCents,
    dutyCents,
    currency,
    currencyFrom,
    assumptions,
  };
}

// ---------------------------------------------------------------------------------------------
// Run plan

export function runPlanFor(plannedUnits: number | null, partsPerUnit: number | null, scrapRate: string, facts: NumbersFacts): NumbersRun {
  const life = toolLife({ ratedShots: facts.tool.ratedShots, shotCount: facts.tool.shotCount });
  const remainingShots = facts.tool.ratedShots - facts.tool.shotCount;
  const base = { life, remainingShots, ratedShotsSource: facts.tool.ratedShotsSource, rule: `${SHOTS_NEEDED_RULE} ${FAMILY_SHOT_RULE}` };
  if (plannedUnits === null || facts.parts.length === 0) return { ...base, parts: [], plan: null, governingPartId: null };
  const parts: PartRun[] = facts.parts.map((p) => {
    const fromBill = p.derivativeQuantityPerUnit !== null && p.derivativeQuantityPerUnit > 0 ? p.derivativeQuantityPerUnit : null;
    const ppu = sourced(partsPerUnit, fromBill, 'bill');
    const used = ppu.value ?? 1;
    const plan = planRun({ units: plannedUnits, partsPerUnit: used, cavitiesPerShot: p.cavitiesPerShot, scrapRate, remainingShots });
    return {
      partId: p.id,
      partName: p.name,
      cavitiesPerShot: p.cavitiesPerShot,
      partsPerUnit: used,
      partsPerUnitFrom: ppu.value === null ? 'assumed' : ppu.from,
      shotsNeeded: plan.shotsNeeded,
    };
  });
  // The governing part: the most shots; on a tie the first in item order.
  const governing = parts.reduce((a, b) => (b.shotsNeeded > a.shotsNeeded ? b : a));
  const plan = planRun({
    units: plannedUnits,
    partsPerUnit: governing.partsPerUnit,
    cavitiesPerShot: governing.cavitiesPerShot,
    scrapRate,
    remainingShots,
  });
  return { ...base, parts, plan, governingPartId: governing.partId };
}

// ---------------------------------------------------------------------------------------------
// Engineering checks

export function dimensionCheck(input: DimensionCheckInputs): DimensionResult {
  const resin: ResinShrinkage | undefined = findResin(input.resinId);
  if (!resin) throw new RangeError(`Resin "${input.resinId}" is not in the shrink table`);
  const shrink = input.shrink ?? shrinkMidpoint(resin);
  const change = steelChangeForDimension({
    oldPartMm: input.oldPartMm,
    newPartMm: input.newPartMm,
    shrink,
    convention: input.convention,
    formedBy: input.formedBy,
  });
  const c = SHRINK_CONVENTIONS[input.convention];
  return {
    change,
    conventions: compareConventions(input.newPartMm, shrink),
    resin: { id: resin.id, name: resin.name, shrinkMin: resin.shrinkMin, shrinkMax: resin.shrinkMax, source: resin.source, note: resin.note ?? null },
    shrink: toDec(shrink).toString(),
    shrinkFrom: input.shrink === null ? 'resin_range' : 'entered',
    convention: { id: input.convention, label: c.label, formula: c.formula, source: c.source },
    rounding: STEEL_ROUNDING,
    caution: DIMENSION_CAUTION,
  };
}

export function clampCheck(input: ClampCheckInputs): ClampResult {
  const f: ClampFactor | undefined = findClampFactor(input.factorId);
  if (!f) throw new RangeError(`Clamp factor "${input.factorId}" is not in the factor table`);
  const factor = input.factor ?? f.max;
  const check = checkClampForce({
    projectedArea: input.projectedArea,
    areaUnit: input.areaUnit,
    factor,
    factorUnit: f.unit,
    safetyFactor: input.safetyFactor,
    press: input.pressTonnage === null ? null : { tonnage: input.pressTonnage, unit: input.pressUnit },
  });
  return {
    check,
    factor: { id: f.id, resinLabel: f.resinLabel, min: f.min, max: f.max, unit: f.unit, unitLabel: CLAMP_FACTOR_UNIT_LABELS[f.unit], source: f.source, note: f.note ?? null },
    factorUsed: toDec(factor).toString(),
    factorFrom: input.factor === null ? 'factor_range' : 'entered',
  };
}

// ---------------------------------------------------------------------------------------------
// Everything

export function computeRequestNumbers(inputs: NumbersInputs, facts: NumbersFacts): RequestNumbersResult {
  const estimate = normaliseEstimate(inputs.estimate);
  const missing: string[] = [];
  const problems: string[] = [];
  const { assumptions, ...plan } = resolvePlan(inputs.plan, facts);
  const planned = plan.plannedUnits.value;
  const currency = plan.currency;

  // Economics
  const price = plan.wholesaleCents.value;
  const variable = plan.landedCents;
  let econ: ReturnType<typeof modificationEconomics>;
  try {
    econ = modificationEconomics({ estimate, plannedUnits: planned ?? 0, priceCents: price, variableCostCents: variable, currency });
  } catch (e) {
    problems.push(`Economics: ${message(e)}`);
    econ = { amortisation: null, breakEven: null, verdict: null, alternatives: { versusNewInsert: null, versusDuplicateTool: null, cheapest: null } };
  }
  let buildUp: PriceBuildUp | null = null;
  if (plan.fobCents.value !== null && price !== null && plan.retailCents.value !== null) {
    try {
      buildUp = priceBuildUp({
        fobCents: plan.fobCents.value,
        freightPerUnitCents: plan.freightPerUnitCents.value ?? 0,
        dutyPercent: plan.dutyPercent.value ?? '0',
        wholesaleCents: price,
        retailCents: plan.retailCents.value,
      });
    } catch (e) {
      problems.push(`Price build-up: ${message(e)}`);
    }
  }
  const perUnit = (cost: number | null) => (cost !== null && planned !== null && planned > 0 ? amortisePerUnit(cost, planned).perUnitCents : null);
  const routes: RouteCost[] = (
    [
      ['modify', estimate.modificationCostCents],
      ['new_insert', estimate.newInsertCents],
      ['duplicate_tool', estimate.duplicateToolCents],
    ] as const
  ).map(([route, cost]) => ({ route, label: CHANGE_ROUTE_LABELS[route], costCents: cost, perUnitCents: perUnit(cost) }));

  if (estimate.modificationCostCents === null) missing.push("The cost of the cut (the engineer's estimate).");
  if (planned === null) {
    missing.push(facts.derivative ? `The planned units of ${facts.derivative.sku} ${facts.derivative.name}.` : 'The planned units (the request has no derivative product).');
  }
  if (plan.fobCents.value === null) missing.push('The FOB price of the derivative.');
  if (price === null) missing.push('The wholesale price of the derivative.');
  if (plan.retailCents.value === null) missing.push('The retail price of the derivative (for the price build-up).');
  if (facts.ended.length > 0 && estimate.newInsertCents === null && estimate.duplicateToolCents === null) {
    missing.push('The cost of a new insert or a duplicate tool, to keep the ended products alive.');
  }

  // Run plan
  let scrap = plan.scrapRate.value ?? '0';
  try {
    const s = toDec(scrap, 'scrapRate');
    if (s.isNegative() || s.gte(1)) throw new RangeError('scrap must be a fraction from 0 up to (not including) 1');
  } catch (e) {
    problems.push(`Scrap rate "${scrap}": ${message(e)}; counted as 0.`);
    scrap = '0';
  }
  let run: NumbersRun;
  try {
    run = runPlanFor(planned, inputs.plan.partsPerUnit, scrap, facts);
  } catch (e) {
    problems.push(`Run plan: ${message(e)}`);
    run = runPlanFor(null, null, '0', facts);
  }
  if (facts.parts.length === 0) missing.push('Cut items: the run plan needs the parts the change touches.');
  if (run.parts.some((p) => p.partsPerUnitFrom === 'assumed')) {
    assumptions.push('Parts per unit not entered and not in the derivative\'s bill of parts: 1 counted.');
  }

  // Engineering checks
  let dimension: DimensionResult | null = null;
  if (inputs.dimension) {
    try {
      dimension = dimensionCheck(inputs.dimension);
    } catch (e) {
      problems.push(`Dimension check: ${message(e)}`);
    }
  }
  let clamp: ClampResult | null = null;
  if (inputs.clamp) {
    try {
      clamp = clampCheck(inputs.clamp);
    } catch (e) {
      problems.push(`Clamp check: ${message(e)}`);
    }
  }

  return {
    currency,
    estimate,
    plan,
    economics: {
      amortisation: econ.amortisation,
      buildUp,
      breakEven: econ.breakEven,
      // Without planned units there is nothing to weigh the break-even against.
      verdict: planned === null ? null : econ.verdict,
      alternatives: econ.alternatives,
      routes,
      endedPlannedUnits: facts.ended.reduce((s, p) => s + p.plannedUnits, 0),
      rules: { amortisation: AMORTISATION_RULE, priceBuildUp: PRICE_BUILD_UP_RULE, breakEven: BREAK_EVEN_RULE, contribution: CONTRIBUTION_RULE },
    },
    run,
    dimension,
    clamp,
    missing,
    assumptions,
    problems,
  };
}

// ---------------------------------------------------------------------------------------------
// All open plans on one tool against its remaining life

export interface OpenPlanShots {
  /** Shots the plan needs; null when the plan has no planned units or parts yet. */
  shotsNeeded: number | null;
}

export interface OpenPlansVerdict {
  remainingShots: number;
  /** Sum of the shots of every plan that has them. */
  totalShots: number;
  plansCounted: number;
  plansWithoutFigures: number;
  enough: boolean;
  shortfall: number;
  warning: string | null;
  summary: string;
  rule: string;
}

export const OPEN_PLANS_RULE =
  'The runs of all open changes on the tool are added up (they use the same tool one after another) and compared with the shots left in its rated life.';

/** Adds up the shots of every open plan on a tool and compares the total with the shots left. */
export function openPlansVersusLife(remainingShots: number, plans: readonly OpenPlanShots[]): OpenPlansVerdict {
  assertInteger(remainingShots, 'remainingShots');
  let total = new Dec(0);
  let counted = 0;
  for (const [i, p] of plans.entries()) {
    if (p.shotsNeeded === null) continue;
    assertInteger(p.shotsNeeded, `plans[${i}].shotsNeeded`, { min: 0 });
    total = total.plus(p.shotsNeeded);
    counted += 1;
  }
  const totalShots = total.toNumber();
  assertInteger(totalShots, 'totalShots');
  const without = plans.length - counted;
  const enough = totalShots <= remainingShots;
  const shortfall = enough ? 0 : totalShots - remainingShots;
  const plansText = `${formatCount(counted)} open ${counted === 1 ? 'plan needs' : 'plans need'} ${formatCount(totalShots)} ${totalShots === 1 ? 'shot' : 'shots'}`;
  const leftText = remainingShots >= 0 ? `${formatCount(remainingShots)} left of its rated life` : `already ${formatCount(-remainingShots)} shots past its rated life`;
  const withoutText = without > 0 ? ` ${formatCount(without)} more ${without === 1 ? 'plan has' : 'plans have'} no planned units yet.` : '';
  let warning: string | null = null;
  let summary: string;
  if (counted === 0) {
    summary = `${plans.length === 0 ? 'No open changes on this tool.' : 'No open change has planned units yet.'} The tool has ${leftText}.`;
  } else if (enough) {
    summary = `${plansText}; the tool has ${leftText}, ${formatCount(remainingShots - totalShots)} to spare.${withoutText}`;
  } else {
    warning = `${plansText} but the tool has ${leftText}: ${formatCount(shortfall)} short. Plan a refurbishment, a second tool, or smaller runs.${withoutText}`;
    summary = warning;
  }
  return { remainingShots, totalShots, plansCounted: counted, plansWithoutFigures: without, enough, shortfall, warning, summary, rule: OPEN_PLANS_RULE };
}

/** Labels for value sources, for screens. */
export const VALUE_SOURCE_LABELS: Record<ValueSource, string> = {
  entered: 'entered',
  product: 'from the product',
  bill: 'from the bill of parts',
  resin_range: 'mid-range of the resin',
  factor_range: 'upper end of the range',
  assumed: 'assumed',
  none: 'not known',
};

export { FORCE_UNIT_LABELS };
