import { Dec, assertInteger, formatCount } from './decimal';
import { moldClassLife } from './data/mold-classes';

/**
 * Tool life: how much of a tool's rated life its shots have used.
 *
 * The rated shots are data stored on each tool with their source (a mold class from the
 * published SPI / PLASTICS classes 101-105, see shared/domain/data/mold-classes.ts, or the mold
 * maker's own figure). Nothing here assumes a particular figure.
 *
 * - remaining shots = rated shots - shot count (DESIGN.md section 5), never below zero; the shots
 *   run beyond the rating are reported separately as `overShots`;
 * - percent used = shot count / rated shots x 100, exact decimal arithmetic, rounded half-up to one
 *   decimal place (it may exceed 100);
 * - band: `spent` from 100 % used, `worn` from 80 % used, otherwise `fresh`. The 80 % warning line
 *   is this product's rule (the tool registry brief), not a published figure. Bands are decided on
 *   the exact ratio, never on the rounded percentage: 79.96 % shows as "80.0" but stays `fresh`.
 */

export type LifeBand = 'fresh' | 'worn' | 'spent';

/** Percent of rated life from which a tool is `worn` (product rule, no published source). */
export const WORN_FROM_PERCENT = 80;

export interface ToolLifeInput {
  ratedShots: number;
  shotCount: number;
}

export interface ToolLife {
  ratedShots: number;
  shotCount: number;
  remainingShots: number;
  /** Shots run beyond the rated life (0 while within it). */
  overShots: number;
  /** Decimal string with one decimal place, e.g. "82.4". */
  percentUsed: string;
  band: LifeBand;
  /** One plain sentence for screens and e-mails. */
  sentence: string;
}

/** The band for a shot count against a rating, on the exact ratio (integer arithmetic). */
export function lifeBandOf(ratedShots: number, shotCount: number): LifeBand {
  assertInteger(ratedShots, 'ratedShots', { min: 1 });
  assertInteger(shotCount, 'shotCount', { min: 0 });
  const rated = BigInt(ratedShots);
  const shots = BigInt(shotCount);
  if (shots >= rated) return 'spent';
  if (shots * 100n >= rated * BigInt(WORN_FROM_PERCENT)) return 'worn';
  return 'fresh';
}

export function toolLife({ ratedShots, shotCount }: ToolLifeInput): ToolLife {
  const band = lifeBandOf(ratedShots, shotCount);
  const remainingShots = Math.max(0, ratedShots - shotCount);
  const overShots = Math.max(0, shotCount - ratedShots);
  const percentUsed = new Dec(shotCount).div(ratedShots).times(100).toFixed(1, Dec.ROUND_HALF_UP);
  const used = formatCount(shotCount);
  const rated = formatCount(ratedShots);
  let sentence: string;
  if (band === 'spent') {
    sentence =
      overShots === 0
        ? `${used} of ${rated} rated shots used (${percentUsed} %): the tool has reached its rated life. Inspect it before the next run.`
        : `${used} shots run against ${rated} rated (${percentUsed} %): ${formatCount(overShots)} past its rated life. Inspect the tool before the next run.`;
  } else if (band === 'worn') {
    sentence = `${used} of ${rated} rated shots used (${percentUsed} %); ${formatCount(remainingShots)} left. Past ${WORN_FROM_PERCENT} % of rated life: plan refurbishment or a replacement before long runs.`;
  } else {
    sentence = `${used} of ${rated} rated shots used (${percentUsed} %); ${formatCount(remainingShots)} left.`;
  }
  return { ratedShots, shotCount, remainingShots, overShots, percentUsed, band, sentence };
}

/**
 * The default rated life for a mold class, with its source in words, or null when the class has
 * no published figure (then the person must enter the mold maker's figure).
 */
export function ratedLifeFromClass(moldClass: number): { ratedShots: number; source: string } | null {
  const c = moldClassLife(moldClass);
  if (c.ratedShots === null) return null;
  const floor = c.ratedShotsBound === 'at_least' ? '; the published floor is used as the rated life' : '';
  return { ratedShots: c.ratedShots, source: `${c.label}, ${c.lifeText}${floor}. Source: ${c.source}` };
}
