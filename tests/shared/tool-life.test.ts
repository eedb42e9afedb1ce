import fc from 'fast-check';
import { moldClasses } from '../../shared/domain/data/mold-classes';
import { lifeBandOf, ratedLifeFromClass, toolLife, WORN_FROM_PERCENT } from '../../shared/domain/tool-life';

describe('rated life from the mold class', () => {
  // TRADE-FACTS 1.1, the Kaysun table (kaysun.com/blog/the-types-of-spi-mold-classifications), also
  // teameliteonline, mouldprecision, legalclarity: 101 one million or more, 102 not exceeding one
  // million, 103 not exceeding 500,000, 104 not exceeding 100,000, 105 not exceeding 500.
  it.each([
    [101, 1_000_000],
    [102, 1_000_000],
    [103, 500_000],
    [104, 100_000],
    [105, 500],
  ])('when the class is %i, then the default rated life is %i shots with its source named', (moldClass, shots) => {
    const life = ratedLifeFromClass(moldClass);
    expect(life?.ratedShots).toBe(shots);
    expect(life?.source).toMatch(/Kaysun/);
    expect(life?.source).toMatch(new RegExp(`Class ${moldClass}`));
  });

  it('when the class is 101, then the source says the published figure is a floor', () => {
    expect(ratedLifeFromClass(101)?.source).toMatch(/floor/);
  });

  it('when the class is not 101 to 105, then it is refused', () => {
    expect(() => ratedLifeFromClass(106)).toThrow(RangeError);
    expect(moldClasses.map((c) => c.moldClass)).toEqual([101, 102, 103, 104, 105]);
  });
});

describe('toolLife', () => {
  it('when a class 103 tool (500,000 rated, Kaysun) has run 212,400 shots, then 42.5 % used, 287,600 left, fresh', () => {
    // 212,400 / 500,000 = 0.4248 -> 42.48 % -> 42.5 (half-up); 500,000 - 212,400 = 287,600 (hand arithmetic).
    const life = toolLife({ ratedShots: 500_000, shotCount: 212_400 });
    expect(life).toMatchObject({ remainingShots: 287_600, overShots: 0, percentUsed: '42.5', band: 'fresh' });
    expect(life.sentence).toBe('212,400 of 500,000 rated shots used (42.5 %); 287,600 left.');
  });

  it('when exactly 80 % of a class 103 life is used (400,000 of 500,000), then the band is worn', () => {
    // 80 % is the warning line of the registry brief (product rule, no published source).
    expect(WORN_FROM_PERCENT).toBe(80);
    const life = toolLife({ ratedShots: 500_000, shotCount: 400_000 });
    expect(life).toMatchObject({ percentUsed: '80.0', band: 'worn', remainingShots: 100_000 });
    expect(life.sentence).toMatch(/Past 80 % of rated life/);
  });

  it('when one shot short of 80 %, then it shows 80.0 but stays fresh (bands use the exact ratio)', () => {
    // 399,999 / 500,000 = 79.9998 % -> displays "80.0" after half-up rounding.
    const life = toolLife({ ratedShots: 500_000, shotCount: 399_999 });
    expect(life.percentUsed).toBe('80.0');
    expect(life.band).toBe('fresh');
  });

  it('when a class 103 tool has run 431,250 shots, then 86.3 % (86.25 rounded half-up), worn', () => {
    expect(toolLife({ ratedShots: 500_000, shotCount: 431_250 })).toMatchObject({ percentUsed: '86.3', band: 'worn', remainingShots: 68_750 });
  });

  it('when a class 105 prototype tool (500 rated, Kaysun) has run 520 shots, then 104.0 %, spent, 20 over', () => {
    const life = toolLife({ ratedShots: 500, shotCount: 520 });
    expect(life).toMatchObject({ remainingShots: 0, overShots: 20, percentUsed: '104.0', band: 'spent' });
    expect(life.sentence).toMatch(/20 past its rated life/);
  });

  it('when the shot count equals the rated life, then spent with nothing left', () => {
    expect(toolLife({ ratedShots: 100_000, shotCount: 100_000 })).toMatchObject({ remainingShots: 0, overShots: 0, percentUsed: '100.0', band: 'spent' });
  });

  it('when inputs are not whole, non-negative numbers, then RangeError', () => {
    expect(() => toolLife({ ratedShots: 0, shotCount: 1 })).toThrow(RangeError);
    expect(() => toolLife({ ratedShots: 10, shotCount: -1 })).toThrow(RangeError);
    expect(() => toolLife({ ratedShots: 10.5, shotCount: 1 })).toThrow(RangeError);
  });

  it('when checked on random counts, then percent and band agree with exact integer arithmetic', () => {
    // Independent oracle: BigInt tenths of a percent, rounded half-up by hand.
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2_000_000_000 }), fc.integer({ min: 0, max: 4_000_000_000 }), (rated, shots) => {
        const life = toolLife({ ratedShots: rated, shotCount: shots });
        const num = BigInt(shots) * 1000n;
        const den = BigInt(rated);
        const tenths = (num * 2n + den) / (2n * den); // round half-up of num/den
        const expected = `${tenths / 10n}.${tenths % 10n}`;
        expect(life.percentUsed).toBe(expected);
        const band = BigInt(shots) >= den ? 'spent' : BigInt(shots) * 100n >= den * 80n ? 'worn' : 'fresh';
        expect(life.band).toBe(band);
        expect(lifeBandOf(rated, shots)).toBe(band);
        expect(life.remainingShots + Math.min(shots, rated)).toBe(rated);
        expect(life.overShots).toBe(Math.max(0, shots - rated));
      }),
      { numRuns: 500 },
    );
  });
});
