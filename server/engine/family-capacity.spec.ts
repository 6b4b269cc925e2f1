import { findSection, toSectionInput } from '../catalogue/catalogue';
import { prepareCapacity, type Standard, STANDARDS } from './check';
import { EngineInputError } from './input-error';
import { evaluateFamilyCheck, FamilyCapacityCache, familyUtilisation, prepareFamilyCapacity } from './family-capacity';
import type { SectionDimensions } from './section-family';
import { FAMILY_SECTIONS } from './test-family-sections';

const material = (standard: Standard) => (standard === 'en1993-1-1' ? { grade: 'S355' as const } : { grade: 'A992' as const });

describe('prepareFamilyCapacity for every family and standard', () => {
  const cases = FAMILY_SECTIONS.flatMap((d) => STANDARDS.map((s) => [`${d.family} ${FAMILY_SECTIONS.indexOf(d)}`, s, d] as const));

  it.each(cases)('%s by %s: a capacity or a plain reason on each axis, and the fast path agrees with the full result', (_, standard, d) => {
    const prepared = prepareFamilyCapacity(d, material(standard), standard, { momentBasis: 'plastic' });
    for (const axis of ['major', 'minor'] as const) {
      const c = prepared[axis];
      const forces = { shear_N: 150e3, moment_Nmm: 40e6 };
      const result = evaluateFamilyCheck(prepared, axis, forces);
      if (!c.applicable) {
        expect(c.reason).toMatch(/^no shear rule/);
        expect(result.status).toBe('not-applicable');
        expect(result.reason).toBe(c.reason);
        continue;
      }
      expect(c.VRd_N).toBeGreaterThan(0);
      expect(Number.isFinite(result.utilisation)).toBe(true);
      expect(familyUtilisation(c, forces.shear_N, forces.moment_Nmm)).toBe(result.utilisation);
      expect(result.trace.length).toBeGreaterThan(3);
    }
  });

  it('checks angles by AISC G3 only, and flats by neither (no rule, no guess)', () => {
    const angle = FAMILY_SECTIONS.find((d) => d.family === 'angle')!;
    expect(prepareFamilyCapacity(angle, { grade: 'S355' }, 'en1993-1-1').major.applicable).toBe(false);
    expect(prepareFamilyCapacity(angle, { grade: 'A36' }, 'aisc360-22-lrfd').major.applicable).toBe(true);
    const flat = FAMILY_SECTIONS.find((d) => d.family === 'plate')!;
    for (const standard of STANDARDS) expect(prepareFamilyCapacity(flat, material(standard), standard).minor.applicable).toBe(false);
  });

  it('says why a section known only by its extent has no check', () => {
    const z: SectionDimensions = { family: 'other', depth_mm: 200, width_mm: 80, description: 'Z-section' };
    const prepared = prepareFamilyCapacity(z, { grade: 'S355' }, 'en1993-1-1');
    expect(prepared.major).toMatchObject({ applicable: false, reason: expect.stringContaining('Z-section') });
  });
});

describe('the I-section values of check.ts do not move', () => {
  it.each<[string, Standard]>([
    ['IPE 300', 'en1993-1-1'],
    ['HEB 500', 'en1993-1-1'],
    ['W18X35', 'aisc360-22-lrfd'],
    ['W44X230', 'aisc360-22-asd'],
  ])('%s by %s', (name, standard) => {
    const input = toSectionInput(findSection(name)!);
    const expected = prepareCapacity(input, material(standard), standard);
    const prepared = prepareFamilyCapacity({ family: 'I', ...input }, material(standard), standard, { fabrication: input.fabrication });
    if (!prepared.major.applicable) throw new Error('checkable');
    expect(prepared.major.VRd_N).toBe(expected.VRd_N);
    expect(prepared.fy_MPa).toBe(expected.fy_MPa);
    expect([...prepared.trace, ...prepared.major.trace]).toEqual(expected.trace);
    const result = evaluateFamilyCheck(prepared, 'major', { shear_N: 250e3 });
    expect(result.utilisation).toBe(250e3 / expected.VRd_N);
  });
});

describe('flags, parameters and bad input', () => {
  it('flags a round HSS without a shear length and AISC webs with stiffeners (tension field not counted)', () => {
    const tube = prepareFamilyCapacity({ family: 'tube', diameter_mm: 168.3, wallThickness_mm: 6.3 }, { grade: 'A992' }, 'aisc360-22-lrfd');
    expect(tube.major.applicable && tube.major.flags).toContain('shear-length-not-given');
    const girder = prepareFamilyCapacity(FAMILY_SECTIONS[6], { grade: 'A992' }, 'aisc360-22-lrfd', { stiffenerSpacing_mm: 1200 });
    expect(girder.major.applicable && girder.major.flags).toContain('tension-field-not-counted');
  });

  it('takes the welded rules when told, whatever the geometry suggests', () => {
    const box: SectionDimensions = { family: 'box', depth_mm: 300, width_mm: 200, webThickness_mm: 10, flangeThickness_mm: 10, outerCornerRadius_mm: 15, innerCornerRadius_mm: 5 };
    expect(prepareFamilyCapacity(box, { fy_MPa: 355 }, 'en1993-1-1').fabrication).toBe('rolled');
    expect(prepareFamilyCapacity(box, { fy_MPa: 355 }, 'en1993-1-1', { fabrication: 'welded' }).major.applicable && true).toBe(true);
  });

  it.each<[string, object, RegExp]>([
    ['a moment basis no code has', { momentBasis: 'semi' }, /params\.momentBasis/],
    ['a negative shear length', { shearLength_mm: -5 }, /params\.shearLength_mm/],
    ['an unknown fabrication', { fabrication: 'cast' }, /params\.fabrication/],
  ])('refuses %s, naming the field', (_, params, message) => {
    expect(() => prepareFamilyCapacity(FAMILY_SECTIONS[0], { grade: 'S355' }, 'en1993-1-1', params)).toThrow(EngineInputError);
    expect(() => prepareFamilyCapacity(FAMILY_SECTIONS[0], { grade: 'S355' }, 'en1993-1-1', params)).toThrow(message);
  });

  it('refuses a shear that is not a number and an unknown axis', () => {
    const prepared = prepareFamilyCapacity(FAMILY_SECTIONS[0], { grade: 'S355' }, 'en1993-1-1');
    expect(() => evaluateFamilyCheck(prepared, 'major', { shear_N: Number.NaN })).toThrow(/shear_N/);
    expect(() => evaluateFamilyCheck(prepared, 'diagonal' as 'major', { shear_N: 1 })).toThrow(/axis/);
  });
});

describe('FamilyCapacityCache', () => {
  it('prepares each distinct section, material, standard and parameter set once', () => {
    const cache = new FamilyCapacityCache();
    const d = FAMILY_SECTIONS[5];
    const first = cache.get(d, { grade: 'S355' }, 'en1993-1-1', { momentBasis: 'plastic', eta: 1.2 });
    expect(cache.get({ ...d }, { grade: 'S355' }, 'en1993-1-1', { eta: 1.2, momentBasis: 'plastic' })).toBe(first);
    expect(cache.get(d, { grade: 'S275' }, 'en1993-1-1')).not.toBe(first);
    expect(cache.size).toBe(2);
  });
});
