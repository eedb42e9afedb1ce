import { MOLD_CLASS_SOURCE, isMoldClass, moldClassLife, moldClasses, ratedShotsFor } from '@shared/domain/data/mold-classes';

// Source for every check in this file: Kaysun, "The 5 Types of SPI Mold Classifications and Standards"
// (kaysun.com/blog/the-types-of-spi-mold-classifications): 101 "1 million or more", 102 "not exceeding
// 1 million", 103 "not exceeding 500,000", 104 "not exceeding 100,000", 105 "not exceeding 500"
// (TRADE-FACTS 1.1; teameliteonline, mouldprecision and legalclarity agree; smimolding differs and is not used).

describe('mold classes 101-105', () => {
  it.each([
    [101, 1_000_000, 'at_least'],
    [102, 1_000_000, 'at_most'],
    [103, 500_000, 'at_most'],
    [104, 100_000, 'at_most'],
    [105, 500, 'at_most'],
  ] as const)('when class %i is looked up, then its rated life is %i shots (%s)', (moldClass, shots, bound) => {
    expect(ratedShotsFor(moldClass)).toBe(shots);
    expect(moldClassLife(moldClass)).toMatchObject({ moldClass, ratedShots: shots, ratedShotsBound: bound });
  });

  it('when the table is read, then it lists the five classes in order, each naming its source', () => {
    expect(moldClasses.map((c) => c.moldClass)).toEqual([101, 102, 103, 104, 105]);
    for (const c of moldClasses) {
      expect(c.source).toBe(MOLD_CLASS_SOURCE);
      expect(c.label).toMatch(new RegExp(`^Class ${c.moldClass}:`));
    }
    expect(MOLD_CLASS_SOURCE).toMatch(/kaysun\.com/);
  });

  it('when the rated lives are compared, then a higher class number never has a longer life', () => {
    const lives = moldClasses.map((c) => c.ratedShots ?? 0);
    for (let i = 1; i < lives.length; i += 1) expect(lives[i]).toBeLessThanOrEqual(lives[i - 1]);
  });

  it('when a number is not a mold class, then it is refused', () => {
    expect(isMoldClass(103)).toBe(true);
    expect(isMoldClass(106)).toBe(false);
    expect(isMoldClass('101')).toBe(false);
    expect(() => ratedShotsFor(100)).toThrow(/Unknown mold class 100/);
  });
});
