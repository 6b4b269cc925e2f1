import { findSection, toSectionInput } from '../catalogue/catalogue';
import { prepareCapacity, utilisationOf } from './check';
import { EngineInputError } from './input-error';
import { requiredWebThickness_mm } from './web-thickness';
import { expectClose } from './expect-close';
import { MPA_PER_KSI } from './units';

describe('requiredWebThickness_mm', () => {
  const w18 = toSectionInput(findSection('W18X50')!);

  it('matches the closed form for a rolled shape in case G2.1(a): tw = V/(φv·0.6·Fy·d)', () => {
    const V = 1000e3;
    const tw = requiredWebThickness_mm(w18, { grade: 'A992' }, 'aisc360-22-lrfd', V)!;
    expectClose(tw, V / (1.0 * 0.6 * 50 * MPA_PER_KSI * w18.depth_mm), 1e-4, 'required tw');
  });

  it('returns a thickness that just passes (round trip through the check)', () => {
    const section = toSectionInput(findSection('IPE 450')!);
    const V = 1600e3;
    const tw = requiredWebThickness_mm(section, { grade: 'S355' }, 'en1993-1-1', V)!;
    expect(tw).toBeGreaterThan(section.webThickness_mm);
    const u = utilisationOf(prepareCapacity({ ...section, webThickness_mm: tw }, { grade: 'S355' }, 'en1993-1-1'), V);
    expect(u).toBeLessThanOrEqual(1);
    expect(u).toBeGreaterThan(0.999);
  });

  it('honours a target utilisation below 1', () => {
    const tw = requiredWebThickness_mm(w18, { grade: 'A992' }, 'aisc360-22-asd', 500e3, {}, 0.8)!;
    expectClose(utilisationOf(prepareCapacity({ ...w18, webThickness_mm: tw }, { grade: 'A992' }, 'aisc360-22-asd'), 500e3), 0.8, 1e-3, 'utilisation');
  });

  it('returns null when no web that fits between the fillets would do, and 0 for no shear', () => {
    expect(requiredWebThickness_mm(w18, { grade: 'A992' }, 'aisc360-22-lrfd', 1e9)).toBeNull();
    expect(requiredWebThickness_mm(w18, { grade: 'A992' }, 'aisc360-22-lrfd', 0)).toBe(0);
  });

  it('rejects bad input, naming the field', () => {
    expect(() => requiredWebThickness_mm(w18, { grade: 'A992' }, 'aisc360-22-lrfd', Number.NaN)).toThrow(EngineInputError);
    expect(() => requiredWebThickness_mm(w18, { grade: 'A992' }, 'aisc360-22-lrfd', 1, {}, 1.5)).toThrow(/targetUtilisation/);
    expect(() => requiredWebThickness_mm({ ...w18, depth_mm: -1 }, { grade: 'A992' }, 'aisc360-22-lrfd', 1)).toThrow(/depth_mm/);
  });
});
