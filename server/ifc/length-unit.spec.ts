import { MM_PER_FT, MM_PER_IN } from '../engine/units';
import { lengthUnitOf } from './length-unit';
import type { DeclaredUnit } from './unit-assignment';
import { radiansPerAngleUnit, siPrefixExponent } from './unit-assignment';

const si = (prefix: string | null): DeclaredUnit => ({ unitType: 'LENGTHUNIT', name: 'METRE', prefix, scaleToSi: 10 ** (siPrefixExponent(prefix) ?? NaN) });
const converted = (name: string, scaleToSi: number | null): DeclaredUnit => ({ unitType: 'LENGTHUNIT', name, prefix: null, scaleToSi });

describe('lengthUnitOf', () => {
  // SI prefixes as ISO 16739 IfcSIPrefix defines them (powers of ten of the SI brochure).
  it.each([
    [null, 'metre', 1000],
    ['MILLI', 'millimetre', 1],
    ['CENTI', 'centimetre', 10],
    ['DECI', 'decimetre', 100],
    ['KILO', 'kilometre', 1e6],
  ])('reads METRE with prefix %s as %s (%d mm)', (prefix, name, mm) => {
    expect(lengthUnitOf([si(prefix)])).toEqual({ name, scaleToMm: mm });
  });

  it('takes conversion-based inch and foot at their exact definitions (1959 agreement: 25.4 mm, 304.8 mm)', () => {
    expect(lengthUnitOf([converted('INCH', 0.0254)])).toEqual({ name: 'inch', scaleToMm: MM_PER_IN });
    // Files write rounded factors; within 1e-6 they are the exact unit.
    expect(lengthUnitOf([converted('inch', 0.02539999999)])).toEqual({ name: 'inch', scaleToMm: MM_PER_IN });
    expect(lengthUnitOf([converted('FOOT', 0.3048)])).toEqual({ name: 'foot', scaleToMm: MM_PER_FT });
  });

  it('keeps any other conversion-based unit at the factor the file gives', () => {
    expect(lengthUnitOf([converted('YARD', 0.9144)])).toEqual({ name: 'yard', scaleToMm: 914.4 });
    // An "inch" whose factor is not an inch is not silently corrected.
    expect(lengthUnitOf([converted('INCH', 0.03)]).scaleToMm).toBeCloseTo(30, 12);
  });

  it('refuses a model without a length unit, or with one that has no factor', () => {
    expect(() => lengthUnitOf([{ unitType: 'PLANEANGLEUNIT', name: 'RADIAN', prefix: null, scaleToSi: 1 }])).toThrow(/declares no length unit/);
    expect(() => lengthUnitOf([converted('STUD', null)])).toThrow(/"STUD" has no usable conversion/);
    expect(() => lengthUnitOf([si('NONSENSE')])).toThrow(/no usable conversion/);
  });
});

describe('radiansPerAngleUnit', () => {
  it('is 1 for radians or no declaration, π/180 for a degree unit', () => {
    expect(radiansPerAngleUnit([])).toBe(1);
    expect(radiansPerAngleUnit([{ unitType: 'PLANEANGLEUNIT', name: 'DEGREE', prefix: null, scaleToSi: Math.PI / 180 }])).toBe(Math.PI / 180);
  });
});
