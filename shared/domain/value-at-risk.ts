import { Dec, formatCount } from './decimal';
import { allocateCents, formatCents, multiplyCents, sumCents } from './money';

/**
 * Value at risk: what the products a cut ends are worth, beside what each way to keep them costs.
 *
 * For each ended product:
 * - planned units still to make (the product's planned units in the registry);
 * - unit margin = wholesale price - FOB cost (before freight and duty, which the brand pays on
 *   both sides of the choice);
 * - margin lost = planned units x unit margin, if the product can never be made from this tool again;
 * - tooling not yet recovered on the old revision: the tool's build cost less what its shots so far
 *   have written off, by the units-of-production method (build cost x shots left / rated shots,
 *   half-up to the cent), shared among the ended products by planned units;
 * - its share of the cost of a new insert and of a duplicate tool (one insert or one duplicate
 *   keeps every ended product), shared the same way.
 * Every split is by largest remainder, so the rows add up to the totals to the cent. Money is in
 * integer cents, ratios in decimals. Each figure carries `how`: how it was worked out, in words and
 * with its numbers.
 */

export interface ValueAtRiskProduct {
  id: string;
  sku: string;
  name: string;
  plannedUnits: number;
  fobCents: number;
  wholesaleCents: number;
}

export interface ValueAtRiskInput {
  currency: string;
  products: readonly ValueAtRiskProduct[];
  tool: { code: string; buildCostCents: number; shotCount: number; ratedShots: number };
  cutCents: number;
  newInsertCents: number;
  duplicateToolCents: number;
}

export interface Figure {
  cents: number;
  how: string;
}

export interface ValueAtRiskRow {
  id: string;
  title: string;
  plannedUnits: { units: number; how: string };
  unitMargin: Figure;
  marginLost: Figure;
  toolingUnrecovered: Figure;
  newInsertShare: Figure;
  duplicateToolShare: Figure;
  /** marginLost + toolingUnrecovered. */
  atRisk: Figure;
}

export interface ValueAtRiskResult {
  currency: string;
  rows: ValueAtRiskRow[];
  totals: {
    plannedUnits: number;
    marginLost: Figure;
    toolingUnrecovered: Figure;
    atRisk: Figure;
    cut: Figure;
    newInsert: Figure;
    duplicateTool: Figure;
  };
  /** The cheapest way to keep the products against what is at risk, in words. */
  summary: string;
}

export const VALUE_AT_RISK_RULE =
  'Margin lost = planned units x (wholesale - FOB). Tooling not yet recovered = build cost x shots left / rated shots (units of production), shared by planned units. A new insert or a duplicate tool keeps every ended product, so its cost is shared the same way. Splits by largest remainder.';

/** Shares of `total` by planned units (evenly when no product has planned units). */
function shares(total: number, products: readonly ValueAtRiskProduct[]): number[] {
  const weights = products.map((p) => p.plannedUnits);
  return weights.some((w) => w > 0) ? allocateCents(total, weights) : allocateCents(total, weights.map(() => 1));
}

/** The build cost not yet written off by the shots made: build x max(0, rated - shots) / rated, half-up. */
export function toolingUnrecoveredCents(buildCostCents: number, shotCount: number, ratedShots: number): number {
  if (ratedShots <= 0) return buildCostCents;
  const left = Math.max(0, ratedShots - shotCount);
  return multiplyCents(buildCostCents, new Dec(left).div(ratedShots));
}

