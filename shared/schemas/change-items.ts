import Decimal from 'decimal.js';
import { z } from 'zod';
import { checkItemConsistency } from '../domain/steel-direction';

// A cut item: one change to one part of a tool. The client sends `changeItemInput`;
// the steel direction and the impact are computed from it (shared/domain/).

/** What happens to the molded part. */
export const partEffects = ['gains_plastic', 'loses_plastic', 'surface_only', 'insert_swapped'] as const;
export const partEffectSchema = z.enum(partEffects);
export type PartEffect = z.infer<typeof partEffectSchema>;

export const partEffectLabels: Record<PartEffect, string> = {
  gains_plastic: 'Part gains plastic',
  loses_plastic: 'Part loses plastic',
  surface_only: 'Surface finish only',
  insert_swapped: 'Insert swapped',
};

export const partEffectHints: Record<PartEffect, string> = {
  gains_plastic: 'The part gets bigger, thicker or gains raised detail, so steel comes out of the tool.',
  loses_plastic: 'The part gets smaller or thinner, or raised detail goes away, so steel must be added to the tool.',
  surface_only: 'Only the texture or gloss of the part changes; its shape stays.',
  insert_swapped: 'A different insert goes into the tool; the current insert is kept.',
};

/** How the toolmaker makes the change. */
export const itemMethods = ['cut', 'weld_recut', 'new_insert', 'texture', 'polish'] as const;
export const itemMethodSchema = z.enum(itemMethods);
export type ItemMethod = z.infer<typeof itemMethodSchema>;

export const itemMethodLabels: Record<ItemMethod, string> = {
  cut: 'Cut (machine or spark out steel)',
  weld_recut: 'Weld, then re-cut',
  new_insert: 'Replacement insert (old one kept)',
  texture: 'Texture',
  polish: 'Polish',
};

/** Unit of the size or depth of a change. */
export const sizeUnits = ['mm', 'in'] as const;
export const sizeUnitSchema = z.enum(sizeUnits);
export type SizeUnit = z.infer<typeof sizeUnitSchema>;

export const sizeUnitLabels: Record<SizeUnit, string> = { mm: 'millimetres (mm)', in: 'inches (in)' };

/** Things a change can do that matter for a child's safety. */
export const safetyFlags = ['small_part', 'point_or_edge', 'thin_wall'] as const;
export const safetyFlagSchema = z.enum(safetyFlags);
export type SafetyFlag = z.infer<typeof safetyFlagSchema>;

export const safetyFlagLabels: Record<SafetyFlag, string> = {
  small_part: 'May create a small part',
  point_or_edge: 'May create a point or edge',
  thin_wall: 'Changes a wall a child could break',
};

export const imageRoles = ['before', 'after'] as const;
export const imageRoleSchema = z.enum(imageRoles);
export type ImageRole = z.infer<typeof imageRoleSchema>;
export const imageRoleLabels: Record<ImageRole, string> = { before: 'Before image', after: 'After image' };

export const markShapes = ['box', 'circle'] as const;
export const markShapeSchema = z.enum(markShapes);
export type MarkShape = z.infer<typeof markShapeSchema>;
export const markShapeLabels: Record<MarkShape, string> = { box: 'Box', circle: 'Circle' };

/** Largest size or depth accepted, in the unit given (a tool is well under 10 m). */
const SIZE_PATTERN = /^(?:0|[1-9]\d{0,3})(?:\.\d{1,4})?$/;

/**
 * Size or depth as a decimal string ("0.8", "12.25"): up to 4 digits before and 4 after the point,
 * greater than zero. A string, so the value the engineer typed is kept exactly.
 */
export const sizeValueSchema = z
  .string()
  .trim()
  .regex(SIZE_PATTERN, { message: 'Enter the size as a number such as 0.8 (a point, not a comma)' })
  // zod runs this check even when the pattern failed, so only test strings that are numbers.
  .refine((s) => !SIZE_PATTERN.test(s) || new Decimal(s).greaterThan(0), { message: 'The size must be greater than zero' });

const fraction = (what: string) =>
  z
    .number({ message: `${what} must be a number` })
    .min(0, { message: `${what} must be between 0 and 1 (a fraction of the image)` })
    .max(1, { message: `${what} must be between 0 and 1 (a fraction of the image)` });

/**
 * A mark on the before or after image: x, y is the top-left corner and w, h the size, all as
 * fractions (0..1) of the image's width and height, so the mark fits any displayed size.
 * A circle is the ellipse inscribed in that box.
 */
export const regionMarkSchema = z
  .object({
    imageRole: imageRoleSchema,
    shape: markShapeSchema,
    x: fraction('x'),
    y: fraction('y'),
    w: fraction('Width').refine((v) => v > 0, { message: 'Width must be greater than zero' }),
    h: fraction('Height').refine((v) => v > 0, { message: 'Height must be greater than zero' }),
  })
  .superRefine((r, ctx) => {
    // 1e-9 lets a mark that touches the edge pass despite binary rounding of screen fractions.
    if (r.x + r.w > 1 + 1e-9) ctx.addIssue({ code: 'custom', path: ['w'], message: 'The mark runs past the right edge of the image' });
    if (r.y + r.h > 1 + 1e-9) ctx.addIssue({ code: 'custom', path: ['h'], message: 'The mark runs past the bottom edge of the image' });
  });
export type RegionMark = z.infer<typeof regionMarkSchema>;

/** The fields of a cut item, without the effect/method cross-check (for pick/partial). */
export const changeItemFields = z.object({
  partId: z.uuid({ message: 'Pick the part this change affects' }),
  effect: partEffectSchema,
  method: itemMethodSchema,
  size: sizeValueSchema,
  unit: sizeUnitSchema,
  note: z.string().trim().max(2000, { message: 'Keep the note under 2000 characters' }).default(''),
  safetyFlags: z
    .array(safetyFlagSchema)
    .default([])
    .refine((flags) => new Set(flags).size === flags.length, { message: 'Each safety flag can be ticked once' }),
  region: regionMarkSchema.optional(),
});

/**
 * What a client sends for one cut item. Also refuses an effect and method that contradict each other
 * (the message is the one `checkItemConsistency` gives, on the `method` field).
 */
export const changeItemInput = changeItemFields.superRefine((item, ctx) => {
  const problem = checkItemConsistency(item);
  if (problem) ctx.addIssue({ code: 'custom', path: ['method'], message: problem });
});
export type ChangeItemInput = z.infer<typeof changeItemInput>;
export type ChangeItemInputRaw = z.input<typeof changeItemInput>;

/** A stored cut item as the API returns it. */
export const changeItemSchema = changeItemFields.extend({
  id: z.uuid(),
  requestId: z.uuid(),
  position: z.number().int().min(0),
});
export type ChangeItem = z.infer<typeof changeItemSchema>;

/** A size converted to millimetres (1 in = 25.4 mm exactly), as a decimal string. */
export function sizeInMillimetres(size: string, unit: SizeUnit): string {
  const v = new Decimal(size);
  return (unit === 'in' ? v.times('25.4') : v).toString();
}
