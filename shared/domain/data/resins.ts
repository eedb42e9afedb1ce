/**
 * Mold shrinkage ranges of common toy resins, as fractions (mm/mm = in/in; x 100 for %),
 * each from ONE named published source (TRADE-FACTS 3.2). Generic charts differ by up to 2x for
 * the same resin; a grade's own datasheet beats every row here. Values are the linear shrinkage
 * in the flow direction unless the note says otherwise; across flow is usually smaller.
 */

export interface ResinShrinkage {
  id: string;
  name: string;
  /** Lower end of the published range, fraction as a decimal string ("0.004" = 0.4 %). */
  shrinkMin: string;
  /** Upper end of the published range, fraction as a decimal string. */
  shrinkMax: string;
  /** Where the range comes from. */
  source: string;
  /** Other published values for the same resin, for the engineer's judgement. */
  alsoReported: string[];
  note?: string;
}

const STELRAY =
  'Stelray Plastic Products, "Shrinkage values" (stelray.com/shrinkage_value.htm), citing the Injection Molding Reference Guide, 3rd ed., J. Carender / Advanced Process Engineering';

export const resins: readonly ResinShrinkage[] = [
  {
    id: 'abs',
    name: 'ABS',
    shrinkMin: '0.004',
    shrinkMax: '0.007',
    source: STELRAY,
    alsoReported: ['Misumi Tech Central #004: 0.4-0.9 %', 'leagueslider.com: 0.4-0.7 %'],
    note: 'High impact 0.005-0.007; heat resistant 0.004-0.005; medium impact 0.005 (same source).',
  },
  {
    id: 'hips',
    name: 'HIPS (high-impact polystyrene)',
    shrinkMin: '0.002',
    shrinkMax: '0.008',
    source: 'CJP HIPS information sheet (docslib.org/doc/5860600): 0.2-0.8 %',
    alsoReported: ['plasticservice.com "Polystyrene High Impact": 0.003-0.006', 'techni-mold.com: 0.0035'],
  },
  {
    id: 'ps',
    name: 'PS (general purpose polystyrene)',
    shrinkMin: '0.004',
    shrinkMax: '0.007',
    source: 'Misumi Tech Central, "#004 Guide to the Molding Shrinkage ratio": 0.4-0.7 %',
    alsoReported: [],
  },
  {
    id: 'pp',
    name: 'PP (polypropylene)',
    shrinkMin: '0.010',
    shrinkMax: '0.030',
    source: STELRAY,
    alsoReported: ['Misumi Tech Central #004: 1.0-2.5 %', 'techni-mold.com: 0.015-0.018', 'aoneplastics: 1.5-2.0 %'],
    note: 'Crystalline: shrinks noticeably less across flow.',
  },
  {
    id: 'hdpe',
    name: 'HDPE',
    shrinkMin: '0.015',
    shrinkMax: '0.030',
    source: STELRAY,
    alsoReported: ['leagueslider.com: 1.5-3.0 %', '"Shrinkage of Plastic Material" table (scribd): 2-3 %'],
  },
  {
    id: 'ldpe',
    name: 'LDPE',
    shrinkMin: '0.015',
    shrinkMax: '0.035',
    source: STELRAY,
    alsoReported: ['"Shrinkage of Plastic Material" table (scribd): 1.5-3 %', 'leagueslider.com: 1.5-5.0 %'],
  },
  {
    id: 'pvc_flexible',
    name: 'PVC, flexible',
    shrinkMin: '0.015',
    shrinkMax: '0.030',
    source: STELRAY,
    alsoReported: ['"Shrinkage of Plastic Material" table (scribd), "PVC soft": 1-3 %'],
  },
  {
    id: 'pvc_semi_rigid',
    name: 'PVC, semi-rigid',
    shrinkMin: '0.005',
    shrinkMax: '0.025',
    source: STELRAY,
    alsoReported: [],
  },
  {
    id: 'pvc_rigid',
    name: 'PVC, rigid',
    shrinkMin: '0.002',
    shrinkMax: '0.004',
    source: STELRAY,
    alsoReported: ['"Shrinkage of Plastic Material" table (scribd): 0.5-0.7 %', 'techni-mold.com: 0.0035'],
  },
  {
    id: 'pc',
    name: 'PC (polycarbonate)',
    shrinkMin: '0.005',
    shrinkMax: '0.007',
    source:
      'SABIC LEXAN 123R / 141R / 143R technical datasheets: mold shrinkage 0.5-0.7 %, flow, 3.2 mm, SABIC method',
    alsoReported: [
      `${STELRAY}: 0.005-0.007`,
      'UL Prospector generic PC (ASTM D955): flow 0.0050-0.0079, across flow 0.0057-0.0072',
    ],
  },
  {
    id: 'pom',
    name: 'POM (acetal)',
    shrinkMin: '0.020',
    shrinkMax: '0.035',
    source: STELRAY,
    alsoReported: ['Autodesk Moldflow Advisor help: 0.02-0.035 mm/mm', 'techni-mold.com: 0.020; homopolymer 0.018-0.020'],
  },
  {
    id: 'pa6',
    name: 'PA6 (nylon 6), unfilled',
    shrinkMin: '0.010',
    shrinkMax: '0.015',
    source: '"Shrinkage of Plastic Material" table (scribd): 1-1.5 % unfilled',
    alsoReported: ['tfpmaterial.com PA6 page: about 0.3 % with glass fibre'],
    note: 'Glass-filled grades shrink far less; use the grade datasheet.',
  },
  {
    id: 'pa66',
    name: 'PA66 (nylon 6/6)',
    shrinkMin: '0.010',
    shrinkMax: '0.025',
    source: STELRAY,
    alsoReported: ['"Shrinkage of Plastic Material" table (scribd): 1-2 %', 'techni-mold.com: 0.020'],
  },
  {
    id: 'tpe_sebs',
    name: 'TPE / TPR (SEBS)',
    shrinkMin: '0.013',
    shrinkMax: '0.025',
    source: 'GLS / Dynaflex processing text, quoted on eng-tips.com ("santoprene post mold shrinking"): 1.3-2.5 %',
    alsoReported: ['moldinghub.com TPE page: 1-2 %'],
    note: 'Softer grades (below 30 Shore A) shrink more; filled grades less.',
  },
  {
    id: 'tpe_sbs',
    name: 'TPE (SBS)',
    shrinkMin: '0.003',
    shrinkMax: '0.005',
    source: 'GLS / Dynaflex processing text, quoted on eng-tips.com ("santoprene post mold shrinking"): 0.3-0.5 %',
    alsoReported: [],
  },
  {
    id: 'tpv',
    name: 'TPV (vulcanised EPDM/PP)',
    shrinkMin: '0.014',
    shrinkMax: '0.018',
    source: 'techni-mold.com resin mold shrink rate chart',
    alsoReported: [],
  },
  {
    id: 'tpu',
    name: 'TPU',
    shrinkMin: '0.007',
    shrinkMax: '0.010',
    source: 'techni-mold.com resin mold shrink rate chart',
    alsoReported: [],
  },
];

/** The resin with this id, or undefined. */
export function findResin(id: string): ResinShrinkage | undefined {
  return resins.find((r) => r.id === id);
}
