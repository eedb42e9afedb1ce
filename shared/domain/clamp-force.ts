import { Dec, toDec, type DecimalInput } from './decimal';
import { CLAMP_FACTOR_UNIT_LABELS, type ClampFactorUnit } from './data/clamp-factors';

/**
 * Clamp force a mold needs: projected area x factor x safety factor
 * (plasticdesign.com PDI "Clamp tonnage"; aPriori cost-model guide; Ji-Horng F = S x p x K).
 *
 * Unit factors are exact definitions:
 *   1 lbf = 4.4482216152605 N (0.45359237 kg x 9.80665 m/s²)
 *   1 short ton-force (US) = 2,000 lbf = 8,896.443230521 N
 *   1 tonne-force (metric) = 1,000 kgf = 9,806.65 N
 *   1 in = 2.54 cm, so 1 in² = 6.4516 cm²
 * The arithmetic multiplies every numerator before dividing, so a calculation done in one unit
 * system (in² x short tons/in²) comes back exact. Forces are reported rounded half-up to 0.01.
 */

export const NEWTONS_PER_LBF = '4.4482216152605';
export const LBF_PER_SHORT_TON = '2000';
export const NEWTONS_PER_TONNE_FORCE = '9806.65';
export const CM2_PER_IN2 = '6.4516';
export const FORCE_DECIMALS = 2;

export type AreaUnit = 'cm2' | 'in2';
export type ForceUnit = 'short_tons' | 'tonnes_force' | 'kn';

export const AREA_UNIT_LABELS: Record<AreaUnit, string> = { cm2: 'cm²', in2: 'in²' };
export const FORCE_UNIT_LABELS: Record<ForceUnit, string> = {
  short_tons: 'short tons',
  tonnes_force: 'tonnes-force',
  kn: 'kN',
};

export const CLAMP_FORCE_CAUTION =
  'Clamp factors are rules of thumb that differ about 2x between sources; thin walls and long flow need more. Confirm with the molder and a fill analysis before committing a press.';

/** Newtons in one unit of force. */
export function newtonsPer(unit: ForceUnit): Dec {
  switch (unit) {
    case 'short_tons':
      return new Dec(NEWTONS_PER_LBF).times(LBF_PER_SHORT_TON);
    case 'tonnes_force':
      return new Dec(NEWTONS_PER_TONNE_FORCE);
    case 'kn':
      return new Dec(1000);
  }
}

/** Convert a force between units, exactly (no rounding). */
export function convertForce(value: DecimalInput, from: ForceUnit, to: ForceUnit): Dec {
  return toDec(value, 'force').times(newtonsPer(from)).div(newtonsPer(to));
}

/** A pressure (force per area) unit as newtons over square centimetres: [numerator, denominator]. */
function pressureAsNewtonsPerCm2(unit: ClampFactorUnit): [Dec, Dec] {
  switch (unit) {
    case 'short_tons_per_in2':
      return [newtonsPer('short_tons'), new Dec(CM2_PER_IN2)];
    case 'psi':
      return [new Dec(NEWTONS_PER_LBF), new Dec(CM2_PER_IN2)];
    case 'tonnes_force_per_cm2':
      return [new Dec(NEWTONS_PER_TONNE_FORCE), new Dec(1)];
    case 'kn_per_cm2':
      return [new Dec(1000), new Dec(1)];
    case 'bar':
      // 1 bar = 100,000 Pa = 100,000 N/m² = 10 N/cm²
      return [new Dec(10), new Dec(1)];
  }
}

/** Convert a clamp factor (pressure) between units, exactly. 1 short ton/in² = 1.378951... kN/cm². */
export function convertClampFactor(value: DecimalInput, from: ClampFactorUnit, to: ClampFactorUnit): Dec {
  const [fn, fd] = pressureAsNewtonsPerCm2(from);
  const [tn, td] = pressureAsNewtonsPerCm2(to);
  return toDec(value, 'factor').times(fn).times(td).div(fd.times(tn));
}

export interface ProjectedAreaInput {
  /** Projected area of one part on the parting plane (the larger of the A and B side views). */
  partArea: DecimalInput;
  cavities: number;
  /** Runner area on the parting plane (two-plate molds); 0 for hot runners. */
  runnerArea?: DecimalInput;
}

