import { Dec, assertInteger, formatCount, toDec, type DecimalInput } from './decimal';

/**
 * Shots a production run needs, against the shots the tool has left.
 *
 * shots needed = ceil(units x parts per unit / cavities per shot x (1 + scrap rate))
 * (DESIGN section 5, "Tool life"), computed exactly with decimal.js and rounded UP to a whole shot.
 * The remaining shots come from the tool-life module (rated shots of the mold class - shot count).
 */

export interface ShotsNeededInput {
  /** Finished product units planned. */
  units: number;
  /** How many of this part one product unit uses (a figure with two identical arms: 2). */
  partsPerUnit: number;
  /** How many of this part one shot makes (cavities for this part in the tool). */
  cavitiesPerShot: number;
  /** Expected scrap as a fraction of good parts ("0.03" = 3 %); 0 when none. */
  scrapRate?: DecimalInput;
}

export const SHOTS_NEEDED_RULE =
  'Shots needed = units x parts per unit / cavities per shot x (1 + scrap rate), rounded up to a whole shot.';

/** Whole shots needed for the run. */
export function shotsNeeded(input: ShotsNeededInput): number {
  assertInteger(input.units, 'units', { min: 0 });
  assertInteger(input.partsPerUnit, 'partsPerUnit', { min: 1 });
  assertInteger(input.cavitiesPerShot, 'cavitiesPerShot', { min: 1 });
  const scrap = toDec(input.scrapRate ?? 0, 'scrapRate');
  if (scrap.isNegative() || scrap.gte(1)) throw new RangeError('scrapRate must be a fraction from 0 up to (not including) 1');
  const shots = new Dec(input.units)
    .times(input.partsPerUnit)
    .div(input.cavitiesPerShot)
    .times(new Dec(1).plus(scrap))
    .ceil();
  const n = shots.toNumber();
  if (!Number.isSafeInteger(n)) throw new RangeError('the run is too large to count');
  return n;
}

export interface RunPlanInput extends ShotsNeededInput {
  /** Shots left in the tool's rated life; may be negative when the tool is already past it. */
  remainingShots: number;
}

export interface RunPlan {
  shotsNeeded: number;
  remainingShots: number;
  /** True when the run fits in the remaining rated life. */
  enough: boolean;
  /** Shots beyond the rated life the run would take (0 when it fits). */
  shortfall: number;
  /** A warning in words when the run does not fit; null when it does. */
  warning: string | null;
  /** One sentence describing the plan either way. */
  summary: string;
  rule: string;
}

/** Compare a planned run with the tool's remaining rated life. */
export function planRun(input: RunPlanInput): RunPlan {
  assertInteger(input.remainingShots, 'remainingShots');
  const needed = shotsNeeded(input);
  const remaining = input.remainingShots;
  const enough = needed <= remaining;
  const shortfall = enough ? 0 : needed - remaining;
  const neededText = `${formatCount(needed)} ${needed === 1 ? 'shot' : 'shots'}`;
  let warning: string | null = null;
  let summary: string;
  if (enough) {
    summary = `The run needs ${neededText}; the tool has ${formatCount(remaining)} left of its rated life, ${formatCount(remaining - needed)} to spare.`;
  } else if (remaining <= 0) {
    warning = `The tool is already ${remaining === 0 ? 'at' : `${formatCount(-remaining)} shots past`} its rated life; this run of ${neededText} takes it ${formatCount(shortfall)} shots beyond. Inspect the tool and plan a refurbishment or a replacement before the run.`;
    summary = warning;
  } else {
    warning = `The run needs ${neededText} but the tool has ${formatCount(remaining)} left of its rated life: ${formatCount(shortfall)} short. Plan a refurbishment, a second tool, or a smaller run.`;
    summary = warning;
  }
  return { shotsNeeded: needed, remainingShots: remaining, enough, shortfall, warning, summary, rule: SHOTS_NEEDED_RULE };
}
