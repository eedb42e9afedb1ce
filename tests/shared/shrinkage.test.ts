import Decimal from 'decimal.js';
import { findResin, resins } from '@shared/domain/data/resins';
import {
  compareConventions,
  exactSteelDimension,
  partFromSteel,
  shrinkMidpoint,
  steelChangeForDimension,
  steelDimension,
} from '@shared/domain/shrinkage';

const Oracle = Decimal.clone({ precision: 50 });

describe('steelDimension, ASTM D955 convention', () => {
  it('when the steel is computed, then (mold - part) / mold equals the shrink, as ASTM D955 defines it', () => {
    // Source: ASTM D955 — shrinkage from mold cavity to molded dimension, relative to the mold
    // dimension; routsis.blog "Calculating Part Shrinkage"; netcomposites glossary (TRADE-FACTS 3.1)
    for (const [part, s] of [['100', '0.006'], ['25.4', '0.02'], ['312.75', '0.0045']] as const) {
      const mold = exactSteelDimension(part, s, 'astm_d955');
      expect(mold.minus(part).div(mold).toSignificantDigits(30).eq(s)).toBe(true);
    }
  });

  it('when 100 mm at S = 0.006, then matches the decimal.js reference value', () => {
    // Source: TRADE-FACTS 3.3 / 9, decimal.js new Decimal(100).div(1 - 0.006) = 100.60362173038229376
    const exact = exactSteelDimension('100', '0.006');
    expect(exact.toSignificantDigits(20).toString()).toBe('100.60362173038229376');
    expect(steelDimension('100', '0.006')).toEqual({
      partMm: '100',
      shrink: '0.006',
      convention: 'astm_d955',
      formula: 'steel = part / (1 - S)',
      steelMm: '100.604',
    });
  });

  it('when ABS at 0.5 %, then 100 mm needs 100.503 mm of steel', () => {
    // Source: TRADE-FACTS 3.3 worked example, 100 / 0.995 = 100.5025 mm (rounded here half-up to 0.001 mm)
    expect(steelDimension('100.00', '0.005').steelMm).toBe('100.503');
    expect(steelDimension('100.00', '0.005', 'shop_shortcut').steelMm).toBe('100.500');
  });

  it('when the resin is SABIC LEXAN PC (0.5-0.7 % datasheet), then both ends of its range give the D955 steel', () => {
    // Source: SABIC LEXAN 123R/141R/143R technical datasheets, mold shrinkage 0.5-0.7 % flow, 3.2 mm (TRADE-FACTS 3.2)
    const pc = findResin('pc')!;
    expect([pc.shrinkMin, pc.shrinkMax]).toEqual(['0.005', '0.007']);
    expect(pc.source).toMatch(/SABIC LEXAN/);
    // 50 mm part: decimal.js 50 / (1 - 0.005) and 50 / (1 - 0.007), half-up to 0.001 mm
    expect(steelDimension('50', pc.shrinkMin).steelMm).toBe(new Oracle(50).div('0.995').toFixed(3, Decimal.ROUND_HALF_UP));
    expect(steelDimension('50', pc.shrinkMax).steelMm).toBe(new Oracle(50).div('0.993').toFixed(3, Decimal.ROUND_HALF_UP));
    expect(steelDimension('50', pc.shrinkMax).steelMm).toBe('50.352');
  });
});

describe('shop shortcut and the difference between conventions', () => {
  it('when the Basic Conversions sheet examples are run, then the shortcut matches them', () => {
    // Source: "Basic Injection Molding Conversions and Calculations" (ro.scribd.com/doc/188029473):
    // 1.293 x 1.006 = 1.301 and the reverse 2.492 / 1.006 = 2.477 (inches there; the arithmetic is unit-free)
    expect(steelDimension('1.293', '0.006', 'shop_shortcut').steelMm).toBe('1.301');
    expect(partFromSteel('2.492', '0.006', 'shop_shortcut')).toBe('2.477');
  });

  it.each([
    // TRADE-FACTS 3.1 table: part, S, part / (1 - S), part x (1 + S), difference
    ['0.005', '100.503', '100.500', '2.5'], // 100.50251 / 100.500 / 2.5 um
    ['0.006', '100.604', '100.600', '3.6'], // 100.60362 / 100.600 / 3.6 um
    ['0.020', '102.041', '102.000', '40.8'], // 102.04082 / 102.000 / 40.8 um
  ])('when 100 mm at S = %s, then the conventions differ as in the TRADE-FACTS 3.1 table', (s, astm, shop, microns) => {
    const c = compareConventions('100', s);
    expect(c.astmD955Mm).toBe(astm);
    expect(c.shopShortcutMm).toBe(shop);
    expect(c.differenceMicrons).toBe(microns);
    // The gap is S^2 x L / (1 - S) (TRADE-FACTS 3.1, derived); decimal.js computes it independently
    const gap = new Oracle(s).pow(2).times(100).div(new Oracle(1).minus(s));
    expect(c.differenceMm).toBe(gap.toFixed(3, Decimal.ROUND_HALF_UP));
    expect(c.differenceMicrons).toBe(gap.times(1000).toFixed(1, Decimal.ROUND_HALF_UP));
  });

  it('when converting back from steel with D955, then the part dimension returns', () => {
    expect(partFromSteel('100.60362173038229376', '0.006')).toBe('100.000');
  });
});

