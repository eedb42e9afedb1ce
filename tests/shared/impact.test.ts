import { computeImpact, ImpactInputError, listInWords, type BillOfPartsLine, type ImpactItem } from '../../shared/domain/impact';

// Invented demo data: the head tool of "Ranger Kite" (Starling Rangers) is a family tool that also
// molds a hand used by another figure. The rule under test is DESIGN section 5 (impact); the steel
// direction behind it is common practice, no published source (see steel-direction.test.ts).

const tool = { id: 'tool-412', code: 'KB-T-0412', currentRevision: 3 };
const parts = [
  { id: 'p-head', toolId: 'tool-412', name: 'Head' },
  { id: 'p-visor', toolId: 'tool-412', name: 'Visor' },
  { id: 'p-hand', toolId: 'tool-412', name: 'Left hand' },
  { id: 'p-wheel', toolId: 'tool-077', name: 'Wheel' },
];

type DemoProduct = {
  id: string;
  sku: string;
  name: string;
  status: 'in_line' | 'reissue_planned' | 'retired';
  plannedUnits: number;
  brandId: string;
};
const product = (id: string, sku: string, name: string, status: DemoProduct['status'], plannedUnits: number): DemoProduct => ({
  id,
  sku,
  name,
  status,
  plannedUnits,
  brandId: 'brand-sr',
});
const products: DemoProduct[] = [
  product('kite', 'SR-1001', 'Ranger Kite', 'reissue_planned', 12000),
  product('kite-dlx', 'SR-1002', 'Ranger Kite Deluxe', 'in_line', 8000),
  product('kite-first', 'SR-0990', 'Ranger Kite First Issue', 'retired', 0),
  product('kite-proto', 'SR-0950', 'Ranger Kite Convention Edition', 'in_line', 500),
  product('hawk', 'SR-1010', 'Ranger Hawk', 'in_line', 9000),
  product('storm', 'SR-1050', 'Storm Kite', 'in_line', 15000),
  product('racer', 'MR-2001', 'Mudlark Dune Racer', 'in_line', 20000),
];
const line = (productId: string, partId: string, revision: number, toolId = 'tool-412'): BillOfPartsLine => ({
  productId,
  partId,
  toolId,
  revision,
  quantityPerUnit: 1,
});
const billOfParts: BillOfPartsLine[] = [
  line('kite', 'p-head', 3),
  line('kite-dlx', 'p-head', 3),
  line('kite-dlx', 'p-hand', 3),
  line('kite-first', 'p-head', 3),
  line('kite-proto', 'p-head', 2), // bound to an older revision of the head
  line('kite-proto', 'p-visor', 2),
  line('hawk', 'p-hand', 3), // family tool: same tool, different part
  line('storm', 'p-head', 3),
  line('racer', 'p-wheel', 1, 'tool-077'),
];

const cutHead: ImpactItem = { partId: 'p-head', effect: 'gains_plastic', method: 'cut' };
const cutHand: ImpactItem = { partId: 'p-hand', effect: 'gains_plastic', method: 'cut' };
const swapHead: ImpactItem = { partId: 'p-head', effect: 'insert_swapped', method: 'new_insert' };

const run = (items: ImpactItem[], movedProductIds: string[] = [], alternatives?: { newInsertCents?: number | null; duplicateToolCents?: number | null }) =>
  computeImpact({ tool, items, parts, products, billOfParts, movedProductIds, alternatives });

const ids = (xs: { id: string }[]) => xs.map((x) => x.id).sort();

