import { expectClose } from '../engine/expect-close';
import type { IDimensions } from '../engine/section-family';
import type { MemberRecord } from '../ifc/model-read-result';
import { recommendedParameters } from './check-parameters';
import { computeCheckRun } from './check-run-compute';
import type { FamilySheetSection } from './checks-api-types';
import { buildMemberSheet, sectionNoteOf } from './member-sheet';

// An invented haunched rafter (demo scenario): 600 deep at the start, 400 at the end, same plates.
const plate = { width_mm: 180, thickness_mm: 13.5, filletRadius_mm: 21 };
const at = (depth_mm: number): IDimensions => ({ family: 'I', depth_mm, webThickness_mm: 8.6, topFlange: plate, bottomFlange: plate });

function member(profile: MemberRecord['profile']): MemberRecord {
  return {
    globalId: '2VgK4vDz5FvQK0bE0RAFTR',
    expressId: 1,
    ifcClass: 'IfcBeam',
    name: 'R1',
    tag: 'R1',
    objectType: null,
    predefinedType: null,
    storey: null,
    material: null,
    length_mm: 12000,
    axis: null,
    status: 'ok',
    profile,
    section: null,
    flags: [],
  };
}

describe('sectionNoteOf', () => {
  it('says how the section was found', () => {
    expect(sectionNoteOf(member({ ...at(600), name: 'R', source: 'body-cut', ifcType: 'IfcFacetedBrep', fabrication: 'welded' }))).toBe(
      'Section measured from a cut through the body.',
    );
    expect(sectionNoteOf(member(null))).toBeNull();
  });

  it('lists a tapered member’s sections and says the smaller one is checked', () => {
    const note = sectionNoteOf(
      member({
        ...at(400),
        name: 'R',
        source: 'ifc-profile',
        ifcType: 'IfcIShapeProfileDef',
        fabrication: 'welded',
        along: [
          { at: 0, dimensions: at(600) },
          { at: 1, dimensions: at(400) },
        ],
        governingAt: 1,
      }),
    );
    expect(note).toContain('at 0 % of the length: d 600, tw 8.6, flanges 180×13.5 mm');
    expect(note).toContain('at 100 % of the length: d 400');
    expect(note).toContain('Checked with the smaller section, at 100 % of the length');
  });
});