/** Total projected area = part area x cavities + runner area (aPriori cost-model guide), same unit as the input. */
export function projectedArea(input: ProjectedAreaInput): Dec {
  if (!Number.isSafeInteger(input.cavities) || input.cavities < 1) throw new RangeError('cavities must be a whole number of 1 or more');
  const part = toDec(input.partArea, 'partArea');
  const runner = toDec(input.runnerArea ?? 0, 'runnerArea');
  if (part.lte(0)) throw new RangeError('partArea must be above zero');
  if (runner.isNegative()) throw new RangeError('runnerArea must not be negative');
  return part.times(input.cavities).plus(runner);
}

export interface PressRating {
  tonnage: DecimalInput;
  unit: ForceUnit;
}

export interface ClampForceInput {
  projectedArea: DecimalInput;
  areaUnit: AreaUnit;
  factor: DecimalInput;
  factorUnit: ClampFactorUnit;
  /** Multiplier for margin, 1 or more ("1.15" = 15 % margin). Default 1: no margin. */
  safetyFactor?: DecimalInput;
  /** The press's nameplate clamp force, with its unit; null or omitted when not known. */
  press?: PressRating | null;
}

export interface ClampForceCheck {
  /** Required force, rounded half-up to 0.01, in each unit. */
  requiredShortTons: string;
  requiredTonnesForce: string;
  requiredKilonewtons: string;
  /** Press rating in the same three units, when known. */
  press: { shortTons: string; tonnesForce: string; kilonewtons: string } | null;
  /** True when the press rating is at least the required force (compared exactly); null when no press is given. */
  pressOk: boolean | null;
  sentence: string;
  caution: string;
}

/** Required clamp force, in short tons, tonnes-force and kN, checked against the press if known. */
export function checkClampForce(input: ClampForceInput): ClampForceCheck {
  const area = toDec(input.projectedArea, 'projectedArea');
  if (area.lte(0)) throw new RangeError('projectedArea must be above zero');
  const factor = toDec(input.factor, 'factor');
  if (factor.lte(0)) throw new RangeError('factor must be above zero');
  const safety = toDec(input.safetyFactor ?? 1, 'safetyFactor');
  if (safety.lt(1)) throw new RangeError('safetyFactor must be 1 or more');

  const areaToCm2 = input.areaUnit === 'in2' ? new Dec(CM2_PER_IN2) : new Dec(1);
  const [pn, pd] = pressureAsNewtonsPerCm2(input.factorUnit);
  const newtons = area.times(areaToCm2).times(factor).times(pn).times(safety).div(pd);

  const inUnit = (n: Dec, unit: ForceUnit) => n.div(newtonsPer(unit)).toFixed(FORCE_DECIMALS, Dec.ROUND_HALF_UP);
  const required = {
    shortTons: inUnit(newtons, 'short_tons'),
    tonnesForce: inUnit(newtons, 'tonnes_force'),
    kilonewtons: inUnit(newtons, 'kn'),
  };

  let press: ClampForceCheck['press'] = null;
  let pressOk: boolean | null = null;
  const basis = `${area.toString()} ${AREA_UNIT_LABELS[input.areaUnit]} x ${factor.toString()} ${CLAMP_FACTOR_UNIT_LABELS[input.factorUnit]} x safety ${safety.toString()}`;
  let sentence = `Needs ${required.shortTons} short tons (${required.tonnesForce} tonnes-force, ${required.kilonewtons} kN) from ${basis}.`;

  if (input.press) {
    const rating = toDec(input.press.tonnage, 'press.tonnage');
    if (rating.lte(0)) throw new RangeError('press.tonnage must be above zero');
    const pressNewtons = rating.times(newtonsPer(input.press.unit));
    press = {
      shortTons: inUnit(pressNewtons, 'short_tons'),
      tonnesForce: inUnit(pressNewtons, 'tonnes_force'),
      kilonewtons: inUnit(pressNewtons, 'kn'),
    };
    pressOk = pressNewtons.gte(newtons);
    const pressText = `${rating.toString()} ${FORCE_UNIT_LABELS[input.press.unit]}`;
    const gap = inUnit(newtons.minus(pressNewtons).abs(), input.press.unit);
    sentence += pressOk
      ? ` The press (${pressText}) is enough, with ${gap} ${FORCE_UNIT_LABELS[input.press.unit]} to spare.`
      : ` The press (${pressText}) is too small by ${gap} ${FORCE_UNIT_LABELS[input.press.unit]}.`;
  } else {
    sentence += ' Press rating not known: compare with the nameplate, and check whether it is in short tons or metric tonnes.';
  }

  return {
    requiredShortTons: required.shortTons,
    requiredTonnesForce: required.tonnesForce,
    requiredKilonewtons: required.kilonewtons,
    press,
    pressOk,
    sentence,
    caution: CLAMP_FORCE_CAUTION,
  };
}
