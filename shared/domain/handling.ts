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

/** The caution shown wherever moving a tool is planned (wording from TRADE-FACTS section 8). */
export const LIFTING_CAUTION =
  'Lifting and moving molds is governed by local law and site procedures (e.g., OSHA 29 CFR 1910.179/.184/.178 and ASME B30 in the US). Weights shown here are estimates. Use rated equipment, qualified riggers and the mold maker\'s lifting instructions.';

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
