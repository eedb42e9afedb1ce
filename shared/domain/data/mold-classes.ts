/**
 * Expected-life mold classes 101-105 (SPI, now the Plastics Industry Association), with rated
 * shots taken from ONE named source: Kaysun, "The 5 Types of SPI Mold Classifications and
 * Standards" (kaysun.com/blog/the-types-of-spi-mold-classifications, 2019). TRADE-FACTS 1.1:
 * teameliteonline.com, mouldprecision.com and legalclarity.org give the same figures;
 * smimolding.com differs (102 "under 500,000", 103 "under 250,000") and is not used.
 *
 * Class 101 is published as a floor ("1 million or more"), the others as ceilings ("not
 * exceeding ..."). For tool-life warnings the published figure is used as the rated life in both
 * cases, which is conservative for class 101. Every class has a published number in this source;
 * `ratedShots` stays nullable so a class without one can be added honestly.
 */

export type MoldClass = 101 | 102 | 103 | 104 | 105;

export const MOLD_CLASS_SOURCE =
  'Kaysun, "The 5 Types of SPI Mold Classifications and Standards" (kaysun.com/blog/the-types-of-spi-mold-classifications)';

export interface MoldClassLife {
  moldClass: MoldClass;
  /** Rated life in shots (cycles); null when the source gives no number for the class. */
  ratedShots: number | null;
  /** Whether the published figure is a floor ("or more") or a ceiling ("not exceeding"). */
  ratedShotsBound: 'at_least' | 'at_most';
  /** Published life in words, as the source states it. */
  lifeText: string;
  label: string;
  source: string;
}

export const moldClasses: readonly MoldClassLife[] = [
  {
    moldClass: 101,
    ratedShots: 1_000_000,
    ratedShotsBound: 'at_least',
    lifeText: '1 million cycles or more',
    label: 'Class 101: extremely high production',
    source: MOLD_CLASS_SOURCE,
  },
  {
    moldClass: 102,
    ratedShots: 1_000_000,
    ratedShotsBound: 'at_most',
    lifeText: 'not exceeding 1 million cycles',
    label: 'Class 102: medium to high production',
    source: MOLD_CLASS_SOURCE,
  },
  {
    moldClass: 103,
    ratedShots: 500_000,
    ratedShotsBound: 'at_most',
    lifeText: 'not exceeding 500,000 cycles',
    label: 'Class 103: medium production',
    source: MOLD_CLASS_SOURCE,
  },
  {
    moldClass: 104,
    ratedShots: 100_000,
    ratedShotsBound: 'at_most',
    lifeText: 'not exceeding 100,000 cycles',
    label: 'Class 104: low production',
    source: MOLD_CLASS_SOURCE,
  },
  {
    moldClass: 105,
    ratedShots: 500,
    ratedShotsBound: 'at_most',
    lifeText: 'not exceeding 500 cycles',
    label: 'Class 105: prototype only',
    source: MOLD_CLASS_SOURCE,
  },
];

export function isMoldClass(value: unknown): value is MoldClass {
  return moldClasses.some((c) => c.moldClass === value);
}

/** The class entry; throws a RangeError for a number that is not a mold class. */
export function moldClassLife(moldClass: number): MoldClassLife {
  const entry = moldClasses.find((c) => c.moldClass === moldClass);
  if (!entry) throw new RangeError(`Unknown mold class ${moldClass}: expected 101 to 105`);
  return entry;
}

/** Rated shots of a class (null when the source gives no number); throws for an unknown class. */
export function ratedShotsFor(moldClass: number): number | null {
  return moldClassLife(moldClass).ratedShots;
}
