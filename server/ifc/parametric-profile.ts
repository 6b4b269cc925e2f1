/**
 * Parametric profiles of the families other than I (IfcUShapeProfileDef, IfcTShapeProfileDef, IfcLShapeProfileDef,
 * IfcCShapeProfileDef, IfcZShapeProfileDef, IfcRectangleHollowProfileDef, IfcCircleHollowProfileDef,
 * IfcRectangleProfileDef, IfcCircleProfileDef) read into that family's dimensions.
 *
 * Their parameters start at position 3 (after ProfileType, ProfileName, Position) in the same order in IFC2X3, IFC4
 * and IFC4X3; IFC2X3 adds CentreOfGravityInX/Y at the end of U, T, L and C, which are not needed and not read. The
 * profile's Position moves the section in the member and does not change its dimensions.
 */
import {
  IFCCIRCLEHOLLOWPROFILEDEF,
  IFCCIRCLEPROFILEDEF,
  IFCCSHAPEPROFILEDEF,
  IFCLSHAPEPROFILEDEF,
  IFCRECTANGLEHOLLOWPROFILEDEF,
  IFCRECTANGLEPROFILEDEF,
  IFCTSHAPEPROFILEDEF,
  IFCUSHAPEPROFILEDEF,
  IFCZSHAPEPROFILEDEF,
} from 'web-ifc';
import type { SectionDimensions } from '../engine/section-family';

/** Attribute values by name: lengths in millimetres, slopes in radians, undefined when not written. */
type Values = Record<string, number | undefined>;

interface FamilyReader {
  /** Attribute names from position 3 on, in schema order. */
  attributes: readonly string[];
  required: readonly string[];
  /** Why the values cannot make this section, or undefined when they can. */
  impossible(v: Values): string | undefined;
  dimensions(v: Values): SectionDimensions;
}

/** Optional members only when written, so a reading never holds `undefined` values. */
function optional(entries: Record<string, number | undefined>): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [key, value] of Object.entries(entries)) if (value !== undefined) out[key] = value;
  return out;
}

/** The first of the [thing, limit, words] comparisons where the thing is not smaller than its limit. */
function firstNotLess(checks: readonly [string, number, number, string][]): string | undefined {
  const failed = checks.find(([, value, limit]) => !(value < limit));
  return failed ? `${failed[0]} ${round(failed[1])} mm is not less than ${failed[3]} ${round(failed[2])} mm` : undefined;
}

function round(v: number): number {
  return Math.round(v * 1000) / 1000;
}

const n = (v: Values, key: string): number => v[key]!;

