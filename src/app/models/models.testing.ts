// Revisions and members for the Models specs. Not imported by the app. The member is the beam 'TopMid' of the shared
// sample beam-varying-cardinal-points.ifc (IPE200, S355JR, 1000 mm) as its SOURCE.md lists it.
import type { MemberRecord, MemberRow, RevisionView } from './models-api';

export function revision(overrides: Partial<RevisionView> = {}): RevisionView {
  return {
    id: 'rev-1',
    number: 1,
    fileName: 'beam-varying-cardinal-points.ifc',
    sizeBytes: 6280,
    sha256: '6671ec68e76d920be9a8dbca77fcd33bbe17db3960710aab9f3e5e021a796f46',
    note: '',
    uploadedBy: { id: 'user-coordinator', name: 'Test coordinator' },
    uploadedAt: '2026-03-02T08:00:00Z',
    status: 'ready',
    progress: null,
    error: null,
    schema: 'IFC4',
    lengthUnit: 'millimetre',
    counts: { members: 4, ok: 4, notApplicable: 0, flagged: 0, context: 0 },
    ...overrides,
  };
}

export function memberRow(overrides: Partial<MemberRow> = {}): MemberRow {
  return {
    globalId: '06uVDzM0j8rugiazVexGkx',
    expressId: 210,
    ifcClass: 'IfcBeamStandardCase',
    name: 'TopMid',
    tag: null,
    storey: null,
    status: 'ok',
    reason: null,
    profileName: 'IPE200',
    profileSource: 'ifc-profile',
    profileType: 'IfcIShapeProfileDef',
    profileFamily: 'I',
    fabrication: 'rolled',
    depth_mm: 200,
    webThickness_mm: 5.6,
    flangeWidth_mm: 100,
    flangeThickness_mm: 8.5,
    grade: 'S355',
    fy_MPa: 355,
    gradeAssumed: false,
    length_mm: 1000,
    flags: [],
    ...overrides,
  };
}

/** The same member's whole record, as `GET …/members/:globalId` answers. */
export function memberRecord(): MemberRecord {
  const row = memberRow();
  return {
    globalId: row.globalId,
    expressId: row.expressId,
    ifcClass: row.ifcClass,
    name: row.name,
    tag: row.tag,
    objectType: null,
    predefinedType: 'JOIST',
    storey: row.storey,
    material: { name: 'S355JR', grade: 'S355', fy_MPa: 355, assumed: false },
    length_mm: row.length_mm,
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
    section: null,
    flags: [],
  };
}