describe('impact', () => {
  it('when the head is cut, then products needing the head at the current revision are ended, with the part named', () => {
    const r = run([cutHead], ['storm'], { newInsertCents: 1850000, duplicateToolCents: 6400000 });
    expect(r.irreversible).toBe(true);
    expect(r.removesSteel).toBe(true);
    expect(ids(r.endedProducts)).toEqual(['kite', 'kite-dlx']);
    expect(r.endedProducts.find((p) => p.id === 'kite-dlx')!.affectedParts).toEqual([{ id: 'p-head', name: 'Head' }]);
    expect(r.endedPlannedUnits).toBe(20000);
    expect(r.summary).toContain('KB-T-0412');
    expect(r.summary).toContain('SR-1001 Ranger Kite and SR-1002 Ranger Kite Deluxe');
    expect(r.summary).toContain('cannot be undone');
  });

  it('when products are in each status, then in-line and reissue-planned are ended and retired is not', () => {
    const r = run([cutHead]);
    const ended = new Map(r.endedProducts.map((p) => [p.id, p.status]));
    expect(ended.get('kite')).toBe('reissue_planned');
    expect(ended.get('kite-dlx')).toBe('in_line');
    expect(r.unaffectedProducts.find((p) => p.id === 'kite-first')).toMatchObject({ reason: 'retired' });
  });

  it('when a product is moved to the new revision, then it is kept, not ended', () => {
    const r = run([cutHead], ['storm']);
    expect(ids(r.keptProducts)).toEqual(['storm']);
    expect(r.keptProducts[0]!.affectedParts).toEqual([{ id: 'p-head', name: 'Head' }]);
    expect(ids(r.endedProducts)).not.toContain('storm');
    expect(r.summary).toContain('SR-1050 Storm Kite moves to the new revision');
    // not moved: the same product is ended
    expect(ids(run([cutHead]).endedProducts)).toContain('storm');
  });

  it('when a product is bound to an older revision of the cut part, then it is not ended', () => {
    const r = run([cutHead]);
    expect(r.unaffectedProducts.find((p) => p.id === 'kite-proto')).toMatchObject({ reason: 'older_revision' });
  });

  it('when a family tool has only its hand cut, then only products needing the hand are ended', () => {
    const r = run([cutHand]);
    expect(ids(r.endedProducts)).toEqual(['hawk', 'kite-dlx']);
    expect(r.unaffectedProducts.find((p) => p.id === 'kite')).toMatchObject({ reason: 'other_parts' });
  });

  it('when the head is cut, then a product needing only other parts of the family tool is untouched and products of other tools are not listed', () => {
    const r = run([cutHead]);
    expect(r.unaffectedProducts.find((p) => p.id === 'hawk')).toMatchObject({ reason: 'other_parts' });
    const all = [...r.endedProducts, ...r.keptProducts, ...r.unaffectedProducts].map((p) => p.id);
    expect(all).not.toContain('racer');
  });

  it('when the request only swaps an insert, then nothing is ended and the summary says why', () => {
    const r = run([swapHead], [], { newInsertCents: 100 });
    expect(r.irreversible).toBe(false);
    expect(r.endedProducts).toEqual([]);
    expect(r.waysToKeep).toEqual([]);
    expect(r.unaffectedProducts.find((p) => p.id === 'kite')).toMatchObject({ reason: 'reversible_only' });
    expect(r.summary).toMatch(/can be undone/);
    expect(r.summary).toMatch(/swapped back/);
  });

  it('when a swap on the head is mixed with a cut on the hand, then only the hand ends products', () => {
    const r = run([swapHead, cutHand]);
    expect(ids(r.endedProducts)).toEqual(['hawk', 'kite-dlx']);
    expect(r.endedProducts.find((p) => p.id === 'kite-dlx')!.affectedParts).toEqual([{ id: 'p-hand', name: 'Left hand' }]);
    expect(r.unaffectedProducts.find((p) => p.id === 'kite')).toMatchObject({ reason: 'reversible_only' });
  });

  it('when a cut only touches a part no current product needs, then it cannot be undone but ends nothing', () => {
    const r = run([{ partId: 'p-visor', effect: 'loses_plastic', method: 'weld_recut' }]);
    expect(r.irreversible).toBe(true);
    expect(r.removesSteel).toBe(false);
    expect(r.endedProducts).toEqual([]);
    expect(r.summary).toMatch(/cannot be undone, but it ends no product/);
  });

  it('when products are ended, then both ways to keep them carry their cost and name the products', () => {
    const r = run([cutHead], [], { newInsertCents: 1850000, duplicateToolCents: null });
    expect(r.waysToKeep.map((w) => w.kind)).toEqual(['new_insert', 'duplicate_tool']);
    expect(r.waysToKeep[0]).toMatchObject({ costCents: 1850000 });
    expect(r.waysToKeep[0]!.sentence).toContain('$18,500.00');
    expect(r.waysToKeep[0]!.sentence).toContain('SR-1001 Ranger Kite');
    expect(r.waysToKeep[1]).toMatchObject({ costCents: null });
    expect(r.waysToKeep[1]!.sentence).toMatch(/no estimate yet/);
  });

  it('when a cost is not whole cents, then the input is refused', () => {
    expect(() => run([cutHead], [], { newInsertCents: 12.5 })).toThrow(ImpactInputError);
    expect(() => run([cutHead], [], { duplicateToolCents: -1 })).toThrow(ImpactInputError);
  });

  it('when an item names a part of another tool or an unknown part, then the input is refused', () => {
    expect(() => run([{ partId: 'p-wheel', effect: 'gains_plastic', method: 'cut' }])).toThrow(/not molded by tool KB-T-0412/);
    expect(() => run([{ partId: 'nope', effect: 'gains_plastic', method: 'cut' }])).toThrow(ImpactInputError);
  });

  it('when there are no items, then nothing is ended', () => {
    const r = run([]);
    expect(r.irreversible).toBe(false);
    expect(r.endedProducts).toEqual([]);
    expect(r.summary).toMatch(/No cut items/);
  });

  it('when products carry extra fields, then the results keep them', () => {
    const r = run([cutHead]);
    expect(r.endedProducts[0]!.brandId).toBe('brand-sr');
  });

  it('when names are listed in words, then they read "A, B and C"', () => {
    expect(listInWords([])).toBe('');
    expect(listInWords(['A'])).toBe('A');
    expect(listInWords(['A', 'B'])).toBe('A and B');
    expect(listInWords(['A', 'B', 'C'])).toBe('A, B and C');
  });
});
