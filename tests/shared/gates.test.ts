import { gapsAsFieldErrors, gateGaps, gateRefusalMessage, type GateFacts } from '@shared/domain/gates';
import { lifecycle } from '@shared/domain/lifecycle';

const ready = (over: Partial<GateFacts> = {}): GateFacts => ({
  items: [{ position: 0, partName: 'Head', effect: 'gains_plastic', method: 'cut' }],
  estimate: { modificationCostCents: 680_000, leadDays: 28, newInsertCents: 1_450_000, duplicateToolCents: 2_100_000 },
  currency: { code: 'USD', known: true },
  derivativeProductId: '00000000-0000-4000-8000-000000000001',
  noDerivativeReason: null,
  tool: { id: '00000000-0000-4000-8000-0000000000aa', code: 'KB-T-0412', buildCostCents: 1_850_000 },
  endedProducts: [{ id: 'p1', sku: 'SR-1001', name: 'Ranger Kite', plannedUnits: 40_000, fobCents: 310, wholesaleCents: 650, currency: 'USD' }],
  ...over,
});

describe('gates in the lifecycle table', () => {
  it('when the table is read, then the engineer review and the approval each name their gate', () => {
    expect(lifecycle.actions.sign_review.gate).toBe('review_ready');
    expect(lifecycle.actions.approve.gate).toBe('approval_ready');
    expect(lifecycle.actions.submit.gate).toBeUndefined();
  });
});

describe('review_ready', () => {
  it('when everything is in, then there is no gap', () => {
    expect(gateGaps('review_ready', ready())).toEqual([]);
  });

  it('when the estimate, its currency and lead days are missing, then each is a gap with a link to the numbers', () => {
    const gaps = gateGaps('review_ready', ready({ estimate: { modificationCostCents: null, leadDays: null, newInsertCents: 1, duplicateToolCents: 1 }, currency: { code: 'USD', known: false } }));
    expect(gaps.map((g) => g.field)).toEqual(['estimate.modificationCostCents', 'plan.currency', 'estimate.leadDays']);
    expect(gaps.every((g) => g.where.screen === 'numbers')).toBe(true);
  });

  it('when no product is chosen and no reason is given, then the derivative is a gap; a reason closes it', () => {
    expect(gateGaps('review_ready', ready({ derivativeProductId: null })).map((g) => g.field)).toEqual(['derivativeProductId']);
    expect(gateGaps('review_ready', ready({ derivativeProductId: null, noDerivativeReason: '   ' })).map((g) => g.field)).toEqual(['derivativeProductId']);
    expect(gateGaps('review_ready', ready({ derivativeProductId: null, noDerivativeReason: 'A fix to the figure in line.' }))).toEqual([]);
  });

  it('when a cut item is not classified, then that item is a gap', () => {
    const gaps = gateGaps('review_ready', ready({ items: [{ position: 0, partName: 'Head', effect: 'gains_plastic', method: 'cut' }, { position: 1, partName: 'Visor', effect: null, method: 'cut' }] }));
    expect(gaps.map((g) => g.field)).toEqual(['items.1']);
    expect(gaps[0]!.message).toContain('Visor');
  });

  it('when the change ends products and the ways to keep them are not priced, then both costs are gaps', () => {
    const gaps = gateGaps('review_ready', ready({ estimate: { modificationCostCents: 1, leadDays: 1, newInsertCents: null, duplicateToolCents: null } }));
    expect(gaps.map((g) => g.field)).toEqual(['estimate.newInsertCents', 'estimate.duplicateToolCents']);
    // Nothing ended: the ways to keep are not needed.
    expect(gateGaps('review_ready', ready({ endedProducts: [], estimate: { modificationCostCents: 1, leadDays: 1, newInsertCents: null, duplicateToolCents: null } }))).toEqual([]);
  });
});

describe('approval_ready', () => {
  it('when an ended product has no prices, then it is a gap linking to that product', () => {
    const gaps = gateGaps('approval_ready', ready({ endedProducts: [{ id: 'p1', sku: 'SR-1001', name: 'Ranger Kite', plannedUnits: 40_000, fobCents: null, wholesaleCents: 650, currency: 'USD' }] }));
    expect(gaps).toEqual([expect.objectContaining({ field: 'endedProducts.p1.prices', where: { screen: 'product_edit', productId: 'p1' } })]);
    expect(gaps[0]!.message).toContain('FOB cost of SR-1001 Ranger Kite');
  });

  it('when an ended product is priced in another currency or the tool has no build cost, then each is a gap', () => {
    const gaps = gateGaps('approval_ready', ready({
      endedProducts: [{ id: 'p1', sku: 'SR-1001', name: 'Ranger Kite', plannedUnits: 1, fobCents: 1, wholesaleCents: 2, currency: 'EUR' }],
      tool: { id: 't', code: 'KB-T-0412', buildCostCents: null },
    }));
    expect(gaps.map((g) => g.field)).toEqual(['endedProducts.p1.currency', 'tool.buildCostCents']);
  });

  it('when the review gate has a gap, then the approval has it too (nothing reaches the brand lead blind)', () => {
    expect(gateGaps('approval_ready', ready({ estimate: { modificationCostCents: null, leadDays: 1, newInsertCents: 1, duplicateToolCents: 1 } })).map((g) => g.field)).toEqual([
      'estimate.modificationCostCents',
    ]);
  });

  it('when gaps are turned into field errors, then each gap is named and the message says how many', () => {
    const gaps = gateGaps('approval_ready', ready({ derivativeProductId: null, tool: { id: 't', code: 'KB-T-0412', buildCostCents: null } }));
    expect(Object.keys(gapsAsFieldErrors(gaps))).toEqual(['derivativeProductId', 'tool.buildCostCents']);
    expect(gateRefusalMessage('approval_ready', gaps)).toMatch(/^Nothing was signed: 2 things are missing before the change can be approved\./);
  });
});
