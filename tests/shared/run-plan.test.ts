import Decimal from 'decimal.js';
import fc from 'fast-check';
import { planRun, shotsNeeded } from '@shared/domain/run-plan';

const Oracle = Decimal.clone({ precision: 50 });

describe('shotsNeeded', () => {
  it('when the run divides evenly, then gives the exact shots', () => {
    // Formula from the product design (section 5, tool life): ceil(units x parts / cavities x (1 + scrap)).
    // 10,000 units x 2 parts / 4 cavities x 1.03 = 5,150 exactly (decimal.js cross-check below).
    const got = shotsNeeded({ units: 10_000, partsPerUnit: 2, cavitiesPerShot: 4, scrapRate: '0.03' });
    expect(got).toBe(5_150);
    expect(got).toBe(new Oracle(10_000).times(2).div(4).times('1.03').ceil().toNumber());
  });

  it('when binary floating point would overshoot, then decimal arithmetic keeps the exact whole shot', () => {
    // In doubles 100 x (1 + 0.1) = 110.00000000000001, whose ceiling would wrongly be 111.
    expect(Math.ceil(100 * (1 + 0.1))).toBe(111);
    expect(shotsNeeded({ units: 100, partsPerUnit: 1, cavitiesPerShot: 1, scrapRate: '0.1' })).toBe(110);
    expect(shotsNeeded({ units: 100, partsPerUnit: 1, cavitiesPerShot: 1, scrapRate: 0.1 })).toBe(110);
  });

  it('when parts do not fill the last shot, then rounds up to a whole shot', () => {
    // 7 units x 1 part / 4 cavities = 1.75 shots -> 2
    expect(shotsNeeded({ units: 7, partsPerUnit: 1, cavitiesPerShot: 4 })).toBe(2);
    expect(shotsNeeded({ units: 0, partsPerUnit: 1, cavitiesPerShot: 4 })).toBe(0);
  });

  it('when inputs are out of range, then throws', () => {
    expect(() => shotsNeeded({ units: -1, partsPerUnit: 1, cavitiesPerShot: 1 })).toThrow(RangeError);
    expect(() => shotsNeeded({ units: 1, partsPerUnit: 0, cavitiesPerShot: 1 })).toThrow(RangeError);
    expect(() => shotsNeeded({ units: 1, partsPerUnit: 1, cavitiesPerShot: 0 })).toThrow(RangeError);
    expect(() => shotsNeeded({ units: 1, partsPerUnit: 1, cavitiesPerShot: 1, scrapRate: '1' })).toThrow(RangeError);
    expect(() => shotsNeeded({ units: 1, partsPerUnit: 1, cavitiesPerShot: 1, scrapRate: '-0.01' })).toThrow(RangeError);
  });
});

describe('planRun', () => {
  it('when the tool has enough life left, then no warning and the spare shots are stated', () => {
    const plan = planRun({ units: 10_000, partsPerUnit: 2, cavitiesPerShot: 4, scrapRate: '0.03', remainingShots: 20_000 });
    expect(plan).toMatchObject({ shotsNeeded: 5_150, remainingShots: 20_000, enough: true, shortfall: 0, warning: null });
    expect(plan.summary).toBe('The run needs 5,150 shots; the tool has 20,000 left of its rated life, 14,850 to spare.');
  });

  it('when the run needs exactly the remaining shots, then it is enough', () => {
    const plan = planRun({ units: 5_000, partsPerUnit: 1, cavitiesPerShot: 1, remainingShots: 5_000 });
    expect(plan.enough).toBe(true);
    expect(plan.shortfall).toBe(0);
  });

  it('when the run needs more than is left, then warns with the shortfall', () => {
    const plan = planRun({ units: 100_000, partsPerUnit: 1, cavitiesPerShot: 8, scrapRate: '0.02', remainingShots: 10_000 });
    expect(plan.shotsNeeded).toBe(12_750);
    expect(plan.enough).toBe(false);
    expect(plan.shortfall).toBe(2_750);
    expect(plan.warning).toBe(
      'The run needs 12,750 shots but the tool has 10,000 left of its rated life: 2,750 short. Plan a refurbishment, a second tool, or a smaller run.',
    );
  });

  it('when the tool is already past its rated life, then the warning says by how much', () => {
    const plan = planRun({ units: 500, partsPerUnit: 1, cavitiesPerShot: 1, remainingShots: -1_000 });
    expect(plan.shortfall).toBe(1_500);
    expect(plan.warning).toMatch(/^The tool is already 1,000 shots past its rated life; this run of 500 shots takes it 1,500 shots beyond/);
  });
});

describe('run-plan properties (fast-check)', () => {
  const run = fc.record({
    units: fc.integer({ min: 0, max: 10_000_000 }),
    more: fc.integer({ min: 0, max: 10_000_000 }),
    partsPerUnit: fc.integer({ min: 1, max: 64 }),
    cavitiesPerShot: fc.integer({ min: 1, max: 64 }),
    scrapPermille: fc.integer({ min: 0, max: 999 }),
  });

  it('when units rise, then shots needed never fall', () => {
    fc.assert(
      fc.property(run, ({ units, more, partsPerUnit, cavitiesPerShot, scrapPermille }) => {
        const scrapRate = new Oracle(scrapPermille).div(1000).toString();
        const a = shotsNeeded({ units, partsPerUnit, cavitiesPerShot, scrapRate });
        const b = shotsNeeded({ units: units + more, partsPerUnit, cavitiesPerShot, scrapRate });
        expect(b).toBeGreaterThanOrEqual(a);
      }),
    );
  });

  it('when shots are computed, then they are the smallest whole number covering parts plus scrap', () => {
    fc.assert(
      fc.property(run, ({ units, partsPerUnit, cavitiesPerShot, scrapPermille }) => {
        const scrapRate = new Oracle(scrapPermille).div(1000);
        const shots = shotsNeeded({ units, partsPerUnit, cavitiesPerShot, scrapRate: scrapRate.toString() });
        const partsWanted = new Oracle(units).times(partsPerUnit).times(scrapRate.plus(1));
        expect(new Oracle(shots).times(cavitiesPerShot).gte(partsWanted)).toBe(true);
        if (shots > 0) expect(new Oracle(shots - 1).times(cavitiesPerShot).lt(partsWanted)).toBe(true);
      }),
    );
  });
});
