import Decimal from 'decimal.js';
import fc from 'fast-check';
import {
  amortisePerUnit,
  breakEvenUnits,
  compareAlternatives,
  engineerEstimateProblems,
  marginPercent,
  markupPercent,
  modificationEconomics,
  paybackVerdict,
  priceBuildUp,
  priceForMargin,
  savingsVersus,
} from '@shared/domain/economics';

// Independent decimal.js constructor for cross-checks (library defaults plus more digits).
const Oracle = Decimal.clone({ precision: 50 });

describe('breakEvenUnits', () => {
  it('when given the Stanford EE204 Itanium example, then matches the published quotient and rounds up', () => {
    // Source: web.stanford.edu/class/ee204/breakeven.html — P = $250, K = $15, FC = $1B,
    // C = $235/unit, "BEV = $1B / $235 = 4,255,319 units" (the page truncates the quotient).
    const result = breakEvenUnits({ fixedCostCents: 100_000_000_000, priceCents: 25_000, variableCostCents: 1_500 });
    expect(result.contributionCents).toBe(23_500); // page: C = $250 - $15 = $235/unit
    // Cross-check: decimal.js computing 1e9 / 235 independently
    const quotient = new Oracle('1000000000').div('235');
    expect(result.exactUnits).toBe(quotient.toFixed(4)); // "4255319.1489"
    expect(quotient.floor().toNumber()).toBe(4_255_319); // the page's printed figure
    // Our stated rule rounds UP so the $1B is fully covered: 4,255,319 units leave $35 unrecovered.
    expect(result.units).toBe(4_255_320);
    expect(result.units).toBe(quotient.ceil().toNumber());
  });

  it('when the quotient is whole, then no rounding happens', () => {
    // Source: atlas.org break-even example, 18,000 / (100 - 20) = 225 (TRADE-FACTS 6.1)
    const result = breakEvenUnits({ fixedCostCents: 1_800_000, priceCents: 10_000, variableCostCents: 2_000 });
    expect(result.units).toBe(225);
    expect(result.exactUnits).toBe('225.0000');
  });

  it('when price does not exceed variable cost, then it never pays back', () => {
    expect(breakEvenUnits({ fixedCostCents: 1000, priceCents: 500, variableCostCents: 500 }).units).toBeNull();
    expect(breakEvenUnits({ fixedCostCents: 1000, priceCents: 400, variableCostCents: 500 }).units).toBeNull();
  });

  it('when there is no fixed cost, then break-even is zero units', () => {
    expect(breakEvenUnits({ fixedCostCents: 0, priceCents: 400, variableCostCents: 500 }).units).toBe(0);
  });

  it('when the fixed cost is negative or not whole, then throws', () => {
    expect(() => breakEvenUnits({ fixedCostCents: -1, priceCents: 2, variableCostCents: 1 })).toThrow(RangeError);
    expect(() => breakEvenUnits({ fixedCostCents: 1.5, priceCents: 2, variableCostCents: 1 })).toThrow(RangeError);
  });
});

describe('paybackVerdict', () => {
  it('when break-even is within the planned units, then says after how many', () => {
    const be = breakEvenUnits({ fixedCostCents: 123_400, priceCents: 300, variableCostCents: 200 });
    expect(be.units).toBe(1_234);
    expect(paybackVerdict(be, 10_000)).toEqual({ paysBack: true, sentence: 'Pays back after 1,234 units of 10,000 planned' });
    expect(paybackVerdict(be, 1_234).paysBack).toBe(true);
  });

  it('when break-even is beyond the planned units, then says it does not pay back', () => {
    const be = breakEvenUnits({ fixedCostCents: 1_234_500, priceCents: 300, variableCostCents: 200 });
    const verdict = paybackVerdict(be, 10_000);
    expect(verdict.paysBack).toBe(false);
    expect(verdict.sentence).toBe('Does not pay back within the planned units: needs 12,345, 10,000 planned');
  });

  it('when each unit earns nothing, then says it never pays back', () => {
    const be = breakEvenUnits({ fixedCostCents: 1000, priceCents: 100, variableCostCents: 150 });
    expect(paybackVerdict(be, 1_000_000)).toEqual({
      paysBack: false,
      sentence: 'Does not pay back at any volume: the price does not exceed the unit cost',
    });
  });
});

