// Gates: what must be on a request before a signature may be given. The lifecycle table names the
// gate of each action (lifecycle.ts `gate`); the screens list the gaps, each with where it is
// entered, and the server refuses the action with 422 and one field error per gap.
//
//  review_ready   (the tooling engineer's review): every cut item classified (what happens to the
//                 part and how the toolmaker makes it); the estimate in (cost of the cut, its
//                 currency, lead days); the derivative product chosen, or the request says there
//                 is none and why; for a change that ends products, the cost of each way to keep
//                 them (a new insert, a duplicate tool).
//  approval_ready (the brand lead's approval): everything of review_ready, and the numbers of
//                 every ended product (its prices, so its unit margin is known, in the currency
//                 of the figures) and the tool's build cost (the tooling not yet recovered).
//
// A gate is never a judgement of the numbers: it only refuses a signature given blind.

export const gateIds = ['review_ready', 'approval_ready'] as const;
export type GateId = (typeof gateIds)[number];

/** Where a gap is filled in (the app turns it into a link). */
export type GapPlace =
  | { screen: 'request_edit' }
  | { screen: 'numbers' }
  | { screen: 'product_edit'; productId: string }
  | { screen: 'tool_edit'; toolId: string };

export interface GateGap {
  /** The key of the field error the server sends ("estimate.leadDays", "endedProducts.<id>.wholesaleCents"). */
  field: string;
  /** What is missing and what to do, in words. */
  message: string;
  where: GapPlace;
  /** Who can fill it in, in words ("the tooling engineer"). */
  who: string;
}

export interface GateProduct {
  id: string;
  sku: string;
  name: string;
  plannedUnits: number;
  fobCents: number | null;
  wholesaleCents: number | null;
  currency: string;
}

/** Everything a gate looks at, loaded by the server from the request and the registry. */
export interface GateFacts {
  items: readonly { position: number; partName: string; effect: string | null; method: string | null }[];
  estimate: { modificationCostCents: number | null; leadDays: number | null; newInsertCents: number | null; duplicateToolCents: number | null };
  /** The currency of the figures and whether someone chose it (entered, or the derivative's). */
  currency: { code: string; known: boolean };
  derivativeProductId: string | null;
  /** Why the change has no derivative product (empty: not said). */
  noDerivativeReason: string | null;
  tool: { id: string; code: string; buildCostCents: number | null };
  endedProducts: readonly GateProduct[];
}

const ENGINEER = 'the tooling engineer';
const DESIGNER = 'the designer';
const PRODUCT_OWNER = 'the tooling engineer or an administrator (product prices)';
const TOOL_OWNER = 'the tooling engineer or an administrator (tool registry)';

const blank = (s: string | null | undefined) => !s || s.trim() === '';

function reviewGaps(f: GateFacts): GateGap[] {
  const gaps: GateGap[] = [];
  const numbers: GapPlace = { screen: 'numbers' };
  if (f.items.length === 0) {
    gaps.push({ field: 'items', message: 'Add the cut items: there is nothing to review yet.', where: { screen: 'request_edit' }, who: DESIGNER });
  }
  for (const i of f.items) {
    if (blank(i.effect) || blank(i.method)) {
      gaps.push({
        field: `items.${i.position}`,
        message: `Classify cut item ${i.position + 1} (${i.partName}): say what happens to the part and how the toolmaker makes it.`,
        where: { screen: 'request_edit' },
        who: ENGINEER,
      });
    }
  }
  if (f.estimate.modificationCostCents === null) {
    gaps.push({ field: 'estimate.modificationCostCents', message: 'Enter the estimated cost of the cut.', where: numbers, who: ENGINEER });
  }
  if (!f.currency.known) {
    gaps.push({
      field: 'plan.currency',
      message: `Enter the currency of the estimate (without it the figures assume ${f.currency.code}).`,
      where: numbers,
      who: ENGINEER,
    });
  }
  if (f.estimate.leadDays === null) {
    gaps.push({ field: 'estimate.leadDays', message: 'Enter the lead time of the cut in days.', where: numbers, who: ENGINEER });
  }
  if (!f.derivativeProductId && blank(f.noDerivativeReason)) {
    gaps.push({
      field: 'derivativeProductId',
      message: 'Choose the product this change is for, or say that there is none and why.',
      where: { screen: 'request_edit' },
      who: DESIGNER,
    });
  }
  if (f.endedProducts.length > 0) {
    const names = f.endedProducts.map((p) => `${p.sku} ${p.name}`).join(', ');
    if (f.estimate.newInsertCents === null) {
      gaps.push({ field: 'estimate.newInsertCents', message: `Enter the cost of a new insert, a way to keep ${names}.`, where: numbers, who: ENGINEER });
    }
    if (f.estimate.duplicateToolCents === null) {
      gaps.push({ field: 'estimate.duplicateToolCents', message: `Enter the cost of a duplicate tool, a way to keep ${names}.`, where: numbers, who: ENGINEER });
    }
  }
  return gaps;
}

function approvalGaps(f: GateFacts): GateGap[] {
  const gaps = reviewGaps(f);
  for (const p of f.endedProducts) {
    const title = `${p.sku} ${p.name}`;
    const where: GapPlace = { screen: 'product_edit', productId: p.id };
    if (p.wholesaleCents === null || p.fobCents === null) {
      const lacking = [p.fobCents === null ? 'FOB cost' : null, p.wholesaleCents === null ? 'wholesale price' : null].filter(Boolean).join(' and ');
      gaps.push({
        field: `endedProducts.${p.id}.prices`,
        message: `Enter the ${lacking} of ${title}, so the margin its end costs is known.`,
        where,
        who: PRODUCT_OWNER,
      });
    } else if (p.currency.trim().toUpperCase() !== f.currency.code) {
      gaps.push({
        field: `endedProducts.${p.id}.currency`,
        message: `The prices of ${title} are in ${p.currency.trim().toUpperCase()}, the figures in ${f.currency.code}: enter its prices in ${f.currency.code}.`,
        where,
        who: PRODUCT_OWNER,
      });
    }
  }
  if (f.endedProducts.length > 0 && f.tool.buildCostCents === null) {
    gaps.push({
      field: 'tool.buildCostCents',
      message: `Enter the build cost of tool ${f.tool.code}, so the tooling not yet recovered is known.`,
      where: { screen: 'tool_edit', toolId: f.tool.id },
      who: TOOL_OWNER,
    });
  }
  return gaps;
}

export const gates: Record<GateId, { label: string; check: (f: GateFacts) => GateGap[] }> = {
  review_ready: { label: 'Before the engineering review can be signed', check: reviewGaps },
  approval_ready: { label: 'Before the change can be approved', check: approvalGaps },
};

/** The gaps of a gate (empty: the gate is passed). */
export const gateGaps = (gate: GateId, facts: GateFacts): GateGap[] => gates[gate].check(facts);

/** The gaps as the API's fieldErrors: one key per gap. */
export function gapsAsFieldErrors(gaps: readonly GateGap[]): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const g of gaps) (out[g.field] ??= []).push(g.message);
  return out;
}

/** One sentence for the refusal: "Nothing was signed: 3 things are missing. ..." */
export function gateRefusalMessage(gate: GateId, gaps: readonly GateGap[]): string {
  const n = gaps.length;
  const first = gaps[0]?.message ?? '';
  return `Nothing was signed: ${n === 1 ? 'one thing is' : `${n} things are`} missing ${gates[gate].label.charAt(0).toLowerCase()}${gates[gate].label.slice(1)}. ${first}${n > 1 ? ' The request lists the rest.' : ''}`;
}
