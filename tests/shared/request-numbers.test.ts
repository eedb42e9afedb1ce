import Decimal from 'decimal.js';
import fc from 'fast-check';
import {
  clampCheck,
  computeRequestNumbers,
  dimensionCheck,
  EMPTY_NUMBERS_INPUTS,
  openPlansVersusLife,
  resolvePlan,
  runPlanFor,
  type NumbersFacts,
  type NumbersInputs,
} from '@shared/domain/request-numbers';
import { numbersInputsSchema, type NumbersInputsInput } from '@shared/schemas/numbers';

// Independent decimal.js constructor for cross-checks.
const Oracle = Decimal.clone({ precision: 50, rounding: Decimal.ROUND_HALF_UP });

const facts = (over: Partial<NumbersFacts> = {}): NumbersFacts => ({
  tool: { id: 't', code: 'KB-T-9001', ratedShots: 500_000, shotCount: 212_400, ratedShotsSource: 'Class 103 (Kaysun)', currency: 'USD' },
  derivative: { id: 'd', sku: 'SR-9002', name: 'Storm Test', plannedUnits: 60_000, fobCents: 325, wholesaleCents: 680, retailCents: 1399, currency: 'USD' },
  parts: [{ id: 'p1', name: 'Head', resin: 'ABS', cavitiesPerShot: 2, derivativeQuantityPerUnit: null }],
  ended: [{ id: 'e', sku: 'SR-9001', name: 'Ranger Test', plannedUnits: 40_000 }],
  ...over,
});

const inputs = (over: NumbersInputsInput = {}): NumbersInputs => numbersInputsSchema.parse(over);

describe('resolvePlan', () => {
  it('when a value is left empty, then the product gives it; an entered value wins and says so', () => {
    const p = resolvePlan({ ...EMPTY_NUMBERS_INPUTS.plan, wholesaleCents: 700 }, facts());
    expect(p.plannedUnits).toEqual({ value: 60_000, from: 'product' });
    expect(p.fobCents).toEqual({ value: 325, from: 'product' });
    expect(p.wholesaleCents).toEqual({ value: 700, from: 'entered' });
    expect(p.currency).toBe('USD');
  });

  it('when freight, duty and scrap are empty, then they count as zero and the assumptions say so', () => {
    const p = resolvePlan(EMPTY_NUMBERS_INPUTS.plan, facts());
    expect(p.freightPerUnitCents).toEqual({ value: 0, from: 'assumed' });
    expect(p.dutyPercent).toEqual({ value: '0', from: 'assumed' });
    expect(p.landedCents).toBe(325);
    expect(p.assumptions).toEqual(['Freight not entered: counted as 0 per unit.', 'Duty not entered: counted as 0 %.', 'Scrap not entered: counted as 0 %.']);
  });

  it('when duty is a percent of FOB, then it rounds half-up to the cent (ratio with decimal.js, never floats)', () => {
    // 325 x 2.5 % = 8.125 -> 8; 330 x 2.5 % = 8.25 -> 8; 310 x 6.5 % = 20.15 -> 20; 300 x 6.5 % = 19.5 -> 20 (half-up).
    for (const [fob, duty] of [
      [325, '2.5'],
      [330, '2.5'],
      [310, '6.5'],
      [300, '6.5'],
    ] as const) {
      const p = resolvePlan({ ...EMPTY_NUMBERS_INPUTS.plan, fobCents: fob, dutyPercent: duty, freightPerUnitCents: 0 }, facts());
      expect(p.dutyCents).toBe(new Oracle(fob).times(duty).div(100).toDecimalPlaces(0, Decimal.ROUND_HALF_UP).toNumber());
    }
  });

  it('when the entered currency differs from the product, then the product prices are not used', () => {
    const p = resolvePlan({ ...EMPTY_NUMBERS_INPUTS.plan, currency: 'EUR' }, facts());
    expect(p.currency).toBe('EUR');
    expect(p.fobCents).toEqual({ value: null, from: 'none' });
    expect(p.assumptions[0]).toMatch(/prices are in USD, not EUR/);
  });

  it('when the derivative has 0 planned units, then planned units are unknown rather than zero', () => {
    const d = facts().derivative!;
    expect(resolvePlan(EMPTY_NUMBERS_INPUTS.plan, facts({ derivative: { ...d, plannedUnits: 0 } })).plannedUnits).toEqual({ value: null, from: 'none' });
  });
});

