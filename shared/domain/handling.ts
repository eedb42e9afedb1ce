import Decimal from 'decimal.js';
import { groupDigits } from './decimal';
import { LB_KG } from './safety';

/**
 * Handling cautions for moving a tool (DESIGN.md section 6; TRADE-FACTS section 8). These are
 * cautions, not instructions: lifting is governed by local law, site procedures and licensed
 * practice.
 *
 * A tool counts as heavy from 50 kg: a mold-design rule asks for lifting holes on plates over
 * 50 kg (firstratemold.com design rule, TRADE-FACTS section 8). A tool with no recorded weight is
 * treated as heavy until it is weighed.
 */

export const HEAVY_TOOL_KG = 50;

/**
 * The caution shown wherever moving a tool is planned (wording from TRADE-FACTS section 8: OSHA 29
 * CFR 1910.179 cranes, 1910.184 slings, 1910.178 powered trucks; ASME B30). The one lifting
 * caution of the product: riggingCaution below ends with it.
 */
export const LIFTING_CAUTION =
  'Lifting and moving molds is governed by local law, site procedures and local codes (e.g., OSHA 29 CFR 1910.179/.184/.178 and ASME B30 in the US). Weights shown here are estimates. The lift must be planned and made by qualified riggers and trained operators with rated equipment, following the mold maker\'s lifting instructions.';

export interface HandlingInfo {
  weightKg: number | null;
  weightKnown: boolean;
  /** Show the rigging caution prominently. */
  heavy: boolean;
  /** One short line for the tool: weight and what to do. */
  summary: string;
  caution: string;
}

export function handlingFor(weightKg: number | null): HandlingInfo {
  if (weightKg === null || !Number.isFinite(weightKg) || weightKg <= 0) {
    return {
      weightKg: null,
      weightKnown: false,
      heavy: true,
      summary: 'Weight not recorded: weigh the tool or get the mold maker\'s figure before lifting.',
      caution: LIFTING_CAUTION,
    };
  }
  const heavy = weightKg >= HEAVY_TOOL_KG;
  return {
    weightKg,
    weightKnown: true,
    heavy,
    summary: heavy
      ? `About ${weightKg} kg: lift only with rated equipment and qualified riggers, using the tool's eyebolt holes.`
      : `About ${weightKg} kg.`,
    caution: LIFTING_CAUTION,
  };
}

export interface RiggingCaution {
  title: string;
  /** The weight as shown, e.g. "850 kg (about 1,874 lb, estimate)", or a request to weigh it. */
  weightText: string;
  /** Whole pounds, null when the weight is not known. */
  weightLb: number | null;
  sentences: string[];
  /** The sentences joined, for an e-mail or a notice. */
  text: string;
}

/**
 * The caution shown before a tool is moved or lifted (TRADE-FACTS section 8). It defers to
 * qualified riggers and local codes; it is not a lifting instruction.
 */
export function riggingCaution(weightKg: number | null | undefined): RiggingCaution {
  const known = typeof weightKg === 'number' && Number.isFinite(weightKg) && weightKg > 0;
  const weightLb = known ? new Decimal(weightKg).div(LB_KG).toDecimalPlaces(0).toNumber() : null;
  const weightText = known
    ? `${groupDigits(new Decimal(weightKg).toDecimalPlaces(0).toString())} kg (about ${groupDigits(String(weightLb))} lb); confirm by weighing or from the mold maker's data`
    : 'Weight not recorded: weigh the tool or get the figure from the mold maker before it is lifted';
  const sentences = [
    known ? `This tool weighs ${weightText}.` : `${weightText}.`,
    'Know the weight within about 10 percent before the lift, and use cranes, hoists, slings and forklifts rated for it, with the rated load marked (OSHA 29 CFR 1910.179, 1910.184, 1910.178 in the US).',
    'Lift the mold closed, with a strap or latch across the parting line so the halves cannot separate, from the eyebolt holes the mold maker provided (common practice, no published source); only shoulder eyebolts may take an angled pull, and then at reduced capacity (ASME B30.26).',
    'Keep people out from under the load and move it slowly, without sudden starts or stops.',
    LIFTING_CAUTION,
  ];
  return { title: 'Heavy load: rigging caution', weightText, weightLb, sentences, text: sentences.join(' ') };
}
