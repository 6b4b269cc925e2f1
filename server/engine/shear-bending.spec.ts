import { expectClose } from './expect-close';
import { EngineInputError } from './input-error';
import { evaluateFamilyCheck, prepareFamilyCapacity } from './family-capacity';
import type { SectionDimensions } from './section-family';
import { enShearBending, enShearBendingUtilisation, shearReductionRho } from './shear-bending';

const kN = 1e3;
const kNm = 1e6;

// Invented welded girder of three plates: 500 deep, web 10, flanges 220 × 16; fy = 355 MPa given, γM0 = 1.0, η = 1.2
// (hw/tw = 46.8 ≤ 72ε/η = 48.8: no shear buckling).
const girder: SectionDimensions = {
  family: 'I',
  depth_mm: 500,
  webThickness_mm: 10,
  topFlange: { width_mm: 220, thickness_mm: 16, filletRadius_mm: 0 },
  bottomFlange: { width_mm: 220, thickness_mm: 16, filletRadius_mm: 0 },
};
const plastic = prepareFamilyCapacity(girder, { fy_MPa: 355 }, 'en1993-1-1', { momentBasis: 'plastic' });

describe('EN 1993-1-1 §6.2.8 worked by hand (formulas (6.29) and (6.30) of the standard, numbers by hand)', () => {
  // Av = η·hw·tw = 1.2 × 468 × 10 = 5616 mm²; Vpl,Rd = 5616 × 355/√3 = 1151.1 kN.
  // VEd = 900 kN: VEd/Vpl,Rd = 0.7819 > 0.5, ρ = (2 × 0.7819 − 1)² = 0.3179.
  // Wpl,y = 220 × 16 × 484 + 10 × 468²/4 = 2 251 240 mm³; Aw²/(4·tw) = (468 × 10)²/40 = 547 560 mm³.
  // My,V,Rd = (2 251 240 − 0.3179 × 547 560) × 355 = 737.4 kNm; MEd = 500 kNm → 0.6781.
  const axis = plastic.major;
  if (!axis.applicable) throw new Error('girder must be checkable');

  it('takes Vpl,Rd and Mc,Rd from the plates', () => {
    expectClose(axis.en!.vplRd_N / kN, 1151.1, 1e-4, 'Vpl,Rd');
    expectClose(axis.bending!.mcRd_Nmm / kNm, (2251240 * 355) / kNm, 1e-9, 'Mpl,Rd');
  });

  it('reduces the moment resistance with ρ and gives MEd / My,V,Rd', () => {
    expectClose(shearReductionRho(900 * kN, axis.en!.vplRd_N), 0.3179, 2e-4, 'ρ');
    const result = enShearBending(axis.bending!, 900 * kN, 500 * kNm);
    expectClose(result.mvRd_Nmm! / kNm, 737.4, 1e-4, 'My,V,Rd');
    expectClose(result.utilisation, 0.6781, 1e-4, 'utilisation');
    expect(result.trace.some((s) => s.clause.includes('(6.30)'))).toBe(true);
    expect(enShearBendingUtilisation(axis.bending!, -900 * kN, -500 * kNm)).toBe(result.utilisation);
  });

  it('leaves the moment resistance whole up to VEd = 0.5·Vpl,Rd', () => {
    const result = enShearBending(axis.bending!, 500 * kN, 500 * kNm);
    expect(result.rho).toBe(0);
    expectClose(result.utilisation, (500 * kNm) / axis.bending!.mcRd_Nmm, 1e-12, 'MEd/Mc,Rd');
  });

  it('names shear with bending as governing when it does, through the entry point', () => {
    const r = evaluateFamilyCheck(plastic, 'major', { shear_N: 900 * kN, moment_Nmm: 700 * kNm });
    expect(r.governing).toBe('shear with bending');
    expectClose(r.utilisation, 700 / 737.4, 1e-4, 'utilisation');
    expect(r.status).toBe('pass');
    expectClose(r.shearUtilisation, 900 / 1151.1, 1e-4, 'shear alone');
    const shearOnly = evaluateFamilyCheck(plastic, 'major', { shear_N: 900 * kN });
    expect(shearOnly.governing).toBe('major-axis shear');
    expect(shearOnly.bendingUtilisation).toBeNull();
  });

  it('on an elastic basis scales the stress until the web edge reaches (1 − ρ)·fy', () => {
    const elastic = prepareFamilyCapacity(girder, { fy_MPa: 355 }, 'en1993-1-1', { momentBasis: 'elastic' });
    if (!elastic.major.applicable) throw new Error('checkable');
    const I = (220 * 500 ** 3 - 210 * 468 ** 3) / 12;
    const mel = ((I / 250) * 355) / kNm;
    const b = elastic.major.bending!;
    expectClose(b.mcRd_Nmm / kNm, mel, 1e-9, 'Mel,Rd');
    // ρ = 0.3179: web edge at 234 mm, extreme fibre at 250 mm → factor min(1, 0.6821 × 250/234) = 0.7288.
    expectClose(enShearBending(b, 900 * kN, 100 * kNm).mvRd_Nmm! / kNm, mel * 0.7288, 1e-4, 'MV elastic');
  });
});

