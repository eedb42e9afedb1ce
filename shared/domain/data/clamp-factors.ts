/**
 * Clamp-force factors (clamp force per unit of projected area) by resin, each with its named
 * source (TRADE-FACTS 2.2). They are rules of thumb: sources disagree by about 2x for the same
 * resin, and wall thickness and flow length dominate (a 4 in^2 part with a 0.006 in wall flashed
 * a 25-ton press although the rule said 8-20 tons: plasticdesign.com, PDI). Treat the factor as
 * an input the engineer chooses, never as a physical constant.
 *
 * Units are explicit: "ton" alone is ambiguous (US short ton of 2,000 lbf vs metric tonne-force).
 */

export type ClampFactorUnit =
  | 'short_tons_per_in2'
  | 'tonnes_force_per_cm2'
  | 'kn_per_cm2'
  | 'psi'
  | 'bar';

export const CLAMP_FACTOR_UNIT_LABELS: Record<ClampFactorUnit, string> = {
  short_tons_per_in2: 'short tons/in²',
  tonnes_force_per_cm2: 'tonnes-force/cm²',
  kn_per_cm2: 'kN/cm²',
  psi: 'psi (cavity pressure)',
  bar: 'bar (cavity pressure)',
};

export interface ClampFactor {
  id: string;
  /** Resin ids as in data/resins.ts where the resin is listed there; others are named in resinLabel. */
  resinIds: string[];
  resinLabel: string;
  min: string;
  max: string;
  unit: ClampFactorUnit;
  source: string;
  note?: string;
}

const JI_HORNG =
  'Ji-Horng, "Plastic injection molding: common plastic molding pressure" (ji-horng.com), per-resin table in "Ton/cm²"';
const JI_HORNG_NOTE = 'The page writes "Ton/cm²"; read here as metric tonnes-force (TRADE-FACTS 2.2).';
const HOME_CALC = 'home-calculator.org, injection machine tonnage page';
const TOOLCROZE = 'toolcroze.com clamp tonnage calculator, cavity pressure table';

function jiHorng(id: string, resinIds: string[], resinLabel: string, min: string, max: string): ClampFactor {
  return { id: `ji_horng_${id}`, resinIds, resinLabel, min, max, unit: 'tonnes_force_per_cm2', source: JI_HORNG, note: JI_HORNG_NOTE };
}

export const clampFactors: readonly ClampFactor[] = [
  jiHorng('abs', ['abs'], 'ABS', '0.30', '0.40'),
  jiHorng('san', [], 'AS / SAN', '0.30', '0.40'),
  jiHorng('eva', [], 'EVA', '0.25', '0.35'),
  jiHorng('hdpe', ['hdpe'], 'HDPE', '0.30', '0.40'),
  jiHorng('ldpe', ['ldpe'], 'LDPE', '0.25', '0.35'),
  jiHorng('pa6', ['pa6'], 'PA6', '0.35', '0.45'),
  jiHorng('pa66', ['pa66'], 'PA66', '0.40', '0.50'),
  jiHorng('pbt', [], 'PBT', '0.35', '0.40'),
  jiHorng('pc', ['pc'], 'PC', '0.40', '0.50'),
  jiHorng('pmma', [], 'PMMA', '0.35', '0.50'),
  jiHorng('pom', ['pom'], 'POM', '0.35', '0.45'),
  jiHorng('pp', ['pp'], 'PP', '0.25', '0.35'),
  jiHorng('pps', [], 'PPS', '0.25', '0.35'),
  jiHorng('pvc_soft', ['pvc_flexible'], 'PVC, soft', '0.25', '0.35'),
  jiHorng('pvc_rigid', ['pvc_rigid'], 'PVC, rigid', '0.30', '0.40'),
  jiHorng('ps', ['ps', 'hips'], 'PS (also HIPS unless a grade sheet says otherwise)', '0.25', '0.35'),
  jiHorng('tpu', ['tpu'], 'TPU', '0.50', '0.50'),
  {
    id: 'home_calc_pp_pe',
    resinIds: ['pp', 'hdpe', 'ldpe'],
    resinLabel: 'PP / PE',
    min: '2',
    max: '3',
    unit: 'short_tons_per_in2',
    source: HOME_CALC,
  },
  {
    id: 'home_calc_abs_ps',
    resinIds: ['abs', 'ps', 'hips'],
    resinLabel: 'ABS / PS',
    min: '3',
    max: '5',
    unit: 'short_tons_per_in2',
    source: HOME_CALC,
  },
  {
    id: 'home_calc_pc_nylon',
    resinIds: ['pc', 'pa6', 'pa66'],
    resinLabel: 'PC / nylon',
    min: '5',
    max: '8',
    unit: 'short_tons_per_in2',
    source: HOME_CALC,
  },
  {
    id: 'toolcroze_commodity',
    resinIds: ['pp', 'hdpe', 'ldpe', 'ps', 'hips'],
    resinLabel: 'PP, PE, PS',
    min: '3000',
    max: '5000',
    unit: 'psi',
    source: TOOLCROZE,
  },
  {
    id: 'toolcroze_engineering',
    resinIds: ['abs', 'pa6', 'pa66', 'pom'],
    resinLabel: 'ABS, nylon, acetal',
    min: '5000',
    max: '7000',
    unit: 'psi',
    source: TOOLCROZE,
  },
  {
    id: 'toolcroze_hard_flowing',
    resinIds: ['pc'],
    resinLabel: 'PC, glass-filled, long flow',
    min: '7000',
    max: '9000',
    unit: 'psi',
    source: TOOLCROZE,
  },
  {
    id: 'moldinghub_tpe',
    resinIds: ['tpe_sebs', 'tpe_sbs', 'tpv'],
    resinLabel: 'TPE',
    min: '3.86',
    max: '5.41',
    unit: 'kn_per_cm2',
    source: 'moldinghub.com resin data, TPE',
  },
  {
    id: 'pdi_general',
    resinIds: [],
    resinLabel: 'Any resin (general rule)',
    min: '2',
    max: '5',
    unit: 'short_tons_per_in2',
    source: 'plasticdesign.com (Plastic Design International, J. Tuczapski), "Clamp tonnage"',
  },
  {
    id: 'austekco_average',
    resinIds: [],
    resinLabel: 'Average mold',
    min: '4.5',
    max: '4.5',
    unit: 'kn_per_cm2',
    source: 'austekco.com.au, "Calculate clamping force" (6,000 psi average cavity pressure)',
  },
];

/** The factors published for a resin (by resin id), from every source that lists it. */
export function clampFactorsForResin(resinId: string): ClampFactor[] {
  return clampFactors.filter((f) => f.resinIds.includes(resinId));
}

/** The factor with this id, or undefined. */
export function findClampFactor(id: string): ClampFactor | undefined {
  return clampFactors.find((f) => f.id === id);
}