describe('runPlanFor', () => {
  it('when several parts change, then the part needing the most shots governs (one shot fills every cavity)', () => {
    // Common practice, no published source: a family tool fills all its cavities each shot.
    const f = facts({
      parts: [
        { id: 'p1', name: 'Head', resin: 'ABS', cavitiesPerShot: 4, derivativeQuantityPerUnit: null },
        { id: 'p2', name: 'Arm', resin: 'ABS', cavitiesPerShot: 2, derivativeQuantityPerUnit: 2 },
      ],
    });
    const run = runPlanFor(10_000, null, '0.03', f);
    // Head: 10,000 x 1 / 4 x 1.03 = 2,575; Arm: 10,000 x 2 (from the bill) / 2 x 1.03 = 10,300.
    expect(run.parts.map((p) => [p.partName, p.partsPerUnit, p.partsPerUnitFrom, p.shotsNeeded])).toEqual([
      ['Head', 1, 'assumed', new Oracle(10_000).div(4).times('1.03').ceil().toNumber()],
      ['Arm', 2, 'bill', new Oracle(10_000).times(2).div(2).times('1.03').ceil().toNumber()],
    ]);
    expect(run.governingPartId).toBe('p2');
    expect(run.plan!.shotsNeeded).toBe(10_300);
    expect(run.remainingShots).toBe(500_000 - 212_400);
  });

  it('when the tool already ran past its rating, then the remaining shots are negative and the plan warns', () => {
    const run = runPlanFor(100, 1, '0', facts({ tool: { ...facts().tool, ratedShots: 1000, shotCount: 1200 } }));
    expect(run.remainingShots).toBe(-200);
    expect(run.life.overShots).toBe(200);
    expect(run.plan!.enough).toBe(false);
    expect(run.plan!.warning).toMatch(/already 200 shots past/);
  });

  it('when planned units are unknown, then there is no plan', () => {
    expect(runPlanFor(null, 1, '0', facts()).plan).toBeNull();
  });
});