describe('EN 1993-1-5 §7.1 for a web that buckles in shear, worked by hand', () => {
  // Invented plate girder 1600 deep, web 1540 × 10, flanges 400 × 30, fy = 355 MPa, η = 1.2, non-rigid end post.
  // ε = 0.8136, λw = 1540/(86.4 × 10 × 0.8136) = 2.191, χw = 0.83/λw = 0.3789, Vbw,Rd = χw·fy·hw·t/√3 = 1195.9 kN.
  // Mf,Rd = 400 × 30 × 1570 × 355 = 6688.2 kNm; Wpl = 400 × 30 × 1570 + 10 × 1540²/4 = 24 769 000 mm³,
  // Mpl,Rd = 8793.0 kNm. VEd = 900 kN, MEd = 7500 kNm: η̄1 = 0.8530 ≥ Mf/Mpl = 0.7606, η̄3 = 0.7526;
  // η̄1 + (1 − 0.7606)(2 × 0.7526 − 1)² = 0.9140.
  const plateGirder: SectionDimensions = {
    family: 'I',
    depth_mm: 1600,
    webThickness_mm: 10,
    topFlange: { width_mm: 400, thickness_mm: 30, filletRadius_mm: 0 },
    bottomFlange: { width_mm: 400, thickness_mm: 30, filletRadius_mm: 0 },
  };
  const prepared = prepareFamilyCapacity(plateGirder, { fy_MPa: 355 }, 'en1993-1-1', { momentBasis: 'plastic' });

  it('uses η̄1 and η̄3 with the flanges-only moment', () => {
    if (!prepared.major.applicable) throw new Error('checkable');
    const b = prepared.major.bending!;
    expectClose(b.buckling!.vbwRd_N / kN, 1195.9, 1e-4, 'Vbw,Rd');
    expectClose(b.buckling!.mfRd_Nmm / kNm, 6688.2, 1e-6, 'Mf,Rd');
    expectClose(b.mplRd_Nmm / kNm, 8793.0, 1e-5, 'Mpl,Rd');
    const result = enShearBending(b, 900 * kN, 7500 * kNm);
    expectClose(result.utilisation, 0.914, 1e-3, '§7.1 criterion');
    expect(result.trace.map((s) => s.clause)).toContain('EN 1993-1-5 §7.1(1)');
  });

  it('needs no reduction while η̄3 ≤ 0.5, and none while the flanges alone carry the moment', () => {
    if (!prepared.major.applicable) throw new Error('checkable');
    const b = prepared.major.bending!;
    expectClose(enShearBendingUtilisation(b, 500 * kN, 7500 * kNm), 7500 / 8793.0, 1e-5, 'η̄3 ≤ 0.5');
    expectClose(enShearBendingUtilisation(b, 1100 * kN, 5000 * kNm), 5000 / 8793.0, 1e-5, 'η̄1 < Mf/Mpl');
  });
});

