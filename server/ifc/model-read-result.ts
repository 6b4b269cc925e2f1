/**
 * What reading one IFC model produces: the model's facts and one record per beam, column or member.
 * Later features store these records as they are, so every field is plain data (no class instances).
 * Lengths are millimetres in IFC model coordinates (Z up), whatever unit the file uses.
 */
import type { GradeId } from '../engine/grades';
import type { Fabrication } from '../engine/section';

export type IfcSchema = 'IFC2X3' | 'IFC4' | 'IFC4X3';

export interface ModelCounts {
  /** Beams, columns and members (with subtypes) found in the file. */
  members: number;
  ok: number;
  notApplicable: number;
  flagged: number;
  /** Slabs, walls, plates, … written to the glb as context. */
  contextElements: number;
  /** Elements in the glb (members and context). */
  meshedElements: number;
}

export interface ModelInfo {
  /** The schema as web-ifc reads it; `fileSchema` is the name in the header (e.g. IFC4X3_ADD2). */
  schema: IfcSchema;
  fileSchema: string;
  /** Unit name as declared, e.g. 'millimetre', 'metre', 'inch', 'foot'. */
  lengthUnit: string;
  lengthScaleToMm: number;
  application?: string;
  fileName?: string;
  counts: ModelCounts;
}

export type MemberStatus = 'ok' | 'not-applicable' | 'flagged';

/** Codes in MemberRecord.flags; each says what a reviewer should know about the member. */
export type MemberFlag =
  | 'assumed-grade'
  | 'no-material'
  | 'no-representation'
  | 'no-axis'
  | 'no-geometry'
  | 'geometry-built'
  | 'invalid-profile'
  | 'profile-not-in-catalogue'
  | 'no-profile'
  | 'derived-profile'
  | 'tapered'
  | 'top-flange-assumed'
  | 'curved'
  | 'several-profiles';

export interface MemberMaterial {
  /** The IFC material's name; null when the member has none (then the grade is the default one). */
  name: string | null;
  grade: GradeId;
  /** For the thickest plate of the section; null for members without a usable section. */
  fy_MPa: number | null;
  /** The name did not identify a grade, so the project's default grade was used. */
  assumed: boolean;
}

export interface ProfileFlange {
  width_mm: number;
  thickness_mm: number;
  filletRadius_mm: number;
  edgeRadius_mm?: number;
  slope_rad?: number;
}

export interface MemberProfile {
  name: string;
  /** 'ifc': dimensions written in the file; 'catalogue': a name-only profile resolved through the section catalogue. */
  source: 'ifc' | 'catalogue';
  /** IFC entity of the profile, e.g. IfcIShapeProfileDef, IfcArbitraryClosedProfileDef. */
  ifcType: string;
  fabrication: Fabrication;
  depth_mm: number;
  webThickness_mm: number;
  topFlange: ProfileFlange;
  bottomFlange: ProfileFlange;
}

export interface MemberSection {
  area_mm2: number;
  iMajor_mm4: number;
  qMax_mm3: number;
  neutralAxisFromBottom_mm: number;
}

export type Point3_mm = [number, number, number];

export interface MemberRecord {
  globalId: string;
  expressId: number;
  ifcClass: string;
  name: string | null;
  tag: string | null;
  objectType: string | null;
  predefinedType: string | null;
  storey: string | null;
  material: MemberMaterial | null;
  length_mm: number | null;
  axis: { start_mm: Point3_mm; end_mm: Point3_mm } | null;
  status: MemberStatus;
  /** Why the member is not applicable or flagged, in words a user understands. */
  reason?: string;
  profile: MemberProfile | null;
  section: MemberSection | null;
  flags: MemberFlag[];
}

export interface ModelReadResult {
  model: ModelInfo;
  members: MemberRecord[];
  /** The baked glTF 2.0 binary (see glb-writer.ts for the node contract); absent when geometry was not asked for. */
  glb?: Uint8Array;
}
