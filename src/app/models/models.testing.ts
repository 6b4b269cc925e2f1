// Revisions and members for the Models specs. Not imported by the app. The member is the beam 'TopMid' of the shared
// sample beam-varying-cardinal-points.ifc (IPE200, S355JR, 1000 mm) as its SOURCE.md lists it.
import type { MemberFacets, MemberProfile, MemberRecord, MemberRow, RevisionView, SectionDimensions } from './models-api';

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

// Sections of other families, with dimensions from EN 10365 (UPN 200, IPE 300, IPE 400) and EN 10210-2
// (CHS 168.3 × 8.0), from memory. Members, tags and storeys are invented.

/** A UPN 200 channel measured from its profile outline: listed with its dimensions, not checked yet. */
export const CHANNEL_ROW = memberRow({
  globalId: '2O2Fr$t4X7Zf8NOew3FLOH',
  expressId: 412,
  ifcClass: 'IfcMember',
  name: 'Purlin P4',
  tag: 'P4',
  status: 'not-applicable',
  reason: "'UPN 200': channel. Its web check is not available yet; it is listed with its dimensions only.",
  profileName: 'UPN 200',
  profileSource: 'outline',
  profileType: 'IfcArbitraryClosedProfileDef',
  profileFamily: 'channel',
  depth_mm: 200,
  webThickness_mm: 8.5,
  flangeWidth_mm: 75,
  flangeThickness_mm: 11.5,
});

/** A CHS 168.3 × 8.0 brace from a parametric profile: no flanges, so only its width (the diameter) in that column. */
export const TUBE_ROW = memberRow({
  globalId: '1xe23DCTfXVVqeTb00000T',
  expressId: 365,
  ifcClass: 'IfcMember',
  name: 'Brace BR1',
  tag: 'BR1',
  status: 'not-applicable',
  reason: "'CHS 168.3x8': circular hollow section. Its web check is not available yet; it is listed with its dimensions only.",
  profileName: 'CHS 168.3x8',
  profileSource: 'ifc-profile',
  profileType: 'IfcCircleHollowProfileDef',
  profileFamily: 'tube',
  depth_mm: 168.3,
  webThickness_mm: 8,
  flangeWidth_mm: 168.3,
  flangeThickness_mm: null,
});

/** The facets of a revision holding the members above, with two reasons for skipping. */
export function memberFacets(overrides: Partial<MemberFacets> = {}): MemberFacets {
  return {
    storeys: ['Level 01'],
    profiles: ['CHS 168.3x8', 'IPE200', 'UPN 200'],
    families: ['I', 'channel', 'tube'],
    sources: ['ifc-profile', 'outline'],
    skipped: [
      { reason: TUBE_ROW.reason!, count: 6 },
      { reason: CHANNEL_ROW.reason!, count: 2 },
    ],
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
    profile: { ...rolledI(200, 5.6, 100, 8.5, 12), name: 'IPE200', source: 'ifc-profile', ifcType: 'IfcIShapeProfileDef', fabrication: 'rolled' },
    section: null,
    flags: [],
  };
}

/** A doubly symmetric I-section with equal flanges. */
function rolledI(depth_mm: number, webThickness_mm: number, width_mm: number, thickness_mm: number, filletRadius_mm: number): SectionDimensions {
  const flange = { width_mm, thickness_mm, filletRadius_mm };
  return { family: 'I', depth_mm, webThickness_mm, topFlange: flange, bottomFlange: flange };
}

/** A column tapering from an IPE 400 section at its foot to an IPE 300 section at its head: the smaller end governs. */
export function taperedRecord(): MemberRecord {
  const ipe400 = rolledI(400, 8.6, 180, 13.5, 21);
  const ipe300 = rolledI(300, 7.1, 150, 10.7, 15);
  return {
    ...memberRecord(),
    globalId: '0K7w7JbDL1Fxw8$U8zB1Ta',
    ifcClass: 'IfcColumn',
    name: 'Tapered column C7',
    tag: 'C7',
    predefinedType: 'COLUMN',
    profile: {
      ...ipe300,
      name: '',
      source: 'ifc-profile',
      ifcType: 'IfcExtrudedAreaSolidTapered',
      fabrication: 'welded',
      along: [
        { at: 0, dimensions: ipe400 },
        { at: 1, dimensions: ipe300 },
      ],
      governingAt: 1,
    },
    flags: ['tapered'],
  };
}

/** The whole record of a row above that is listed with its dimensions only. */
function listedRecord(row: MemberRow, predefinedType: string, profile: MemberProfile): MemberRecord {
  const { globalId, ifcClass, name, tag } = row;
  return { ...memberRecord(), globalId, ifcClass, name, tag, predefinedType, status: 'not-applicable', reason: row.reason!, profile, section: null, flags: [] };
}

/** The channel's whole record, with the sloped flanges and radii its outline was measured with. */
export function channelRecord(): MemberRecord {
  return listedRecord(CHANNEL_ROW, 'PURLIN', {
    family: 'channel',
    name: 'UPN 200',
    source: 'outline',
    ifcType: 'IfcArbitraryClosedProfileDef',
    fabrication: 'rolled',
    depth_mm: 200,
    width_mm: 75,
    webThickness_mm: 8.5,
    flangeThickness_mm: 11.5,
    rootRadius_mm: 11.5,
    edgeRadius_mm: 6,
    slope_rad: Math.atan(0.08),
  });
}

/** The tube's whole record. */
export function tubeRecord(): MemberRecord {
  return listedRecord(TUBE_ROW, 'BRACE', {
    family: 'tube',
    name: 'CHS 168.3x8',
    source: 'ifc-profile',
    ifcType: 'IfcCircleHollowProfileDef',
    fabrication: 'rolled',
    diameter_mm: 168.3,
    wallThickness_mm: 8,
  });
}