describe('shear with bending: other families, AISC and bad input', () => {
  it('reduces the whole section of a tube (conservative) and says so', () => {
    const tube: SectionDimensions = { family: 'tube', diameter_mm: 168.3, wallThickness_mm: 6.3 };
    const p = prepareFamilyCapacity(tube, { fy_MPa: 355 }, 'en1993-1-1', { momentBasis: 'plastic' });
    if (!p.major.applicable) throw new Error('checkable');
    expect(p.major.flags).toContain('whole-section-reduced-for-shear');
    const b = p.major.bending!;
    const v = 0.8 * b.vplRd_N;
    const rho = (2 * 0.8 - 1) ** 2;
    expectClose(enShearBending(b, v, 10 * kNm).mvRd_Nmm!, (1 - rho) * b.mcRd_Nmm, 1e-12, '(1 − ρ)·Mpl');
  });

  it('reduces both webs of a box: (Wpl − ρ·2·t·L²/4)·fy', () => {
    const box: SectionDimensions = { family: 'box', depth_mm: 600, width_mm: 400, webThickness_mm: 15, flangeThickness_mm: 25 };
    const p = prepareFamilyCapacity(box, { fy_MPa: 355 }, 'en1993-1-1', { momentBasis: 'plastic' });
    if (!p.major.applicable) throw new Error('checkable');
    const b = p.major.bending!;
    const wpl = 400 * 25 * 575 + (2 * 15 * 550 ** 2) / 4;
    const rho = shearReductionRho(0.9 * b.vplRd_N, b.vplRd_N);
    expectClose(enShearBending(b, 0.9 * b.vplRd_N, 1).mvRd_Nmm!, (wpl - (rho * 2 * 15 * 550 ** 2) / 4) * 355, 1e-6, 'MV box');
  });

  it('holds ρ at 1 beyond Vpl,Rd and never gives NaN', () => {
    expect(shearReductionRho(2e6, 1e6)).toBe(1);
    const tube = prepareFamilyCapacity({ family: 'tube', diameter_mm: 100, wallThickness_mm: 5 }, { fy_MPa: 355 }, 'en1993-1-1');
    if (!tube.major.applicable) throw new Error('checkable');
    expect(enShearBendingUtilisation(tube.major.bending!, 1e9, 0)).toBe(0);
    expect(enShearBendingUtilisation(tube.major.bending!, 1e9, 1)).toBe(Number.POSITIVE_INFINITY);
  });

  it('reports AISC shear and flexural demand side by side, with no combined formula', () => {
    const p = prepareFamilyCapacity(girder, { fy_MPa: 345 }, 'aisc360-22-lrfd');
    const r = evaluateFamilyCheck(p, 'major', { shear_N: 300 * kN, moment_Nmm: 400 * kNm });
    expect(r.bendingUtilisation).toBeNull();
    expect(r.governing).toBe('major-axis shear');
    expect(r.flags).toContain('flexure-checked-separately');
    expect(r.trace.some((s) => s.clause === 'AISC 360-22 §H' && s.formula === 'no interaction formula')).toBe(true);
  });

  it('refuses a moment without its shear, and a moment that is not a number, naming the field', () => {
    expect(() => evaluateFamilyCheck(plastic, 'major', { moment_Nmm: 100 * kNm })).toThrow(EngineInputError);
    expect(() => evaluateFamilyCheck(plastic, 'major', { moment_Nmm: 100 * kNm })).toThrow(/without its shear force/);
    expect(() => evaluateFamilyCheck(plastic, 'major', { shear_N: 1, moment_Nmm: Number.NaN })).toThrow(/moment_Nmm/);
    const axis = plastic.major;
    if (!axis.applicable) throw new Error('checkable');
    const bending = axis.bending!;
    expect(() => enShearBending(bending, undefined, 5)).toThrow(/without its shear force/);
  });
});

