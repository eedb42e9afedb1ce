import {
  abuseTests,
  formatReference,
  retestRequired,
  safetyReview,
  SAFETY_CLOSING,
  sharpPointTest,
  smallPartsCylinder,
  type ReferenceValue,
} from '../../shared/domain/safety';
import { riggingCaution } from '../../shared/domain/handling';

const byId = (refs: readonly ReferenceValue[], id: string) => {
  const r = refs.find((x) => x.id === id);
  if (!r) throw new Error(`no reference ${id}`);
  return r;
};

describe('safety reference values', () => {
  it('when the small-parts cylinder is shown, then it has the dimensions of 16 CFR 1501.4 Figure 1', () => {
    // Source: 16 CFR 1501.4 Figure 1 (inside diameter 1.25 in, depths 1.00 in and 2.25 in); the
    // Canadian SOR/2011-17 Schedule 1 prints the same fixture as 31.7 mm, 25.4 mm, 57.1 mm.
    // The inch values govern (16 CFR 1501.4(a)); the published metric figures are rounded down.
    const d = byId(smallPartsCylinder, 'spc_inside_diameter');
    expect(d).toMatchObject({ value: '1.25', unit: 'in', publishedMetric: '31.7 mm', status: 'regulation_text' });
    expect(d.si).toEqual({ value: '31.75', unit: 'mm' }); // 1.25 x 25.4 exactly
    expect(byId(smallPartsCylinder, 'spc_short_depth')).toMatchObject({ value: '1.00', si: { value: '25.4', unit: 'mm' } });
    const long = byId(smallPartsCylinder, 'spc_long_depth');
    expect(long).toMatchObject({ value: '2.25', publishedMetric: '57.1 mm', si: { value: '57.15', unit: 'mm' } });
    // "no greater than": the rounded published figure is below the exact one, by less than 0.1 mm
    for (const r of smallPartsCylinder) {
      const published = Number.parseFloat(r.publishedMetric!);
      const exact = Number.parseFloat(r.si!.value);
      expect(published).toBeLessThanOrEqual(exact);
      expect(exact - published).toBeLessThan(0.1);
    }
  });

  it('when the sharp-point test is shown, then its force is 1.00 lb (4.45 N) as 16 CFR 1500.48 prints it', () => {
    // Source: 16 CFR 1500.48 ("1.00 lb (4.45 N)"); 1 lbf = 4.4482216152605 N exactly (TRADE-FACTS 2.3).
    const f = byId(sharpPointTest, 'sharp_point_force');
    expect(f).toMatchObject({ value: '1.00', unit: 'lbf', publishedMetric: '4.45 N' });
    expect(f.si).toEqual({ value: '4.4482', unit: 'N' });
    expect(Number(f.si!.value).toFixed(2)).toBe('4.45');
  });

  it('when use-and-abuse tests are shown, then drops, torque, tension and compression match 16 CFR 1500.51-.53', () => {
    const young = abuseTests.up_to_18_months;
    // 16 CFR 1500.51 / ASTM F963-23 8.7.1 Table 5: 10 drops from 4.5 ft (1.37 m)
    expect(byId(young, 'drop_count').value).toBe('10');
    expect(byId(young, 'drop_height')).toMatchObject({ value: '4.5', unit: 'ft', si: { value: '1.3716', unit: 'm' }, publishedMetric: '1.37 m' });
    // 16 CFR 1500.51(e): torque 2 in-lb; TRADE-FACTS 4.4 exact SI 0.22597 N·m
    expect(byId(young, 'torque')).toMatchObject({ value: '2', unit: 'in·lbf', si: { value: '0.22597', unit: 'N·m' }, status: 'regulation_text' });
    // 16 CFR 1500.51(f): tension 10 lb; exact SI 44.482 N (TRADE-FACTS 4.4)
    expect(byId(young, 'tension')).toMatchObject({ value: '10', si: { value: '44.482', unit: 'N' }, status: 'regulation_text' });
    // 16 CFR 1500.52(g): compression 25 lb; 25 x 4.4482216152605 = 111.2055 N (TRADE-FACTS 4.4 gives 111.206)
    expect(byId(abuseTests.from_18_to_36_months, 'compression')).toMatchObject({ value: '25', si: { value: '111.21', unit: 'N' } });
    // 16 CFR 1500.53(b): 4 drops from 3 ft (0.92 m as printed; 3 ft is 0.9144 m exactly)
    const older = abuseTests.from_36_to_96_months;
    expect(byId(older, 'drop_count').value).toBe('4');
    expect(byId(older, 'drop_height')).toMatchObject({ value: '3', si: { value: '0.9144', unit: 'm' }, status: 'regulation_text' });
  });

  it('when a value is only remembered, then it is marked from memory', () => {
    // TRADE-FACTS 4.4: torque 3 and 4 in-lb, tension 15 lb, compression 20 and 30 lb are [MEMORY].
    expect(byId(abuseTests.from_18_to_36_months, 'torque').status).toBe('from_memory');
    expect(byId(abuseTests.from_36_to_96_months, 'torque').status).toBe('from_memory');
    expect(byId(abuseTests.from_36_to_96_months, 'tension').status).toBe('from_memory');
    expect(byId(abuseTests.up_to_18_months, 'compression').status).toBe('from_memory');
    expect(formatReference(byId(abuseTests.from_36_to_96_months, 'torque'))).toMatch(/from memory/);
  });
});

