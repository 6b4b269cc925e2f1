/**
 * The families of steel sections and the dimensions that describe each, in millimetres and radians: one vocabulary
 * shared by the IFC reader (parametric profiles, outlines, body cuts), the catalogues, the stored member and the client.
 *
 * Local axes follow IfcParameterizedProfileDef: the section lies in its x–y plane, y along the depth (the web of an I,
 * a channel or a tee is parallel to y), x across the width, origin at the centre of the bounding box unless a family
 * says otherwise.
 */
import type { FlangeInput } from './section';

export const SECTION_FAMILIES = ['I', 'channel', 'tee', 'angle', 'box', 'tube', 'plate', 'other'] as const;
export type SectionFamily = (typeof SECTION_FAMILIES)[number];

/** The families in words, for the members page, the CLI and messages. */
export const SECTION_FAMILY_LABELS: Readonly<Record<SectionFamily, string>> = {
  I: 'I-section',
  channel: 'channel',
  tee: 'tee',
  angle: 'angle',
  box: 'hollow or box section',
  tube: 'circular hollow section',
  plate: 'plate or flat bar',
  other: 'other shape',
};

/** Doubly or singly symmetric I or H: rolled (root fillets) or welded (plates). */
export interface IDimensions {
  family: 'I';
  depth_mm: number;
  webThickness_mm: number;
  topFlange: FlangeInput;
  bottomFlange: FlangeInput;
}

/** Channel (U, PFC, C, MC, UPN, UPE): the web on the left (−x), both flanges pointing to +x. */
export interface ChannelDimensions {
  family: 'channel';
  depth_mm: number;
  /** Overall flange width, web included. */
  width_mm: number;
  webThickness_mm: number;
  /** Mean thickness; for a sloped flange measured half-way along the outstand. */
  flangeThickness_mm: number;
  rootRadius_mm: number;
  edgeRadius_mm?: number;
  slope_rad?: number;
  /** Lip length of a cold-formed lipped channel (IfcCShapeProfileDef Girth); absent for hot-rolled channels. */
  lip_mm?: number;
}

/** Tee: the flange on top (+y), the stem down. */
export interface TeeDimensions {
  family: 'tee';
  depth_mm: number;
  /** Flange width. */
  width_mm: number;
  /** Stem (web) thickness. */
  webThickness_mm: number;
  flangeThickness_mm: number;
  rootRadius_mm: number;
  flangeEdgeRadius_mm?: number;
  webEdgeRadius_mm?: number;
  flangeSlope_rad?: number;
  webSlope_rad?: number;
}

/** Angle: one leg along −y … +y (depth) on the left, the other along x (width) at the bottom. */
export interface AngleDimensions {
  family: 'angle';
  depth_mm: number;
  width_mm: number;
  thickness_mm: number;
  rootRadius_mm: number;
  edgeRadius_mm?: number;
  /** Thickness of the horizontal leg when it differs from the vertical one (rare). */
  widthLegThickness_mm?: number;
}

/** Rectangular or square hollow section, or a welded box: webs are the walls parallel to y. */
export interface BoxDimensions {
  family: 'box';
  depth_mm: number;
  width_mm: number;
  /** Thickness of each wall parallel to y. */
  webThickness_mm: number;
  /** Thickness of each wall parallel to x. */
  flangeThickness_mm: number;
  outerCornerRadius_mm?: number;
  innerCornerRadius_mm?: number;
}

/** Circular hollow section. */
export interface TubeDimensions {
  family: 'tube';
  diameter_mm: number;
  wallThickness_mm: number;
}

/** Solid rectangle (flat bar, plate). */
export interface PlateDimensions {
  family: 'plate';
  depth_mm: number;
  width_mm: number;
}

/** Anything else (Z, solid round, built-up shapes): only its extent is described. */
export interface OtherDimensions {
  family: 'other';
  depth_mm: number;
  width_mm: number;
  /** What it is, in words: 'Z-section', 'solid round', 'built-up section'. */
  description: string;
}

export type SectionDimensions =
  | IDimensions
  | ChannelDimensions
  | TeeDimensions
  | AngleDimensions
  | BoxDimensions
  | TubeDimensions
  | PlateDimensions
  | OtherDimensions;

/** Every number of a section's dimensions by its dotted path ('topFlange.width_mm'), for comparing two sections. */
export function dimensionValues(d: SectionDimensions): Record<string, number> {
  const values: Record<string, number> = {};
  const collect = (value: unknown, path: string): void => {
    if (typeof value === 'number') values[path] = value;
    else if (value && typeof value === 'object') for (const [key, inner] of Object.entries(value)) collect(inner, path ? `${path}.${key}` : key);
  };
  collect(d, '');
  return values;
}

/** Overall depth (along y) of any family. */
export function overallDepth_mm(d: SectionDimensions): number {
  return d.family === 'tube' ? d.diameter_mm : d.depth_mm;
}

/** Overall width (along x) of any family. */
export function overallWidth_mm(d: SectionDimensions): number {
  switch (d.family) {
    case 'I':
      return Math.max(d.topFlange.width_mm, d.bottomFlange.width_mm);
    case 'tube':
      return d.diameter_mm;
    default:
      return d.width_mm;
  }
}