describe('amortisePerUnit', () => {
  it('when a $50,000 mold runs 50,000 parts, then tooling is $1.00 a part', () => {
    // Source: textbook quote via pheydenfans.blogspot.com, "$50,000 mold over 50,000 parts = $1/part" (TRADE-FACTS 6.1)
    const a = amortisePerUnit(5_000_000, 50_000);
    expect(a.perUnitCents).toBe(100);
    expect(a.recoveredCents).toBe(5_000_000);
    expect(a.overRecoveryCents).toBe(0);
  });

  it('when the cost does not divide evenly, then the per-unit figure is rounded up to the cent', () => {
    const a = amortisePerUnit(100_000, 3);
    // Cross-check: decimal.js 100000 / 3 = 33333.33..., ceiling 33334
    expect(a.perUnitCents).toBe(new Oracle(100_000).div(3).ceil().toNumber());
    expect(a.perUnitCents).toBe(33_334);
    expect(a.recoveredCents).toBe(100_002);
    expect(a.overRecoveryCents).toBe(2);
    expect(a.rule).toMatch(/rounded up/);
  });

  it('when planned units are zero, then throws', () => {
    expect(() => amortisePerUnit(1000, 0)).toThrow(RangeError);
  });
});

describe('margins and price build-up', () => {
  it('when cost is doubled (keystone), then the margin on retail is 50 %', () => {
    // Source: Monash marketing dictionary, "Keystone markup": cost $10, retail $20, 50 % margin (TRADE-FACTS 6.2)
    expect(marginPercent(1_000, 2_000)).toBe('50.00');
    expect(markupPercent(1_000, 2_000)).toBe('100.00');
    expect(priceForMargin(1_000, '50')).toBe(2_000);
  });

  it('when a target margin does not land on a cent, then the price rounds up so the margin is met', () => {
    // 461 / (1 - 0.45) = 838.18 -> 839; decimal.js cross-check
    expect(priceForMargin(461, '45')).toBe(new Oracle(461).div('0.55').ceil().toNumber());
    expect(new Oracle(839 - 461).div(839).gte('0.45')).toBe(true);
    expect(() => priceForMargin(100, '100')).toThrow(RangeError);
  });

  it('when FOB, freight, duty and prices are given, then each step shows its margin', () => {
    // Invented figures; each margin cross-checked with decimal.js.
    const b = priceBuildUp({
      fobCents: 400,
      freightPerUnitCents: 35,
      dutyPercent: '6.5',
      wholesaleCents: 900,
      retailCents: 1_999,
      factoryCostCents: 310,
    });
    expect(b.dutyCents).toBe(26); // 400 x 6.5 % = 26.00
    expect(b.landedCents).toBe(461);
    expect(b.steps.map((s) => s.stage)).toEqual(['factory', 'brand', 'retailer']);
    const expectPct = (cost: number, price: number) =>
      new Oracle(price - cost).div(price).times(100).toFixed(2, Decimal.ROUND_HALF_UP);
    expect(b.steps[0]).toMatchObject({ costCents: 310, priceCents: 400, marginCents: 90, marginPercent: expectPct(310, 400) });
    expect(b.steps[1]).toMatchObject({ costCents: 461, priceCents: 900, marginPercent: '48.78' });
    expect(b.steps[1].marginPercent).toBe(expectPct(461, 900));
    expect(b.steps[2]).toMatchObject({ costCents: 900, priceCents: 1_999, marginPercent: '54.98' });
    expect(b.steps[2].marginPercent).toBe(expectPct(900, 1_999));
    // [TRADE] retail is about 4-5x FOB (common practice, no published source; TRADE-FACTS 6.2)
    expect(b.retailToFobMultiple).toBe('5.00');
  });

  it('when a price is below its cost, then the margin is negative; a zero price has no margin', () => {
    expect(marginPercent(1_200, 1_000)).toBe('-20.00');
    expect(marginPercent(100, 0)).toBeNull();
    expect(markupPercent(0, 100)).toBeNull();
  });

  it('when duty is negative, then throws', () => {
    expect(() =>
      priceBuildUp({ fobCents: 1, freightPerUnitCents: 0, dutyPercent: '-1', wholesaleCents: 2, retailCents: 3 }),
    ).toThrow(RangeError);
  });
});

