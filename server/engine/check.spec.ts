import { findSection, toSectionInput } from '../catalogue/catalogue';
import { CapacityCache, capacityKey } from './capacity-cache';
import { checkMember, DEFAULT_CHECK_PARAMS, evaluateCapacity, prepareCapacity, resolveCheckParams, STANDARDS, utilisationOf } from './check';
import { GradeError } from './grades';
import { EngineInputError } from './input-error';
import { SectionInputError } from './section';
import { expectClose } from './expect-close';

const ipe300 = toSectionInput(findSection('IPE 300')!);
const w18x50 = toSectionInput(findSection('W18X50')!);

function fieldOf(call: () => unknown): string {
  try {
    call();
  } catch (error) {
    expect(error).toBeInstanceOf(EngineInputError);
    return (error as EngineInputError).field;
  }
  throw new Error('expected an EngineInputError');
}

describe('checkMember', () => {
  it('gives utilisation |VEd|/VRd, status and warning band', () => {
    const capacity = prepareCapacity(ipe300, { grade: 'S355' }, 'en1993-1-1');
    const at = (ratio: number) => checkMember({ section: ipe300, grade: 'S355', standard: 'en1993-1-1', shear_N: ratio * capacity.VRd_N });
    expect(at(0.5)).toMatchObject({ status: 'pass', warning: false });
    expect(at(0.95)).toMatchObject({ status: 'pass', warning: true });
    expect(at(1)).toMatchObject({ status: 'pass', warning: true });
    expect(at(1.01)).toMatchObject({ status: 'fail', warning: false });
    expectClose(at(0.75).utilisation, 0.75, 1e-14, 'utilisation');
  });

  it('ignores the sign of the shear', () => {
    const plus = checkMember({ section: w18x50, grade: 'A992', standard: 'aisc360-22-lrfd', shear_N: 400e3 });
    const minus = checkMember({ section: w18x50, grade: 'A992', standard: 'aisc360-22-lrfd', shear_N: -400e3 });
    expect(minus.utilisation).toBe(plus.utilisation);
    expect(minus.VEd_N).toBe(-400e3);
  });

  it('gives utilisation 0 for zero shear and never NaN or Infinity for any valid input', () => {
    for (const standard of STANDARDS) {
      for (const shear_N of [0, 1e-300, 1e3, 1e9]) {
        const r = checkMember({ section: w18x50, grade: 'A992', standard, shear_N });
        expect(Number.isFinite(r.utilisation)).toBe(true);
        expect(Number.isFinite(r.VRd_N) && r.VRd_N > 0).toBe(true);
        for (const s of r.trace) if (typeof s.result === 'number') expect(Number.isFinite(s.result)).toBe(true);
      }
    }
    expect(checkMember({ section: ipe300, grade: 'S235', standard: 'en1993-1-1', shear_N: 0 }).utilisation).toBe(0);
  });

  it('ends the trace with the utilisation step and names a clause for every step', () => {
    const r = checkMember({ section: ipe300, grade: 'S355', standard: 'en1993-1-1', shear_N: 200e3 });
    const last = r.trace[r.trace.length - 1];
    expect(last.formula).toBe('|VEd| / VRd');
    expect(last.result).toBeCloseTo(r.utilisation, 5);
    for (const s of r.trace) {
      expect(s.clause.length).toBeGreaterThan(0);
      expect(s.formula.length).toBeGreaterThan(0);
    }
  });

  it('reports the EN elastic check beside the plastic one and flags it when only the elastic check fails', () => {
    const capacity = prepareCapacity(ipe300, { grade: 'S355' }, 'en1993-1-1');
    const r = evaluateCapacity(capacity, 0.97 * capacity.VRd_N);
    expect(r.elasticUtilisation).toBeGreaterThan(1); // τmax exceeds the web average for an IPE
    expect(r.status).toBe('pass');
    expect(r.flags).toContain('elastic-check-exceeded');
    expect(checkMember({ section: w18x50, grade: 'A992', standard: 'aisc360-22-asd', shear_N: 1 }).elasticUtilisation).toBeNull();
  });

  it('carries the caller\'s flags and marks a yield strength given directly', () => {
    const r = checkMember({ section: ipe300, fy_MPa: 300, grade: 'S355', standard: 'en1993-1-1', shear_N: 1e5, flags: ['assumed-grade', 'catalogue-section'] });
    expect(r.fy_MPa).toBe(300);
    expect(r.flags).toEqual(expect.arrayContaining(['yield-strength-given', 'assumed-grade', 'catalogue-section']));
  });

  it('flags web buckling when it governs', () => {
    const r = checkMember({ section: toSectionInput(findSection('IPE 600')!), grade: 'S460', standard: 'en1993-1-1', shear_N: 1e5 });
    expect(r.flags).toContain('web-buckling-governs');
  });
});