/** Thickness of the plate(s) carrying shear parallel to y: the web, the stem, the vertical leg or the tube wall. */
export function webThickness_mm(d: SectionDimensions): number | null {
  switch (d.family) {
    case 'I':
    case 'channel':
    case 'tee':
    case 'box':
      return d.webThickness_mm;
    case 'angle':
      return d.thickness_mm;
    case 'tube':
      return d.wallThickness_mm;
    case 'plate':
    case 'other':
      return null;
  }
}

/**
 * The plates that carry shear parallel to y, for the average web stress reported beside the check: the clear web of an
 * I or channel, the stem of a tee, both webs of a box, the vertical leg of an angle, half a tube's wall.
 */
export function webShearArea_mm2(d: SectionDimensions): number {
  switch (d.family) {
    case 'I':
      return (d.depth_mm - d.topFlange.thickness_mm - d.bottomFlange.thickness_mm) * d.webThickness_mm;
    case 'channel':
      return (d.depth_mm - 2 * d.flangeThickness_mm) * d.webThickness_mm;
    case 'tee':
      return (d.depth_mm - d.flangeThickness_mm) * d.webThickness_mm;
    case 'box':
      return 2 * (d.depth_mm - 2 * d.flangeThickness_mm) * d.webThickness_mm;
    case 'angle':
      return d.depth_mm * d.thickness_mm;
    case 'tube':
      return (Math.PI * (d.diameter_mm - d.wallThickness_mm) * d.wallThickness_mm) / 2;
    case 'plate':
    case 'other':
      return d.depth_mm * d.width_mm;
  }
}

/** Thickness of the flange(s) (the top flange of an I), null for families without one. */
export function flangeThickness_mm(d: SectionDimensions): number | null {
  switch (d.family) {
    case 'I':
      return d.topFlange.thickness_mm;
    case 'channel':
    case 'tee':
    case 'box':
      return d.flangeThickness_mm;
    case 'angle':
      return d.widthLegThickness_mm ?? d.thickness_mm;
    default:
      return null;
  }
}

/** Thickest plate of the section, which sets the yield strength by thickness (EN 10025-2). */
export function thickestPlate_mm(d: SectionDimensions): number {
  switch (d.family) {
    case 'I':
      return Math.max(d.webThickness_mm, d.topFlange.thickness_mm, d.bottomFlange.thickness_mm);
    case 'channel':
    case 'tee':
    case 'box':
      return Math.max(d.webThickness_mm, d.flangeThickness_mm);
    case 'angle':
      return Math.max(d.thickness_mm, d.widthLegThickness_mm ?? 0);
    case 'tube':
      return d.wallThickness_mm;
    case 'plate':
    case 'other':
      return Math.min(d.depth_mm, d.width_mm);
  }
}

const mm = (value: number): string => String(Math.round(value * 100) / 100);

/** The dimensions in a short line, millimetres: 'd 300, tw 7.1, flanges 150×10.7'. */
export function dimensionsLabel(d: SectionDimensions): string {
  switch (d.family) {
    case 'I': {
      const { topFlange: top, bottomFlange: bottom } = d;
      const same = top.width_mm === bottom.width_mm && top.thickness_mm === bottom.thickness_mm;
      const flanges = same ? `${mm(top.width_mm)}×${mm(top.thickness_mm)}` : `${mm(top.width_mm)}×${mm(top.thickness_mm)} / ${mm(bottom.width_mm)}×${mm(bottom.thickness_mm)}`;
      return `d ${mm(d.depth_mm)}, tw ${mm(d.webThickness_mm)}, flanges ${flanges}`;
    }
    case 'channel':
    case 'tee':
      return `d ${mm(d.depth_mm)}, b ${mm(d.width_mm)}, tw ${mm(d.webThickness_mm)}, tf ${mm(d.flangeThickness_mm)}`;
    case 'box':
      return `${mm(d.depth_mm)}×${mm(d.width_mm)}, walls ${mm(d.webThickness_mm)}` + (d.flangeThickness_mm !== d.webThickness_mm ? ` / ${mm(d.flangeThickness_mm)}` : '');
    case 'angle':
      return `${mm(d.depth_mm)}×${mm(d.width_mm)}×${mm(d.thickness_mm)}`;
    case 'tube':
      return `Ø ${mm(d.diameter_mm)}×${mm(d.wallThickness_mm)}`;
    case 'plate':
      return `${mm(d.depth_mm)}×${mm(d.width_mm)}`;
    case 'other':
      return `${d.description}, ${mm(d.depth_mm)}×${mm(d.width_mm)}`;
  }
}

/** A point of a section outline, millimetres, in the section's x–y plane. */
export type Point2_mm = readonly [x: number, y: number];

/** A circular arc of the outline as the file wrote it; recognition reads root fillets and corner radii from these. */
export interface OutlineArc {
  centre: Point2_mm;
  radius_mm: number;
}

/**
 * A closed section outline: the outer loop counter-clockwise and each void clockwise, the closing point not repeated.
 * Arcs are already replaced by chords fine enough for section properties; `arcs` keeps the circles they came from.
 */
export interface SectionPolygon {
  outer: Point2_mm[];
  voids: Point2_mm[][];
  arcs?: OutlineArc[];
}