describe('modify versus alternatives', () => {
  it('when a duplicate tool costs more than the modification, then states the saving', () => {
    const s = savingsVersus(800_000, 'duplicate_tool', 4_500_000);
    expect(s.savingsCents).toBe(3_700_000);
    expect(s.sentence).toBe('Modifying saves $37,000.00 against a duplicate tool ($45,000.00)');
  });

  it('when the alternative is cheaper, then states the extra cost', () => {
    expect(savingsVersus(900_000, 'new_insert', 600_000).sentence).toBe(
      'Modifying costs $3,000.00 more than a new insert ($6,000.00)',
    );
  });

  it('when only some costs are known, then compares what it can and names the cheapest', () => {
    const c = compareAlternatives({ modificationCostCents: 800_000, newInsertCents: 600_000, duplicateToolCents: null });
    expect(c.versusDuplicateTool).toBeNull();
    expect(c.versusNewInsert?.savingsCents).toBe(-200_000);
    expect(c.cheapest).toBe('new_insert');
    expect(compareAlternatives({}).cheapest).toBeNull();
  });
});

describe('engineer estimate and the whole panel', () => {
  it('when fields are negative or fractional, then they are reported by name', () => {
    expect(engineerEstimateProblems({ modificationCostCents: -1, leadDays: 2.5, trialRoundsExpected: 2 })).toEqual({
      modificationCostCents: ['Must be a whole number of zero or more'],
      leadDays: ['Must be a whole number of zero or more'],
    });
    expect(engineerEstimateProblems({ modificationCostCents: null })).toEqual({});
  });

  it('when the estimate and prices are known, then amortisation, break-even and verdict agree', () => {
    const e = modificationEconomics({
      estimate: { modificationCostCents: 1_200_000, duplicateToolCents: 4_500_000 },
      plannedUnits: 40_000,
      priceCents: 900,
      variableCostCents: 461,
    });
    expect(e.amortisation?.perUnitCents).toBe(30); // 12,000.00 / 40,000 = 0.30
    expect(e.breakEven?.units).toBe(new Oracle(1_200_000).div(439).ceil().toNumber()); // 2,734
    expect(e.verdict?.sentence).toBe('Pays back after 2,734 units of 40,000 planned');
    expect(e.alternatives.versusDuplicateTool?.savingsCents).toBe(3_300_000);
  });

  it('when prices are not known yet, then break-even and verdict are null', () => {
    const e = modificationEconomics({ estimate: {}, plannedUnits: 0, priceCents: null, variableCostCents: null });
    expect(e).toEqual({
      amortisation: null,
      breakEven: null,
      verdict: null,
      alternatives: { versusNewInsert: null, versusDuplicateTool: null, cheapest: null },
    });
  });
});

describe('break-even properties (fast-check)', () => {
  const scenario = fc.record({
    fixed: fc.integer({ min: 0, max: 100_000_000_000 }),
    variable: fc.integer({ min: 0, max: 1_000_000 }),
    lowMargin: fc.integer({ min: 1, max: 1_000_000 }),
    raise: fc.integer({ min: 0, max: 1_000_000 }),
  });

  it('when the price rises, then break-even units never rise', () => {
    fc.assert(
      fc.property(scenario, ({ fixed, variable, lowMargin, raise }) => {
        const low = breakEvenUnits({ fixedCostCents: fixed, priceCents: variable + lowMargin, variableCostCents: variable });
        const high = breakEvenUnits({
          fixedCostCents: fixed,
          priceCents: variable + lowMargin + raise,
          variableCostCents: variable,
        });
        expect(high.units!).toBeLessThanOrEqual(low.units!);
      }),
    );
  });

  it('when break-even is reported, then it is the smallest whole volume that covers the fixed cost', () => {
    fc.assert(
      fc.property(scenario, ({ fixed, variable, lowMargin }) => {
        const be = breakEvenUnits({ fixedCostCents: fixed, priceCents: variable + lowMargin, variableCostCents: variable });
        const units = be.units!;
        expect(new Oracle(units).times(lowMargin).gte(fixed)).toBe(true);
        if (units > 0) expect(new Oracle(units - 1).times(lowMargin).lt(fixed)).toBe(true);
      }),
    );
  });

  it('when tooling is amortised, then the planned run always recovers it, by less than one cent a unit extra', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000_000 }), fc.integer({ min: 1, max: 10_000_000 }), (tool, units) => {
        const a = amortisePerUnit(tool, units);
        expect(a.recoveredCents).toBeGreaterThanOrEqual(tool);
        expect(a.overRecoveryCents).toBeLessThan(units);
      }),
    );
  });
});