export function valueAtRisk(input: ValueAtRiskInput): ValueAtRiskResult {
  const c = input.currency;
  const m = (cents: number) => formatCents(cents, c);
  const ps = input.products;
  const totalUnits = ps.reduce((s, p) => s + p.plannedUnits, 0);
  const byUnits = totalUnits > 0 ? `shared by planned units (${formatCount(totalUnits)} in all), largest remainder` : 'shared evenly (no product has planned units), largest remainder';
  const t = input.tool;
  const unrecovered = toolingUnrecoveredCents(t.buildCostCents, t.shotCount, t.ratedShots);
  const left = Math.max(0, t.ratedShots - t.shotCount);
  const unrecoveredHow = `${m(t.buildCostCents)} build cost x ${formatCount(left)} shots left / ${formatCount(t.ratedShots)} rated shots of ${t.code} = ${m(unrecovered)}`;
  const unrecShares = ps.length ? shares(unrecovered, ps) : [];
  const insertShares = ps.length ? shares(input.newInsertCents, ps) : [];
  const dupShares = ps.length ? shares(input.duplicateToolCents, ps) : [];

  const rows: ValueAtRiskRow[] = ps.map((p, i) => {
    const margin = p.wholesaleCents - p.fobCents;
    const lost = multiplyCents(margin, p.plannedUnits);
    const unrec = unrecShares[i]!;
    const title = `${p.sku} ${p.name}`;
    return {
      id: p.id,
      title,
      plannedUnits: { units: p.plannedUnits, how: `The planned units of ${title} in the product registry, all still to make.` },
      unitMargin: { cents: margin, how: `${m(p.wholesaleCents)} wholesale - ${m(p.fobCents)} FOB = ${m(margin)} a unit` },
      marginLost: { cents: lost, how: `${formatCount(p.plannedUnits)} units x ${m(margin)} = ${m(lost)}` },
      toolingUnrecovered: { cents: unrec, how: `Its share of ${m(unrecovered)} not yet recovered (${unrecoveredHow}), ${byUnits}` },
      newInsertShare: { cents: insertShares[i]!, how: `Its share of the ${m(input.newInsertCents)} new insert, ${byUnits}` },
      duplicateToolShare: { cents: dupShares[i]!, how: `Its share of the ${m(input.duplicateToolCents)} duplicate tool, ${byUnits}` },
      atRisk: { cents: sumCents([lost, unrec]), how: `${m(lost)} margin lost + ${m(unrec)} tooling not yet recovered` },
    };
  });

  const lostTotal = sumCents(rows.map((r) => r.marginLost.cents));
  const atRiskTotal = sumCents([lostTotal, unrecovered]);
  const cheapest = Math.min(input.newInsertCents, input.duplicateToolCents);
  const cheapestName = input.newInsertCents <= input.duplicateToolCents ? 'a new insert' : 'a duplicate tool';
  const summary =
    ps.length === 0
      ? 'The cut ends no product: nothing is at risk.'
      : atRiskTotal > cheapest
        ? `${m(atRiskTotal)} is at risk; ${cheapestName} at ${m(cheapest)} would keep ${ps.length === 1 ? 'the product' : `all ${ps.length} products`}.`
        : `${m(atRiskTotal)} is at risk, less than the cheapest way to keep ${ps.length === 1 ? 'the product' : 'them'} (${cheapestName}, ${m(cheapest)}).`;

  return {
    currency: c,
    rows,
    totals: {
      plannedUnits: totalUnits,
      marginLost: { cents: lostTotal, how: rows.length ? `${rows.map((r) => m(r.marginLost.cents)).join(' + ')} = ${m(lostTotal)}` : 'No product is ended.' },
      toolingUnrecovered: { cents: ps.length ? unrecovered : 0, how: ps.length ? unrecoveredHow : 'No product is ended.' },
      atRisk: { cents: ps.length ? atRiskTotal : 0, how: `${m(lostTotal)} margin lost + ${m(ps.length ? unrecovered : 0)} tooling not yet recovered` },
      cut: { cents: input.cutCents, how: "The engineer's estimate of the cut." },
      newInsert: { cents: input.newInsertCents, how: "The engineer's estimate of a new insert, which keeps the current geometry beside the new one." },
      duplicateTool: { cents: input.duplicateToolCents, how: "The engineer's estimate of a duplicate tool at the current revision." },
    },
    summary,
  };
}