describe('computeRequestNumbers', () => {
  it('when nothing is entered, then it names what is missing and gives no verdict', () => {
    const r = computeRequestNumbers(EMPTY_NUMBERS_INPUTS, facts({ derivative: null }));
    expect(r.economics.verdict).toBeNull();
    expect(r.economics.breakEven).toBeNull();
    expect(r.missing).toEqual([
      "The cost of the cut (the engineer's estimate).",
      'The planned units (the request has no derivative product).',
      'The FOB price of the derivative.',
      'The wholesale price of the derivative.',
      'The retail price of the derivative (for the price build-up).',
      'The cost of a new insert or a duplicate tool, to keep the ended products alive.',
    ]);
  });

  it('when the estimate is given, then the verdict is the break-even against the planned units in words', () => {
    // Break-even = FC / (P - K), Stanford EE204 (TRADE-FACTS 6.1): 680,000 / (680 - 347) = 2,042.04 -> 2,043 units.
    const r = computeRequestNumbers(inputs({ estimate: { modificationCostCents: 680_000 }, plan: { freightPerUnitCents: 22, dutyPercent: '0' } }), facts());
    expect(r.economics.breakEven!.units).toBe(new Oracle(680_000).div(680 - 347).ceil().toNumber());
    expect(r.economics.verdict!.sentence).toBe('Pays back after 2,043 units of 60,000 planned');
  });

  it('when a stored check names a resin or factor no longer in the tables, then the figure is left out with the reason', () => {
    const r = computeRequestNumbers(
      {
        ...EMPTY_NUMBERS_INPUTS,
        dimension: { oldPartMm: '10', newPartMm: '11', resinId: 'gone', shrink: null, convention: 'astm_d955', formedBy: 'recess' },
        clamp: { projectedArea: '10', areaUnit: 'cm2', factorId: 'gone', factor: null, safetyFactor: '1', pressTonnage: null, pressUnit: 'kn' },
      },
      facts(),
    );
    expect(r.dimension).toBeNull();
    expect(r.clamp).toBeNull();
    expect(r.problems).toEqual(['Dimension check: Resin "gone" is not in the shrink table', 'Clamp check: Clamp factor "gone" is not in the factor table']);
  });

  it('when any valid inputs are given, then it never throws and money stays whole cents', () => {
    const cents = fc.option(fc.integer({ min: 0, max: 10_000_000_000 }), { nil: null });
    fc.assert(
      fc.property(
        cents,
        cents,
        cents,
        fc.option(fc.integer({ min: 1, max: 10_000_000 }), { nil: null }),
        fc.option(fc.integer({ min: 0, max: 999 }).map((n) => `0.${String(n).padStart(3, '0')}`), { nil: null }),
        fc.integer({ min: 1, max: 64 }),
        (mod, fob, wholesale, planned, scrap, cavities) => {
          const r = computeRequestNumbers(
            inputs({ estimate: { modificationCostCents: mod }, plan: { fobCents: fob, wholesaleCents: wholesale, plannedUnits: planned, scrapRate: scrap } }),
            facts({ parts: [{ id: 'p', name: 'P', resin: 'ABS', cavitiesPerShot: cavities, derivativeQuantityPerUnit: null }] }),
          );
          expect(r.problems).toEqual([]);
          for (const v of [r.plan.landedCents, r.economics.amortisation?.perUnitCents, r.economics.breakEven?.contributionCents]) {
            if (v !== null && v !== undefined) expect(Number.isSafeInteger(v)).toBe(true);
          }
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe('engineering checks', () => {
  it('when the shrink is left empty, then the middle of the resin range is used and labelled as such', () => {
    // ABS 0.004-0.007 (Stelray, TRADE-FACTS 3.2): midpoint 0.0055; steel = part / (1 - S) (ASTM D955).
    const d = dimensionCheck({ oldPartMm: '31.2', newPartMm: '32.0', resinId: 'abs', shrink: null, convention: 'astm_d955', formedBy: 'recess' });
    expect(d.shrink).toBe('0.0055');
    expect(d.shrinkFrom).toBe('resin_range');
    expect(d.change.newSteelMm).toBe(new Oracle('32.0').div(new Oracle(1).minus('0.0055')).toFixed(3));
    expect(d.change.action).toBe('remove_steel');
  });

  it('when the factor is left empty, then the upper end of the published range is used', () => {
    // Ji-Horng ABS 0.30-0.40 tonnes-force/cm² (TRADE-FACTS 2.2): 100 cm² x 0.40 x 1.1 = 44 tonnes-force.
    const c = clampCheck({ projectedArea: '100', areaUnit: 'cm2', factorId: 'ji_horng_abs', factor: null, safetyFactor: '1.1', pressTonnage: null, pressUnit: 'short_tons' });
    expect(c.factorUsed).toBe('0.4');
    expect(c.factorFrom).toBe('factor_range');
    expect(c.check.requiredTonnesForce).toBe('44.00');
    // 44 tf x 9,806.65 N / 1,000 = 431.49 kN (exact definition of the tonne-force).
    expect(c.check.requiredKilonewtons).toBe(new Oracle(44).times('9806.65').div(1000).toFixed(2));
  });
});

describe('openPlansVersusLife', () => {
  it('when the plans fit, then the spare shots are stated; when they do not, then a warning with the shortfall', () => {
    const ok = openPlansVersusLife(50_000, [{ shotsNeeded: 20_000 }, { shotsNeeded: 10_000 }, { shotsNeeded: null }]);
    expect(ok).toMatchObject({ totalShots: 30_000, plansCounted: 2, plansWithoutFigures: 1, enough: true, shortfall: 0, warning: null });
    expect(ok.summary).toBe('2 open plans need 30,000 shots; the tool has 50,000 left of its rated life, 20,000 to spare. 1 more plan has no planned units yet.');
    const short = openPlansVersusLife(25_000, [{ shotsNeeded: 20_000 }, { shotsNeeded: 10_000 }]);
    expect(short).toMatchObject({ enough: false, shortfall: 5_000 });
    expect(short.warning).toMatch(/5,000 short/);
  });

  it('when there are no plans, then there is nothing to warn about', () => {
    expect(openPlansVersusLife(10, [])).toMatchObject({ totalShots: 0, enough: true, warning: null, summary: 'No open changes on this tool. The tool has 10 left of its rated life.' });
  });

  it('when any plans are added, then the total is their exact sum and adding a plan never lowers it', () => {
    fc.assert(
      fc.property(fc.array(fc.option(fc.integer({ min: 0, max: 5_000_000 }), { nil: null }), { maxLength: 20 }), fc.integer({ min: 0, max: 5_000_000 }), (shots, extra) => {
        const plans = shots.map((s) => ({ shotsNeeded: s }));
        const a = openPlansVersusLife(1_000_000, plans);
        expect(a.totalShots).toBe(shots.reduce<number>((s, x) => s + (x ?? 0), 0));
        expect(openPlansVersusLife(1_000_000, [...plans, { shotsNeeded: extra }]).totalShots).toBeGreaterThanOrEqual(a.totalShots);
        expect(a.enough).toBe(a.totalShots <= 1_000_000);
      }),
    );
  });
});
