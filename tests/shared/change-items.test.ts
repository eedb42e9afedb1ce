import Decimal from 'decimal.js';
import { z } from 'zod';
import {
  changeItemInput,
  imageRoleLabels,
  imageRoles,
  itemMethodLabels,
  itemMethods,
  markShapeLabels,
  markShapes,
  partEffectHints,
  partEffectLabels,
  partEffects,
  regionMarkSchema,
  safetyFlagLabels,
  safetyFlags,
  sizeInMillimetres,
  sizeUnitLabels,
  sizeUnits,
  sizeValueSchema,
} from '../../shared/schemas/change-items';

const partId = '3f6c2a1e-8b4d-4c2a-9e1f-5a7b9c0d1e2f';
const valid = {
  partId,
  effect: 'gains_plastic',
  method: 'cut',
  size: '0.8',
  unit: 'mm',
  note: 'Raised visor ridge across the brow',
  safetyFlags: ['point_or_edge'],
  region: { imageRole: 'after', shape: 'box', x: 0.2, y: 0.1, w: 0.5, h: 0.3 },
};

const fieldErrorsOf = (input: unknown) => {
  const r = changeItemInput.safeParse(input);
  return r.success ? null : z.flattenError(r.error).fieldErrors;
};

describe('change item input', () => {
  it('when a complete item is sent, then it parses and keeps the size string exactly', () => {
    const item = changeItemInput.parse(valid);
    expect(item.size).toBe('0.8');
    expect(item.safetyFlags).toEqual(['point_or_edge']);
    expect(item.region).toEqual(valid.region);
  });

  it('when note, flags and region are left out, then note is empty, flags are none and region is absent', () => {
    const item = changeItemInput.parse({ partId, effect: 'surface_only', method: 'texture', size: '0.05', unit: 'mm' });
    expect(item).toMatchObject({ note: '', safetyFlags: [] });
    expect(item.region).toBeUndefined();
  });

  it.each(['', '0', '0.0', '-1', '1,5', 'abc', '12345', '1.23456', '.5', '01'])('when the size is "%s", then it is refused', (size) => {
    expect(sizeValueSchema.safeParse(size).success).toBe(false);
  });

  it.each(['0.8', '12', '9999.9999', ' 2.5 '])('when the size is "%s", then it is accepted', (size) => {
    expect(sizeValueSchema.safeParse(size).success).toBe(true);
  });

  it('when effect and method contradict, then the error is on the method field', () => {
    const errors = fieldErrorsOf({ ...valid, effect: 'loses_plastic', method: 'cut' });
    expect(errors?.method?.[0]).toMatch(/needs steel added/);
  });

  it('when a safety flag is ticked twice, then it is refused', () => {
    expect(fieldErrorsOf({ ...valid, safetyFlags: ['thin_wall', 'thin_wall'] })?.safetyFlags).toBeDefined();
  });

  it('when the part id is not a uuid, then the error is on partId', () => {
    expect(fieldErrorsOf({ ...valid, partId: 'torso' })?.partId).toBeDefined();
  });

  it('when a mark runs past the right or bottom edge, then it is refused on w or h', () => {
    const wide = regionMarkSchema.safeParse({ imageRole: 'before', shape: 'circle', x: 0.7, y: 0, w: 0.4, h: 0.2 });
    expect(wide.success).toBe(false);
    expect(z.flattenError(wide.error!).fieldErrors.w).toBeDefined();
    const tall = regionMarkSchema.safeParse({ imageRole: 'before', shape: 'circle', x: 0, y: 0.9, w: 0.1, h: 0.2 });
    expect(z.flattenError(tall.error!).fieldErrors.h).toBeDefined();
  });

  it('when a mark fills the whole image or has zero width, then the first passes and the second is refused', () => {
    expect(regionMarkSchema.safeParse({ imageRole: 'after', shape: 'box', x: 0, y: 0, w: 1, h: 1 }).success).toBe(true);
    expect(regionMarkSchema.safeParse({ imageRole: 'after', shape: 'box', x: 0.1, y: 0.1, w: 0, h: 0.2 }).success).toBe(false);
    expect(regionMarkSchema.safeParse({ imageRole: 'after', shape: 'box', x: -0.1, y: 0.1, w: 0.2, h: 0.2 }).success).toBe(false);
  });

  it('when labels are listed, then every enum value has a non-empty label of its own', () => {
    const pairs: [readonly string[], Record<string, string>][] = [
      [partEffects, partEffectLabels],
      [partEffects, partEffectHints],
      [itemMethods, itemMethodLabels],
      [sizeUnits, sizeUnitLabels],
      [safetyFlags, safetyFlagLabels],
      [imageRoles, imageRoleLabels],
      [markShapes, markShapeLabels],
    ];
    for (const [values, labels] of pairs) {
      expect(Object.keys(labels).sort()).toEqual([...values].sort());
      for (const v of values) expect(labels[v]!.trim().length).toBeGreaterThan(1);
      expect(new Set(Object.values(labels)).size).toBe(values.length);
    }
  });

  it('when a size in inches is converted, then 1 in is exactly 25.4 mm', () => {
    // The international inch is exactly 25.4 mm (1959 agreement; TRADE-FACTS section 9 "exact factors").
    expect(sizeInMillimetres('1', 'in')).toBe('25.4');
    expect(sizeInMillimetres('0.125', 'in')).toBe('3.175');
    expect(sizeInMillimetres('0.8', 'mm')).toBe('0.8');
    // Cross-check against decimal.js directly, not binary floating point (0.1 * 25.4 = 2.5400000000000005 in a float).
    expect(sizeInMillimetres('0.1', 'in')).toBe(new Decimal('0.1').times('25.4').toString());
    expect(sizeInMillimetres('0.1', 'in')).toBe('2.54');
  });
});
