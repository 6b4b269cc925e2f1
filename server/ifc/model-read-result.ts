/**
 * What reading one IFC model produces: the model's facts and one record per beam, column or member.
 * Later features store these records as they are, so every field is plain data (no class instances).
 * Lengths are millimetres in IFC model coordinates (Z up), whatever unit the file uses.
 */
import type { GradeId } from '../engine/grades';
import type { Fabrication } from '../engine/section';
import type { SectionDimensions } from '../engine/section-family';

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
  /** The header names a pre-release schema (IFC4X3_RC2…), read as `schema`. */
  schemaReadAs?: true;
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
  | 'several-profiles'
  | 'name-and-geometry-differ'
  | 'section-unrecognised'
  | 'zero-length'
  | 'geometry-unread';

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

/**
 * How a member's section was found: 'ifc-profile' parameters written in the file, 'outline' a profile curve measured,
 * 'body-cut' the body cut normal to the member axis and measured, 'catalogue' / 'project-catalogue' a designation looked
 * up in the built-in tables / the project's uploaded catalogue.
 */
export type ProfileSource = 'ifc-profile' | 'outline' | 'body-cut' | 'catalogue' | 'project-catalogue';
export const PROFILE_SOURCES: readonly ProfileSource[] = ['ifc-profile', 'outline', 'body-cut', 'catalogue', 'project-catalogue'];

/** How the section was found, in words, for the members page, the member panel and the calculation sheet. */
export const PROFILE_SOURCE_LABELS: Readonly<Record<ProfileSource, string>> = {
  'ifc-profile': 'dimensions written in the model',
  outline: 'measured from the profile outline',
  'body-cut': 'measured from a cut through the body',
  catalogue: 'dimensions from the section catalogue',
  'project-catalogue': "dimensions from the project's catalogue",
};

/** A section at a point of a varying (tapered) member: `at` is the fraction of the length from the start. */
export interface ProfileStation {
  at: number;
  dimensions: SectionDimensions;
}

interface ProfileCommon {
  name: string;
  source: ProfileSource;
  /** IFC entity the section was read from, e.g. IfcIShapeProfileDef, IfcArbitraryClosedProfileDef, IfcFacetedBrep. */
  ifcType: string;
  fabrication: Fabrication;
  /**
   * Sections along a varying member (both ends of a tapered extrusion, and any between), start to end. The profile's
   * own dimensions are then the governing one: the smallest, never the larger end.
   */
  along?: ProfileStation[];
  /** With `along`: where the governing section is, as a fraction of the length from the start. */
  governingAt?: number;
}

/** The member's section: its family and that family's dimensions (SectionDimensions) at the top level. */
export type MemberProfile = ProfileCommon & SectionDimensions;
export type IMemberProfile = MemberProfile & { family: 'I' };

/** The section's dimensions alone, without how it was found. */
export function sectionDimensionsOf(profile: MemberProfile): SectionDimensions {
  const { name: _name, source: _source, ifcType: _ifcType, fabrication: _fabrication, along: _along, governingAt: _at, ...dimensions } = profile;
  return dimensions as SectionDimensions;
}

export function isIProfile(profile: MemberProfile | null | undefined): profile is IMemberProfile {
  return profile?.family === 'I';
}

/** The profile of a member known to be an I-section; anything else is a programming error. */
export function requireIProfile(profile: MemberProfile | null | undefined): IMemberProfile {
  if (!isIProfile(profile)) throw new Error(`Expected an I-section profile, got ${profile ? profile.family : 'none'}`);
  return profile;
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