describe('checkMember bad input', () => {
  it.each([
    ['shear NaN', () => checkMember({ section: ipe300, grade: 'S355', standard: 'en1993-1-1', shear_N: Number.NaN }), 'shear_N'],
    ['shear Infinity', () => checkMember({ section: ipe300, grade: 'S355', standard: 'en1993-1-1', shear_N: Number.POSITIVE_INFINITY }), 'shear_N'],
    ['no grade and no fy', () => checkMember({ section: ipe300, standard: 'en1993-1-1', shear_N: 1 }), 'grade'],
    ['negative fy', () => checkMember({ section: ipe300, fy_MPa: -1, standard: 'en1993-1-1', shear_N: 1 }), 'fy_MPa'],
    ['unknown standard', () => checkMember({ section: ipe300, grade: 'S355', standard: 'bs5950' as never, shear_N: 1 }), 'standard'],
    ['zero depth', () => checkMember({ section: { ...ipe300, depth_mm: 0 }, grade: 'S355', standard: 'en1993-1-1', shear_N: 1 }), 'depth_mm'],
    ['γM0 of zero', () => checkMember({ section: ipe300, grade: 'S355', standard: 'en1993-1-1', params: { gammaM0: 0 }, shear_N: 1 }), 'params.gammaM0'],
    ['η of 1.5', () => checkMember({ section: ipe300, grade: 'S355', standard: 'en1993-1-1', params: { eta: 1.5 }, shear_N: 1 }), 'params.eta'],
    ['warning ratio above 1', () => checkMember({ section: ipe300, grade: 'S355', standard: 'en1993-1-1', params: { warningRatio: 1.2 }, shear_N: 1 }), 'params.warningRatio'],
    ['negative stiffener spacing', () => checkMember({ section: ipe300, grade: 'S355', standard: 'en1993-1-1', params: { stiffenerSpacing_mm: -5 }, shear_N: 1 }), 'params.stiffenerSpacing_mm'],
    ['unknown end post', () => checkMember({ section: ipe300, grade: 'S355', standard: 'en1993-1-1', params: { endPost: 'welded' as never }, shear_N: 1 }), 'params.endPost'],
  ])('rejects %s, naming the field', (_name, call, field) => {
    expect(fieldOf(call)).toBe(field);
  });

  it('uses the specific error classes under the shared base', () => {
    expect(() => checkMember({ section: { ...ipe300, webThickness_mm: -1 }, grade: 'S355', standard: 'en1993-1-1', shear_N: 1 })).toThrow(SectionInputError);
    expect(() => checkMember({ section: ipe300, grade: 'S355', standard: 'en1993-1-1', params: {}, shear_N: 1 })).not.toThrow();
    expect(() => prepareCapacity(toSectionInput(findSection('HEM 1000')!), { grade: 'S355' }, 'en1993-1-1', { yieldRule: 'en1993-1-1-table-3.1' })).not.toThrow();
    expect(() => prepareCapacity({ ...ipe300, topFlange: { ...ipe300.topFlange, thickness_mm: 90 }, bottomFlange: { ...ipe300.bottomFlange, thickness_mm: 90 }, depth_mm: 400 }, { grade: 'S355' }, 'en1993-1-1', { yieldRule: 'en1993-1-1-table-3.1' })).toThrow(GradeError);
  });
});

describe('prepared capacity and its cache', () => {
  it('gives the same utilisation through the fast path as through checkMember', () => {
    const capacity = prepareCapacity(w18x50, { grade: 'A992' }, 'aisc360-22-asd');
    const r = checkMember({ section: w18x50, grade: 'A992', standard: 'aisc360-22-asd', shear_N: 321e3 });
    expect(utilisationOf(capacity, 321e3)).toBe(r.utilisation);
  });

  it('prepares each distinct profile, grade, standard and parameter set once', () => {
    const cache = new CapacityCache();
    const a = cache.get(ipe300, { grade: 'S355' }, 'en1993-1-1', { gammaM0: 1, eta: 1.2 });
    const b = cache.get({ ...ipe300 }, { grade: 'S355' }, 'en1993-1-1', { eta: 1.2, gammaM0: 1 });
    expect(b).toBe(a);
    cache.get(ipe300, { grade: 'S275' }, 'en1993-1-1', { gammaM0: 1, eta: 1.2 });
    cache.get(ipe300, { grade: 'S355' }, 'aisc360-22-lrfd');
    expect(cache.size).toBe(3);
    expect(capacityKey(ipe300, { grade: 'S355' }, 'en1993-1-1')).not.toBe(capacityKey(ipe300, { fy_MPa: 355 }, 'en1993-1-1'));
  });

  it('fills in the recommended parameters', () => {
    expect(resolveCheckParams()).toEqual(DEFAULT_CHECK_PARAMS);
    expect(resolveCheckParams({ stiffenerSpacing_mm: null }).stiffenerSpacing_mm).toBeNull();
  });
});