describe('safety review', () => {
  it('when no item is flagged, then no re-test is required and nothing is shown', () => {
    const r = safetyReview([{ safetyFlags: [] }, { safetyFlags: [] }]);
    expect(r).toEqual({ cautions: [], flaggedItems: 0, retestRequired: false, closing: '' });
    expect(retestRequired([{ safetyFlags: [] }])).toBe(false);
  });

  it('when items are flagged, then each flag gets one caution with references and the closing defers to a lab and each market', () => {
    const r = safetyReview([{ safetyFlags: ['thin_wall', 'small_part'] }, { safetyFlags: ['small_part'] }, { safetyFlags: [] }]);
    expect(r.retestRequired).toBe(true);
    expect(r.flaggedItems).toBe(2);
    expect(r.cautions.map((c) => c.flag)).toEqual(['small_part', 'thin_wall']);
    expect(r.cautions[0]!.references.map((x) => x.id)).toEqual(['spc_inside_diameter', 'spc_short_depth', 'spc_long_depth']);
    expect(r.closing).toBe(SAFETY_CLOSING);
    expect(r.closing).toMatch(/accredited/);
    expect(r.closing).toMatch(/each market/);
  });

  it('when the age grade is given, then only its use-and-abuse tests are listed', () => {
    const all = safetyReview([{ safetyFlags: ['thin_wall'] }]).cautions[0]!.references;
    expect(all).toHaveLength(18);
    const one = safetyReview([{ safetyFlags: ['thin_wall'] }], { ageGrades: ['from_36_to_96_months'] }).cautions[0]!.references;
    expect(one).toHaveLength(6);
    expect(one.every((x) => x.id.startsWith('from_36_to_96_months.'))).toBe(true);
  });

  it('when a point or edge is flagged, then the caution says 1500.49 covers metal and glass only', () => {
    const c = safetyReview([{ safetyFlags: ['point_or_edge'] }]).cautions[0]!;
    expect(c.sentences.join(' ')).toMatch(/1500\.49\) covers metal and glass edges only/);
    expect(c.references[0]!.id).toBe('sharp_point_force');
  });
});

describe('rigging caution', () => {
  it('when a tool weighs 500 kg, then it shows about 1,102 lb and defers to qualified riggers and local codes', () => {
    // 1 lb = 0.45359237 kg exactly (TRADE-FACTS section 9): 500 / 0.45359237 = 1102.31 lb
    const c = riggingCaution(500);
    expect(c.weightLb).toBe(1102);
    expect(c.weightText).toContain('500 kg (about 1,102 lb)');
    expect(c.text).toMatch(/qualified riggers/);
    expect(c.text).toMatch(/local codes/);
    expect(c.text).toMatch(/1910\.179/);
  });

  it('when a tool weighs 2,340 kg, then thousands are grouped', () => {
    // 2340 / 0.45359237 = 5158.81 lb
    expect(riggingCaution(2340).weightText).toContain('2,340 kg (about 5,159 lb)');
  });

  it.each([null, undefined, 0, -5, Number.NaN])('when the weight is %s, then the caution asks for the tool to be weighed', (w) => {
    const c = riggingCaution(w);
    expect(c.weightLb).toBeNull();
    expect(c.text).toMatch(/Weight not recorded/);
    expect(c.text).toMatch(/qualified riggers/);
  });
});
