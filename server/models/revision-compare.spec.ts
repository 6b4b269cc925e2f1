import { type MemberRecord, requireIProfile } from '../ifc/model-read-result';
import { COMPARE_TOLERANCES, compareRevisions, memberChanges } from './revision-compare';

// The beam 'TopMid' of the shared sample beam-varying-cardinal-points.ifc as its SOURCE.md lists it: IPE200
// (100 × 200, tw 5.6, tf 8.5, r 12) in S355JR, a 1000 mm extrusion. Section properties: IPE 200 table values
// (A 28.48 cm², Iy 1943 cm⁴, from memory); the comparison does not use them.
function topMid(changes: Partial<MemberRecord> = {}): MemberRecord {
  return {
    globalId: '06uVDzM0j8rugiazVexGkx',
    expressId: 210,
    ifcClass: 'IfcBeamStandardCase',
    name: 'TopMid',
    tag: null,
    objectType: null,
    predefinedType: 'JOIST',
    storey: null,
    material: { name: 'S355JR', grade: 'S355', fy_MPa: 355, assumed: false },
    length_mm: 1000,
    axis: { start_mm: [0, 0, 0], end_mm: [1000, 0, 0] },
    status: 'ok',
    profile: {
      name: 'IPE200',
      family: 'I', source: 'ifc-profile',
      ifcType: 'IfcIShapeProfileDef',
      fabrication: 'rolled',
      depth_mm: 200,
      webThickness_mm: 5.6,
      topFlange: { width_mm: 100, thickness_mm: 8.5, filletRadius_mm: 12 },
      bottomFlange: { width_mm: 100, thickness_mm: 8.5, filletRadius_mm: 12 },
    },
    section: { area_mm2: 2848, iMajor_mm4: 19.43e6, qMax_mm3: 110e3, neutralAxisFromBottom_mm: 100 },
    flags: [],
    ...changes,
  };
}

describe('memberChanges', () => {
  it('sees no change within the modelling tolerances (common practice, no source)', () => {
    const nudged = topMid({
      length_mm: 1000 + COMPARE_TOLERANCES.length_mm * 0.9,
      axis: { start_mm: [0, 0, COMPARE_TOLERANCES.position_mm * 0.9], end_mm: [1000, 0, 0] },
    });
    expect(memberChanges(topMid(), nudged)).toEqual([]);
  });

  it('does not count an axis drawn the other way round as a move', () => {
    expect(memberChanges(topMid(), topMid({ axis: { start_mm: [1000, 0, 0], end_mm: [0, 0, 0] } }))).toEqual([]);
  });

  it('names a new section by its name, and shows the dimensions when only they changed', () => {
    const ipe220 = topMid({ profile: { ...topMid().profile!, name: 'IPE220' } });
    expect(memberChanges(topMid(), ipe220)).toEqual([{ field: 'section', from: 'IPE200', to: 'IPE220' }]);
    const thinnerWeb = topMid({ profile: { ...requireIProfile(topMid().profile), webThickness_mm: 5.0 } });
    expect(memberChanges(topMid(), thinnerWeb)).toEqual([
      { field: 'section', from: 'IPE200 (d 200, tw 5.6, flanges 100×8.5 mm)', to: 'IPE200 (d 200, tw 5, flanges 100×8.5 mm)' },
    ]);
  });

  it('reports grade, fabrication, length and position changes with their values', () => {
    const changed = topMid({
      material: { name: 'S275JR', grade: 'S275', fy_MPa: 275, assumed: false },
      profile: { ...topMid().profile!, fabrication: 'welded' },
      length_mm: 1250.04,
      axis: { start_mm: [0, 0, 0], end_mm: [1250.04, 0, 0] },
    });
    expect(memberChanges(topMid(), changed)).toEqual([
      { field: 'grade', from: 'S355', to: 'S275' },
      { field: 'fabrication', from: 'rolled', to: 'welded' },
      { field: 'length', from: 1000, to: 1250 },
      { field: 'position', from: { start_mm: [0, 0, 0], end_mm: [1000, 0, 0] }, to: { start_mm: [0, 0, 0], end_mm: [1250, 0, 0] } },
    ]);
  });

  it('reports a section that could no longer be read', () => {
    const lost = topMid({ status: 'flagged', profile: null, section: null });
    expect(memberChanges(topMid(), lost)).toEqual([{ field: 'section', from: 'IPE200', to: null }]);
  });
});

describe('compareRevisions', () => {
  it('splits members by GlobalId into added, removed, changed and unchanged', () => {
    const kept = topMid();
    const moved = topMid({ globalId: '3Cyaczln1DyfCVyfoF1Fyl', expressId: 230, name: 'BotMid', axis: { start_mm: [0, 0, -100], end_mm: [1000, 0, -100] } });
    const gone = topMid({ globalId: '3_uWum$4vBjQ8_adQlTox1', expressId: 250, name: 'BotLeft' });
    const fresh = topMid({ globalId: '3QKYtgM_1EtekuZgGn_XdM', expressId: 270, name: 'TopRight' });
    const result = compareRevisions([kept, topMid({ ...moved, axis: kept.axis }), gone], [kept, moved, fresh]);
    expect(result.unchanged).toBe(1);
    expect(result.added.map((m) => m.name)).toEqual(['TopRight']);
    expect(result.removed.map((m) => m.name)).toEqual(['BotLeft']);
    expect(result.changed).toEqual([{ globalId: moved.globalId, tag: null, name: 'BotMid', changes: [expect.objectContaining({ field: 'position' })] }]);
  });
});
