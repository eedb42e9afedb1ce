import Decimal from 'decimal.js';
import fc from 'fast-check';
import { toolingUnrecoveredCents, valueAtRisk, type ValueAtRiskInput } from '@shared/domain/value-at-risk';

const Oracle = Decimal.clone({ precision: 50 });

const base: ValueAtRiskInput = {
  currency: 'USD',
  products: [
    { id: 'a', sku: 'SR-1001', name: 'Ranger Kite', plannedUnits: 40_000, fobCents: 310, wholesaleCents: 650 },
    { id: 'b', sku: 'SR-1004', name: 'Kite Deluxe', plannedUnits: 20_000, fobCents: 400, wholesaleCents: 900 },
  ],
  tool: { code: 'KB-T-0412', buildCostCents: 1_850_000, shotCount: 250_000, ratedShots: 1_000_000 },
  cutCents: 680_000,
  newInsertCents: 1_450_000,
  duplicateToolCents: 2_100_000,
};

describe('toolingUnrecoveredCents (units-of-production method)', () => {
  it('when a tool has used a quarter of its rated shots, then three quarters of its cost is not yet recovered', () => {
    // Units-of-production depreciation (IAS 16.62 names the method; from memory): the charge follows
    // use, so the book value left is cost x (units left / total units). 18,500 USD x 750,000 / 1,000,000.
    expect(toolingUnrecoveredCents(1_850_000, 250_000, 1_000_000)).toBe(1_387_500);
  });
  it('when a tool ran past its rated shots, then nothing is left to recover', () => {
    expect(toolingUnrecoveredCents(1_850_000, 1_200_000, 1_000_000)).toBe(0);
  });
  it('when the share is a fraction of a cent, then it rounds half-up', () => {
    // 1,000 cents x 1 / 3 = 333.33... -> 333; 1,000 cents x 2 / 3 = 666.66... -> 667 (checked with decimal.js).
    expect(toolingUnrecoveredCents(1_000, 2, 3)).toBe(new Oracle(1000).times(1).div(3).toDecimalPlaces(0, Decimal.ROUND_HALF_UP).toNumber());
    expect(toolingUnrecoveredCents(1_000, 1, 3)).toBe(667);
  });
});

describe('valueAtRisk', () => {
  it('when two products are ended, then each row shows units, margin, margin lost and its shares, and says how', () => {
    const v = valueAtRisk(base);
    const [kite, deluxe] = v.rows;
    expect(kite!.unitMargin.cents).toBe(340);
    expect(kite!.marginLost.cents).toBe(13_600_000); // 40,000 x 3.40 USD = 136,000.00 USD
    expect(kite!.marginLost.how).toBe('40,000 units x $3.40 = $136,000.00');
    expect(deluxe!.marginLost.cents).toBe(10_000_000); // 20,000 x 5.00 USD
    // 1,387,500 cents not recovered, 2 : 1 by planned units -> 925,000 and 462,500.
    expect([kite!.toolingUnrecovered.cents, deluxe!.toolingUnrecovered.cents]).toEqual([925_000, 462_500]);
    expect(kite!.toolingUnrecovered.how).toContain('$18,500.00 build cost x 750,000 shots left / 1,000,000 rated shots of KB-T-0412 = $13,875.00');
    expect(v.totals.atRisk.cents).toBe(13_600_000 + 10_000_000 + 1_387_500);
    expect(v.totals.cut.cents).toBe(680_000);
    expect(v.summary).toBe('$249,875.00 is at risk; a new insert at $14,500.00 would keep all 2 products.');
  });

  it('when shares do not divide evenly, then the largest remainder gets the cent (Hamilton method)', () => {
    // Largest remainder (Hamilton) method: 100 cents by weights 1:1:1 -> 34, 33, 33.
    const v = valueAtRisk({
      ...base,
      products: ['x', 'y', 'z'].map((id) => ({ id, sku: id, name: id, plannedUnits: 10, fobCents: 1, wholesaleCents: 2 })),
      newInsertCents: 100,
    });
    expect(v.rows.map((r) => r.newInsertShare.cents)).toEqual([34, 33, 33]);
  });

  it('when no product has planned units left, then the shares are even and no margin is lost', () => {
    const v = valueAtRisk({ ...base, products: base.products.map((p) => ({ ...p, plannedUnits: 0 })) });
    expect(v.rows.map((r) => r.marginLost.cents)).toEqual([0, 0]);
    expect(v.rows.map((r) => r.duplicateToolShare.cents)).toEqual([1_050_000, 1_050_000]);
  });

  it('when a product sells below its FOB, then its margin and margin lost are negative', () => {
    const v = valueAtRisk({ ...base, products: [{ id: 'a', sku: 'A', name: 'A', plannedUnits: 3, fobCents: 500, wholesaleCents: 450 }] });
    expect(v.rows[0]!.marginLost.cents).toBe(-150);
  });

  it('property: rows add up to the totals to the cent, and margin lost is units x margin exactly', () => {
    const product = fc.record({
      plannedUnits: fc.integer({ min: 0, max: 5_000_000 }),
      fobCents: fc.integer({ min: 0, max: 100_000 }),
      wholesaleCents: fc.integer({ min: 0, max: 200_000 }),
    });
    fc.assert(
      fc.property(
        fc.array(product, { minLength: 1, maxLength: 8 }),
        fc.integer({ min: 0, max: 100_000_000 }),
        fc.integer({ min: 0, max: 3_000_000 }),
        fc.integer({ min: 1, max: 3_000_000 }),
        fc.integer({ min: 0, max: 50_000_000 }),
        fc.integer({ min: 0, max: 50_000_000 }),
        (ps, build, shots, rated, insert, dup) => {
          const v = valueAtRisk({
            ...base,
            products: ps.map((p, i) => ({ ...p, id: String(i), sku: `S${i}`, name: `P${i}` })),
            tool: { code: 'T', buildCostCents: build, shotCount: shots, ratedShots: rated },
            newInsertCents: insert,
            duplicateToolCents: dup,
          });
          const sum = (f: (r: (typeof v.rows)[number]) => number) => v.rows.reduce((s, r) => s + f(r), 0);
          expect(sum((r) => r.toolingUnrecovered.cents)).toBe(v.totals.toolingUnrecovered.cents);
          expect(sum((r) => r.newInsertShare.cents)).toBe(insert);
          expect(sum((r) => r.duplicateToolShare.cents)).toBe(dup);
          expect(sum((r) => r.marginLost.cents)).toBe(v.totals.marginLost.cents);
          expect(sum((r) => r.atRisk.cents)).toBe(v.totals.atRisk.cents);
          v.rows.forEach((r, i) => {
            expect(r.marginLost.cents).toBe(new Oracle(ps[i]!.plannedUnits).times(ps[i]!.wholesaleCents - ps[i]!.fobCents).toNumber() + 0); // + 0: -0 is 0 in cents
          });
        },
      ),
      { numRuns: 300 },
    );
  });
});