const FAMILIES = new Map<number, FamilyReader>([
  [
    IFCUSHAPEPROFILEDEF,
    {
      attributes: ['Depth', 'FlangeWidth', 'WebThickness', 'FlangeThickness', 'FilletRadius', 'EdgeRadius', 'FlangeSlope'],
      required: ['Depth', 'FlangeWidth', 'WebThickness', 'FlangeThickness'],
      impossible: (v) =>
        firstNotLess([
          ['twice the FlangeThickness', 2 * n(v, 'FlangeThickness'), n(v, 'Depth'), 'the Depth'],
          ['WebThickness', n(v, 'WebThickness'), n(v, 'FlangeWidth'), 'the FlangeWidth'],
        ]),
      dimensions: (v) => ({
        family: 'channel',
        depth_mm: n(v, 'Depth'),
        width_mm: n(v, 'FlangeWidth'),
        webThickness_mm: n(v, 'WebThickness'),
        flangeThickness_mm: n(v, 'FlangeThickness'),
        rootRadius_mm: v.FilletRadius ?? 0,
        ...optional({ edgeRadius_mm: v.EdgeRadius, slope_rad: v.FlangeSlope }),
      }),
    },
  ],
  [
    IFCTSHAPEPROFILEDEF,
    {
      attributes: ['Depth', 'FlangeWidth', 'WebThickness', 'FlangeThickness', 'FilletRadius', 'FlangeEdgeRadius', 'WebEdgeRadius', 'WebSlope', 'FlangeSlope'],
      required: ['Depth', 'FlangeWidth', 'WebThickness', 'FlangeThickness'],
      impossible: (v) =>
        firstNotLess([
          ['FlangeThickness', n(v, 'FlangeThickness'), n(v, 'Depth'), 'the Depth'],
          ['WebThickness', n(v, 'WebThickness'), n(v, 'FlangeWidth'), 'the FlangeWidth'],
        ]),
      dimensions: (v) => ({
        family: 'tee',
        depth_mm: n(v, 'Depth'),
        width_mm: n(v, 'FlangeWidth'),
        webThickness_mm: n(v, 'WebThickness'),
        flangeThickness_mm: n(v, 'FlangeThickness'),
        rootRadius_mm: v.FilletRadius ?? 0,
        ...optional({
          flangeEdgeRadius_mm: v.FlangeEdgeRadius,
          webEdgeRadius_mm: v.WebEdgeRadius,
          flangeSlope_rad: v.FlangeSlope,
          webSlope_rad: v.WebSlope,
        }),
      }),
    },
  ],
  [
    IFCLSHAPEPROFILEDEF,
    {
      // Width is optional: an equal angle may give only its Depth. LegSlope has no place in the angle's dimensions.
      attributes: ['Depth', 'Width', 'Thickness', 'FilletRadius', 'EdgeRadius', 'LegSlope'],
      required: ['Depth', 'Thickness'],
      impossible: (v) =>
        firstNotLess([
          ['Thickness', n(v, 'Thickness'), n(v, 'Depth'), 'the Depth'],
          ['Thickness', n(v, 'Thickness'), v.Width ?? n(v, 'Depth'), 'the Width'],
        ]),
      dimensions: (v) => ({
        family: 'angle',
        depth_mm: n(v, 'Depth'),
        width_mm: v.Width ?? n(v, 'Depth'),
        thickness_mm: n(v, 'Thickness'),
        rootRadius_mm: v.FilletRadius ?? 0,
        ...optional({ edgeRadius_mm: v.EdgeRadius }),
      }),
    },
  ],
  [
    IFCCSHAPEPROFILEDEF,
    {
      attributes: ['Depth', 'Width', 'WallThickness', 'Girth', 'InternalFilletRadius'],
      required: ['Depth', 'Width', 'WallThickness', 'Girth'],
      impossible: (v) =>
        firstNotLess([
          ['twice the WallThickness', 2 * n(v, 'WallThickness'), n(v, 'Depth'), 'the Depth'],
          ['WallThickness', n(v, 'WallThickness'), n(v, 'Width'), 'the Width'],
          ['twice the Girth', 2 * n(v, 'Girth'), n(v, 'Depth'), 'the Depth'],
        ]),
      dimensions: (v) => ({
        family: 'channel',
        depth_mm: n(v, 'Depth'),
        width_mm: n(v, 'Width'),
        webThickness_mm: n(v, 'WallThickness'),
        flangeThickness_mm: n(v, 'WallThickness'),
        rootRadius_mm: v.InternalFilletRadius ?? 0,
        lip_mm: n(v, 'Girth'),
      }),
    },
  ],
  [
    IFCZSHAPEPROFILEDEF,
    {
      attributes: ['Depth', 'FlangeWidth', 'WebThickness', 'FlangeThickness', 'FilletRadius', 'EdgeRadius'],
      required: ['Depth', 'FlangeWidth', 'WebThickness', 'FlangeThickness'],
      impossible: (v) =>
        firstNotLess([
          ['twice the FlangeThickness', 2 * n(v, 'FlangeThickness'), n(v, 'Depth'), 'the Depth'],
          ['WebThickness', n(v, 'WebThickness'), n(v, 'FlangeWidth'), 'the FlangeWidth'],
        ]),
      // Each FlangeWidth includes the web, so the flanges overlap by one web thickness (IFC figure, from memory).
      dimensions: (v) => ({
        family: 'other',
        depth_mm: n(v, 'Depth'),
        width_mm: 2 * n(v, 'FlangeWidth') - n(v, 'WebThickness'),
        description: 'Z-section',
      }),
    },
  ],
  [
    IFCRECTANGLEHOLLOWPROFILEDEF,
    {
      attributes: ['XDim', 'YDim', 'WallThickness', 'InnerFilletRadius', 'OuterFilletRadius'],
      required: ['XDim', 'YDim', 'WallThickness'],
      impossible: (v) =>
        firstNotLess([['twice the WallThickness', 2 * n(v, 'WallThickness'), Math.min(n(v, 'XDim'), n(v, 'YDim')), 'the smaller of XDim and YDim']]),
      dimensions: (v) => ({
        family: 'box',
        depth_mm: n(v, 'YDim'),
        width_mm: n(v, 'XDim'),
        webThickness_mm: n(v, 'WallThickness'),
        flangeThickness_mm: n(v, 'WallThickness'),
        ...optional({ outerCornerRadius_mm: v.OuterFilletRadius, innerCornerRadius_mm: v.InnerFilletRadius }),
      }),
    },
  ],
  [
    IFCCIRCLEHOLLOWPROFILEDEF,
    {
      attributes: ['Radius', 'WallThickness'],
      required: ['Radius', 'WallThickness'],
      impossible: (v) => firstNotLess([['WallThickness', n(v, 'WallThickness'), n(v, 'Radius'), 'the Radius']]),
      dimensions: (v) => ({ family: 'tube', diameter_mm: 2 * n(v, 'Radius'), wallThickness_mm: n(v, 'WallThickness') }),
    },
  ],
  [
    IFCRECTANGLEPROFILEDEF,
    {
      attributes: ['XDim', 'YDim'],
      required: ['XDim', 'YDim'],
      impossible: () => undefined,
      dimensions: (v) => ({ family: 'plate', depth_mm: n(v, 'YDim'), width_mm: n(v, 'XDim') }),
    },
  ],
  [
    IFCCIRCLEPROFILEDEF,
    {
      attributes: ['Radius'],
      required: ['Radius'],
      impossible: () => undefined,
      dimensions: (v) => ({ family: 'other', depth_mm: 2 * n(v, 'Radius'), width_mm: 2 * n(v, 'Radius'), description: 'solid round' }),
    },
  ],
]);

export function isParametricFamily(type: number): boolean {
  return FAMILIES.has(type);
}

/**
 * The dimensions of a parametric profile of type `type`, or why they cannot be read (missing or non-positive required
 * values by attribute name, or values that cannot make the section). `length(i)` / `angle(i)` read position i in
 * millimetres / radians.
 */
export function parametricDimensions(
  type: number,
  length: (position: number) => number | undefined,
  angle: (position: number) => number | undefined,
): { dimensions: SectionDimensions } | { problem: string } {
  const family = FAMILIES.get(type);
  if (!family) return { problem: 'it is not a parametric profile read here' };
  const values: Values = {};
  family.attributes.forEach((name, i) => (values[name] = name.endsWith('Slope') ? angle(3 + i) : length(3 + i)));
  const missing = family.required.filter((name) => !(values[name]! > 0));
  if (missing.length > 0) return { problem: `has no ${missing.join(', ')}` };
  const impossible = family.impossible(values);
  return impossible ? { problem: `cannot be built: ${impossible}` } : { dimensions: family.dimensions(values) };
}