describe('steelChangeForDimension', () => {
  it('when a pocket-formed dimension grows, then steel is removed (steel-safe)', () => {
    const c = steelChangeForDimension({ oldPartMm: '100', newPartMm: '100.5', shrink: '0.005' });
    // 100 / 0.995 = 100.50251 -> 100.503; 100.5 / 0.995 = 101.00503 -> 101.005
    expect(c).toMatchObject({
      oldSteelMm: '100.503',
      newSteelMm: '101.005',
      steelDeltaMm: '0.502',
      depthMm: '0.502',
      action: 'remove_steel',
      convention: 'astm_d955',
    });
    expect(new Oracle(c.oldSteelMm).plus(c.steelDeltaMm).toFixed(3)).toBe(c.newSteelMm);
    expect(c.sentence).toMatch(/^Remove 0\.502 mm of steel/);
  });

  it('when a pocket-formed dimension shrinks, then steel must be added (not steel-safe)', () => {
    const c = steelChangeForDimension({ oldPartMm: '10', newPartMm: '9.8', shrink: '0.006' });
    expect(c.action).toBe('add_steel');
    expect(c.steelDeltaMm.startsWith('-')).toBe(true);
    expect(c.depthMm).toBe(c.steelDeltaMm.slice(1));
    expect(c.sentence).toMatch(/Not steel-safe/);
  });

  it('when a hole on a core pin grows, then the pin needs steel added', () => {
    const c = steelChangeForDimension({ oldPartMm: '3', newPartMm: '3.2', shrink: '0.005', formedBy: 'protrusion' });
    expect(c.action).toBe('add_steel');
    const shrinkHole = steelChangeForDimension({ oldPartMm: '3.2', newPartMm: '3', shrink: '0.005', formedBy: 'protrusion' });
    expect(shrinkHole.action).toBe('remove_steel');
  });

  it('when the shop shortcut is chosen, then the change uses it and says so', () => {
    const c = steelChangeForDimension({ oldPartMm: '100', newPartMm: '101', shrink: '0.02', convention: 'shop_shortcut' });
    expect(c).toMatchObject({ oldSteelMm: '102.000', newSteelMm: '103.020', steelDeltaMm: '1.020', formula: 'steel = part x (1 + S)' });
  });

  it('when nothing changes, then no steel action', () => {
    expect(steelChangeForDimension({ oldPartMm: '5', newPartMm: '5.0000', shrink: '0.004' }).action).toBe('none');
  });
});

describe('input checks and resin data', () => {
  it('when shrink is given as a percent or negative, or a dimension is not positive, then throws', () => {
    expect(() => steelDimension('100', '0.6')).toThrow(/fraction/);
    expect(() => steelDimension('100', '-0.001')).toThrow(RangeError);
    expect(() => steelDimension('0', '0.005')).toThrow(RangeError);
    expect(() => steelDimension('abc', '0.005')).toThrow(RangeError);
  });

  it('when the resin table is read, then every row has a named source and a sane range', () => {
    const ids = new Set<string>();
    for (const r of resins) {
      expect(ids.has(r.id)).toBe(false);
      ids.add(r.id);
      expect(r.source.length).toBeGreaterThan(10);
      const min = new Oracle(r.shrinkMin);
      const max = new Oracle(r.shrinkMax);
      expect(min.gt(0) && min.lte(max) && max.lt('0.1')).toBe(true);
    }
    for (const id of ['abs', 'pp', 'hdpe', 'ldpe', 'pvc_rigid', 'ps', 'pc', 'pom', 'pa6', 'tpe_sebs']) {
      expect(findResin(id)).toBeDefined();
    }
  });

  it('when the Stelray values are looked up, then they match TRADE-FACTS 3.2', () => {
    // Source: stelray.com/shrinkage_value.htm (Injection Molding Reference Guide, 3rd ed.), TRADE-FACTS 3.2
    expect(findResin('abs')).toMatchObject({ shrinkMin: '0.004', shrinkMax: '0.007' });
    expect(findResin('pp')).toMatchObject({ shrinkMin: '0.010', shrinkMax: '0.030' });
    expect(findResin('pom')).toMatchObject({ shrinkMin: '0.020', shrinkMax: '0.035' });
    expect(findResin('pp')!.source).toMatch(/Stelray/);
    expect(shrinkMidpoint(findResin('abs')!)).toBe('0.0055');
  });
});