describe('buildMemberSheet for sections of other families', () => {
  const V_N = 300_000;
  const steel = { name: 'S355', grade: 'S355' as const, fy_MPa: 355, assumed: false };

  function sheetOf(dimensions: FamilySheetSection['dimensions'], ifcType: string, standard: 'en1993-1-1' | 'aisc360-22-lrfd' = 'en1993-1-1') {
    const parameters = recommendedParameters(standard);
    const record: MemberRecord = { ...member({ ...dimensions, name: 'invented', source: 'ifc-profile', ifcType, fabrication: 'welded' }), material: steel };
    const shears = [
      { combination: 'ULS-1', shear_N: V_N / 2, row: 2, memberKey: 'R1' },
      { combination: 'ULS-2', shear_N: -V_N, row: 3, memberKey: 'R1' },
    ];
    const [check] = computeCheckRun({ members: [record], shears: new Map([[record.globalId, shears]]), parameters }).members;
    return buildMemberSheet({ member: record, check, standard, parameters, runEngineVersion: 'e1', currentEngineVersion: 'e1' });
  }

  it('draws a welded box from its outline with the void and gives τ at the neutral axis = V·Q/(I·2t)', () => {
    // Invented box 600 × 400, webs 15, flanges 25, square corners. Closed forms of the plates (common practice, no source).
    const [h, b, tw, tf] = [600, 400, 15, 25];
    const sheet = sheetOf({ family: 'box', depth_mm: h, width_mm: b, webThickness_mm: tw, flangeThickness_mm: tf }, 'IfcArbitraryProfileDefWithVoids');
    const I = (b * h ** 3 - (b - 2 * tw) * (h - 2 * tf) ** 3) / 12;
    const Q = b * tf * (h / 2 - tf / 2) + (2 * tw * (h / 2 - tf) ** 2) / 2;
    expect(sheet.section).toBeNull();
    expect(sheet.stress).toBeNull();
    const section = sheet.familySection!;
    expect(section.axis).toBe('major');
    expect(section.outline.voids).toHaveLength(1);
    expectClose(section.properties.area_mm2, b * h - (b - 2 * tw) * (h - 2 * tf), 1e-12, 'A');
    expectClose(section.properties.i_mm4, I, 1e-12, 'I');
    expectClose(section.properties.neutralAxis_mm, 0, 1e-9, 'neutral axis at mid-depth');
    const stress = sheet.familyStress!;
    expectClose(stress.tauMax_MPa, (V_N * Q) / (I * 2 * tw), 1e-9, 'τmax');
    expectClose(stress.at_mm, 0, 1e-9, 'τmax at the neutral axis');
    // At the inside faces of the flanges the cut width jumps from the two webs (2tw) to the flange (b): τ by b/(2tw).
    expect(stress.jumps.map((jump) => jump.level_mm)).toEqual([-(h / 2 - tf), h / 2 - tf]);
    const top = stress.jumps[1];
    expectClose(top.below_MPa / top.above_MPa, b / (2 * tw), 1e-9, 'jump ratio');
    expectClose(stress.webAverage_MPa!, V_N / (2 * (h - 2 * tf) * tw), 1e-12, 'V/(2·hw·tw)');
    // S355 with 25 mm flanges: fy = 345 MPa (EN 10025-2 Table 7, 16 < t ≤ 40 mm); γM0 = 1.00 recommended.
    expect(stress.elasticLimit_MPa).toBeCloseTo(345 / Math.sqrt(3), 6);
    expect(sheet.governing!.combination).toBe('ULS-2');
    expect(sheet.trace.some((step) => step.clause.startsWith('EN 1993-1-1 §6.2.6(3)'))).toBe(true);
    expect(sheet.trace.at(-2)!.what).toContain('Largest elastic shear stress');
    expectClose(sheet.trace.at(-2)!.result as number, stress.tauMax_MPa, 1e-5, 'trace τ = sheet τ');
    expect(sheet.suggestion).toBeNull();
  });

  it('gives a circular hollow section τ at the neutral axis = V·Q/(I·2t) with Q = 2(R³ − r³)/3', () => {
    // Invented tube Ø 168.3 × 8. Closed forms of a thick ring (common practice, no source); the engine's chords, within
    // 0.01 mm of the circles, lose about 0.03 % of A and I.
    const [R, t] = [168.3 / 2, 8];
    const r = R - t;
    const sheet = sheetOf({ family: 'tube', diameter_mm: 2 * R, wallThickness_mm: t }, 'IfcCircleHollowProfileDef');
    const I = (Math.PI / 4) * (R ** 4 - r ** 4);
    const Q = (2 / 3) * (R ** 3 - r ** 3);
    const section = sheet.familySection!;
    expect(section.outline.voids).toHaveLength(1);
    expectClose(section.properties.area_mm2, Math.PI * (R ** 2 - r ** 2), 1e-3, 'A');
    expectClose(section.properties.i_mm4, I, 1e-3, 'I');
    expectClose(sheet.familyStress!.tauMax_MPa, (V_N * Q) / (I * 2 * t), 1e-3, 'τmax');
    expect(sheet.familyStress!.jumps).toEqual([]);
    expect(sheet.trace.length).toBeGreaterThan(3);
  });

  it('gives a channel with square corners τ at the neutral axis from its three rectangles, and the AISC trace', () => {
    // Invented channel 300 × 100, web 10, flanges 15, no fillets (common practice, no source: I and Q of rectangles).
    const [h, b, tw, tf] = [300, 100, 10, 15];
    const sheet = sheetOf({ family: 'channel', depth_mm: h, width_mm: b, webThickness_mm: tw, flangeThickness_mm: tf, rootRadius_mm: 0 }, 'IfcUShapeProfileDef', 'aisc360-22-lrfd');
    const I = (b * h ** 3 - (b - tw) * (h - 2 * tf) ** 3) / 12;
    const Q = b * tf * (h / 2 - tf / 2) + (tw * (h / 2 - tf) ** 2) / 2;
    expectClose(sheet.familySection!.properties.i_mm4, I, 1e-12, 'I');
    expectClose(sheet.familyStress!.tauMax_MPa, (V_N * Q) / (I * tw), 1e-9, 'τmax');
    expect(sheet.familyStress!.elasticLimit_MPa).toBeUndefined();
    expect(sheet.trace.some((step) => step.clause.includes('G2.1'))).toBe(true);
    expect(sheet.governing!.VRd_kN).toBeCloseTo(sheet.check.governing!.VRd_N / 1000, 9);
  });

  it('keeps a thin rectangle’s τmax at 1.5·V/A on the wall of a tall, thin box', () => {
    // Each web of a box with negligible flanges is a thin rectangle carrying V/2: τmax = 1.5·(V/2)/(h·tw)
    // (common practice, no source). Invented 1000 × 200, webs 10, flanges 0.5 mm.
    const [h, b, tw, tf] = [1000, 200, 10, 0.5];
    const sheet = sheetOf({ family: 'box', depth_mm: h, width_mm: b, webThickness_mm: tw, flangeThickness_mm: tf }, 'IfcRectangleHollowProfileDef');
    expectClose(sheet.familyStress!.tauMax_MPa, (1.5 * (V_N / 2)) / (h * tw), 0.02, 'τmax ≈ 1.5·V/A per web');
  });
});

describe('buildMemberSheet for an I-section governed by another check', () => {
  it('shows the recorded result and says its trace is not drawn, rather than a major-axis trace that does not govern', () => {
    const parameters = recommendedParameters('en1993-1-1');
    // An invented welded girder, 600 deep, with a large minor-axis shear (Vy) and a small Vz: the minor axis governs.
    const record: MemberRecord = { ...member({ ...at(600), name: 'G', source: 'ifc-profile', ifcType: 'IfcIShapeProfileDef', fabrication: 'welded' }), material: { name: 'S355', grade: 'S355', fy_MPa: 355, assumed: false } };
    const base = computeCheckRun({ members: [record], shears: new Map([[record.globalId, [{ combination: 'ULS-1', shear_N: 10_000, row: 2, memberKey: 'G' }]]]), parameters }).members[0];
    const check = { ...base, governing: { ...base.governing!, axis: 'minor' as const, check: 'minor-axis shear' as const } };
    const sheet = buildMemberSheet({ member: record, check, standard: 'en1993-1-1', parameters, runEngineVersion: 'e1', currentEngineVersion: 'e1' });
    expect(sheet.trace).toEqual([]);
    expect(sheet.section).toBeNull();
    expect(sheet.governing).not.toBeNull();
    expect(sheet.sectionNote).toContain('its clause trace is not drawn on this sheet');
  });
});
