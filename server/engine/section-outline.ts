/**
 * The idealised outline of a section from its family dimensions: root fillets, toe radii and corner radii as chords
 * whose distance from the true arc stays within a given tolerance, sloped flange faces, centred on the bounding box
 * as IFC places parameterised profiles. The I case follows the engine's own geometry (`flangeGeometry`), so that the
 * drawn section is the one the check computes.
 */
import { type FlangeGeometry, type FlangeInput, SectionInputError, flangeGeometry, validateSection } from './section';
import type {
  AngleDimensions,
  BoxDimensions,
  ChannelDimensions,
  IDimensions,
  OutlineArc,
  Point2_mm,
  SectionDimensions,
  SectionPolygon,
  TeeDimensions,
  TubeDimensions,
} from './section-family';

/** A circle drawn with fewer chords than this does not look like one, whatever the tolerance. */
const MIN_CIRCLE_CHORDS = 8;
/** Guards against a tolerance so small that an outline would need millions of points. */
const MAX_ARC_CHORDS = 4096;

/** A path being drawn: its points (mm) and the arcs it went round. */
interface Path {
  points: Point2_mm[];
  arcs: OutlineArc[];
}

/** Number of chords for an arc of `sweep_rad` so that no chord strays more than the tolerance from it. */
export function chordCount(radius_mm: number, sweep_rad: number, chordTolerance_mm: number): number {
  const ratio = Math.min(1, chordTolerance_mm / radius_mm);
  const perChord_rad = 2 * Math.acos(1 - ratio);
  return Math.min(MAX_ARC_CHORDS, Math.max(1, Math.ceil(Math.abs(sweep_rad) / perChord_rad - 1e-9)));
}

/** Appends an arc from angle a0 to a1 (radians, either way round) including both ends; a zero radius adds its centre. */
function addArc(path: Path, centre: Point2_mm, radius_mm: number, a0: number, a1: number, chordTolerance_mm: number): void {
  if (radius_mm <= 0) {
    path.points.push(centre);
    return;
  }
  const n = chordCount(radius_mm, a1 - a0, chordTolerance_mm);
  for (let i = 0; i <= n; i++) {
    const a = a0 + ((a1 - a0) * i) / n;
    path.points.push([centre[0] + radius_mm * Math.cos(a), centre[1] + radius_mm * Math.sin(a)]);
  }
  path.arcs.push({ centre, radius_mm });
}

/**
 * One flange outstand in its own frame — u out from the web axis, z in from the flange's outer face — from the point
 * where the root fillet leaves the web face, round the fillet, along the (sloped) inner face, round the toe and down
 * the tip to the outer corner.
 */
function flangeQuarter(g: FlangeGeometry, chordTolerance_mm: number): Path {
  const path: Path = { points: [], arcs: [] };
  const alpha = Math.atan(g.slopeTan);
  const r = g.filletRadius_mm;
  addArc(path, [g.webHalf_mm + r, g.filletWebTangent_mm], r, Math.PI, 1.5 * Math.PI - alpha, chordTolerance_mm);
  const r2 = g.edgeRadius_mm;
  addArc(path, [g.halfWidth_mm - r2, g.edgeCentre_mm], r2, Math.PI / 2 - alpha, 0, chordTolerance_mm);
  path.points.push([g.halfWidth_mm, 0]);
  return path;
}

/** Maps a path point by point (arcs' centres too), optionally reversing its direction. */
function mapped(path: Path, move: (p: Point2_mm) => Point2_mm, reverse = false): Path {
  const points = path.points.map(move);
  return { points: reverse ? points.reverse() : points, arcs: path.arcs.map((a) => ({ centre: move(a.centre), radius_mm: a.radius_mm })) };
}

/** Joins paths into one loop, dropping points that repeat their predecessor (zero radii draw corners twice). */
function loopOf(paths: readonly Path[], scale_mm: number): Path {
  const eps = 1e-12 * scale_mm;
  const points: Point2_mm[] = [];
  for (const p of paths.flatMap((path) => path.points)) {
    const last = points[points.length - 1];
    if (!last || Math.abs(p[0] - last[0]) > eps || Math.abs(p[1] - last[1]) > eps) points.push(p);
  }
  while (points.length > 1 && Math.abs(points[0][0] - points[points.length - 1][0]) <= eps && Math.abs(points[0][1] - points[points.length - 1][1]) <= eps) {
    points.pop();
  }
  return { points, arcs: paths.flatMap((path) => path.arcs) };
}

const point = (x: number, y: number): Path => ({ points: [[x, y]], arcs: [] });

function polygonOf(outer: Path, voids: readonly Path[] = []): SectionPolygon {
  return { outer: outer.points, voids: voids.map((v) => v.points), arcs: [...outer.arcs, ...voids.flatMap((v) => v.arcs)] };
}

function iOutline(d: IDimensions, tol: number): SectionPolygon {
  const { top, bottom } = validateSection({ ...d, fabrication: 'rolled' });
  const h = d.depth_mm / 2;
  const bottomQuarter = flangeQuarter(bottom, tol);
  const topQuarter = flangeQuarter(top, tol);
  const outer = loopOf(
    [
      mapped(bottomQuarter, ([u, z]) => [u, -h + z], true),
      mapped(topQuarter, ([u, z]) => [u, h - z]),
      mapped(topQuarter, ([u, z]) => [-u, h - z], true),
      mapped(bottomQuarter, ([u, z]) => [-u, -h + z]),
    ],
    d.depth_mm,
  );
  return polygonOf(outer);
}

function requireFinite(d: object): void {
  for (const [field, value] of Object.entries(d)) {
    if (field === 'family' || field === 'description' || value === undefined) continue;
    if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
      throw new SectionInputError(field, `must be a finite number of millimetres (or radians) not below 0, got ${String(value)}`);
    }
  }
}

function requireBelow(value: number, field: string, limit: number, limitName: string): void {
  if (!(value > 0)) throw new SectionInputError(field, `must be greater than 0, got ${value}`);
  if (!(value < limit)) throw new SectionInputError(field, `(${value} mm) must be less than ${limitName} (${limit} mm)`);
}

/** A flange with the web on one side only (channel, tee): the engine's flange geometry checked for fit. */
function outstandGeometry(flange: FlangeInput, webThickness_mm: number, fields: { slope: string; edge: string }): FlangeGeometry {
  const g = flangeGeometry(flange, webThickness_mm);
  if (g.tipThickness_mm <= 0) throw new SectionInputError(fields.slope, 'is so steep that the flange tip has no thickness');
  if (g.filletFaceTangentX_mm > g.halfWidth_mm + 1e-9) throw new SectionInputError('rootRadius_mm', 'does not fit on the flange');
  if (g.edgeCentre_mm < -1e-9) throw new SectionInputError(fields.edge, 'is larger than the flange tip thickness');
  if (g.edgeFaceTangentX_mm < g.filletFaceTangentX_mm - 1e-9) throw new SectionInputError(fields.edge, 'overlaps the root fillet');
  return g;
}

function channelOutline(d: ChannelDimensions, tol: number): SectionPolygon {
  requireFinite(d);
  requireBelow(d.webThickness_mm, 'webThickness_mm', d.width_mm, 'the width');
  requireBelow(d.flangeThickness_mm, 'flangeThickness_mm', d.depth_mm / 2, 'half the depth');
  // A channel flange is one half of an I flange twice as wide on a web twice as thick: u runs from the web's back.
  const g = outstandGeometry(
    { width_mm: 2 * d.width_mm, thickness_mm: d.flangeThickness_mm, filletRadius_mm: d.rootRadius_mm, edgeRadius_mm: d.edgeRadius_mm, slope_rad: d.slope_rad },
    2 * d.webThickness_mm,
    { slope: 'slope_rad', edge: 'edgeRadius_mm' },
  );
  if (2 * g.filletWebTangent_mm > d.depth_mm) throw new SectionInputError('rootRadius_mm', 'the root fillets overlap on the web');
  const h = d.depth_mm / 2;
  const x0 = -d.width_mm / 2;
  const quarter = flangeQuarter(g, tol);
  const outer = loopOf(
    [point(x0, -h), mapped(quarter, ([u, z]) => [x0 + u, -h + z], true), mapped(quarter, ([u, z]) => [x0 + u, h - z]), point(x0, h)],
    d.depth_mm,
  );
  return polygonOf(outer);
}

function teeOutline(d: TeeDimensions, tol: number): SectionPolygon {
  requireFinite(d);
  if (d.webSlope_rad) throw new SectionInputError('webSlope_rad', 'a tapered stem is not drawn; only parallel stems are supported');
  requireBelow(d.webThickness_mm, 'webThickness_mm', d.width_mm, 'the flange width');
  requireBelow(d.flangeThickness_mm, 'flangeThickness_mm', d.depth_mm, 'the depth');
  const g = outstandGeometry(
    { width_mm: d.width_mm, thickness_mm: d.flangeThickness_mm, filletRadius_mm: d.rootRadius_mm, edgeRadius_mm: d.flangeEdgeRadius_mm, slope_rad: d.flangeSlope_rad },
    d.webThickness_mm,
    { slope: 'flangeSlope_rad', edge: 'flangeEdgeRadius_mm' },
  );
  const h = d.depth_mm / 2;
  const w = d.webThickness_mm / 2;
  const r3 = d.webEdgeRadius_mm ?? 0;
  if (r3 > w) throw new SectionInputError('webEdgeRadius_mm', 'is larger than half the stem thickness');
  if (g.filletWebTangent_mm + r3 > d.depth_mm) throw new SectionInputError('rootRadius_mm', 'leaves no straight stem');
  const quarter = flangeQuarter(g, tol);
  const stemRight: Path = { points: [], arcs: [] };
  addArc(stemRight, [w - r3, -h + r3], r3, -Math.PI / 2, 0, tol);
  const stemLeft = mapped(stemRight, ([x, y]) => [-x, y], true);
  const outer = loopOf(
    [stemRight, mapped(quarter, ([u, z]) => [u, h - z]), mapped(quarter, ([u, z]) => [-u, h - z], true), stemLeft],
    d.depth_mm,
  );
  return polygonOf(outer);
}

function angleOutline(d: AngleDimensions, tol: number): SectionPolygon {
  requireFinite(d);
  const t = d.thickness_mm;
  const t2 = d.widthLegThickness_mm ?? t;
  requireBelow(t, 'thickness_mm', d.width_mm, 'the width');
  requireBelow(t2, 'widthLegThickness_mm', d.depth_mm, 'the depth');
  const r = d.rootRadius_mm;
  const r2 = d.edgeRadius_mm ?? 0;
  if (r2 > Math.min(t, t2)) throw new SectionInputError('edgeRadius_mm', 'is larger than the leg thickness');
  if (t + r > d.width_mm - r2 || t2 + r > d.depth_mm - r2) throw new SectionInputError('rootRadius_mm', 'does not fit on the legs');
  const h = d.depth_mm / 2;
  const b = d.width_mm / 2;
  const path: Path = { points: [[-b, -h], [b, -h]], arcs: [] };
  addArc(path, [b - r2, -h + t2 - r2], r2, 0, Math.PI / 2, tol);
  addArc(path, [-b + t + r, -h + t2 + r], r, -Math.PI / 2, -Math.PI, tol);
  addArc(path, [-b + t - r2, h - r2], r2, 0, Math.PI / 2, tol);
  path.points.push([-b, h]);
  return polygonOf(loopOf([path], d.depth_mm));
}

/** Rectangle with rounded corners centred on the origin, counter-clockwise. */
function roundedRectangle(width_mm: number, depth_mm: number, radius_mm: number, tol: number): Path {
  const path: Path = { points: [], arcs: [] };
  const x = width_mm / 2 - radius_mm;
  const y = depth_mm / 2 - radius_mm;
  const q = Math.PI / 2;
  addArc(path, [x, -y], radius_mm, -q, 0, tol);
  addArc(path, [x, y], radius_mm, 0, q, tol);
  addArc(path, [-x, y], radius_mm, q, 2 * q, tol);
  addArc(path, [-x, -y], radius_mm, 2 * q, 3 * q, tol);
  return loopOf([path], Math.max(width_mm, depth_mm));
}

function boxOutline(d: BoxDimensions, tol: number): SectionPolygon {
  requireFinite(d);
  requireBelow(d.webThickness_mm, 'webThickness_mm', d.width_mm / 2, 'half the width');
  requireBelow(d.flangeThickness_mm, 'flangeThickness_mm', d.depth_mm / 2, 'half the depth');
  const innerWidth = d.width_mm - 2 * d.webThickness_mm;
  const innerDepth = d.depth_mm - 2 * d.flangeThickness_mm;
  const ro = d.outerCornerRadius_mm ?? 0;
  const ri = d.innerCornerRadius_mm ?? 0;
  if (2 * ro > Math.min(d.width_mm, d.depth_mm)) throw new SectionInputError('outerCornerRadius_mm', 'is larger than half the smaller side');
  if (2 * ri > Math.min(innerWidth, innerDepth)) throw new SectionInputError('innerCornerRadius_mm', 'is larger than half the smaller opening side');
  const outer = roundedRectangle(d.width_mm, d.depth_mm, ro, tol);
  const inner = roundedRectangle(innerWidth, innerDepth, ri, tol);
  return polygonOf(outer, [{ points: inner.points.reverse(), arcs: inner.arcs }]);
}

function circle(radius_mm: number, tol: number): Path {
  const n = Math.max(MIN_CIRCLE_CHORDS, chordCount(radius_mm, 2 * Math.PI, tol));
  const points: Point2_mm[] = [];
  for (let i = 0; i < n; i++) points.push([radius_mm * Math.cos((2 * Math.PI * i) / n), radius_mm * Math.sin((2 * Math.PI * i) / n)]);
  return { points, arcs: [{ centre: [0, 0], radius_mm }] };
}

function tubeOutline(d: TubeDimensions, tol: number): SectionPolygon {
  requireFinite(d);
  requireBelow(d.wallThickness_mm, 'wallThickness_mm', d.diameter_mm / 2, 'the radius');
  const inner = circle(d.diameter_mm / 2 - d.wallThickness_mm, tol);
  return polygonOf(circle(d.diameter_mm / 2, tol), [{ points: inner.points.reverse(), arcs: inner.arcs }]);
}

/**
 * The section's outline (outer loop counter-clockwise, voids clockwise, every arc listed in `arcs`) with no chord
 * further than `chordTolerance_mm` from its arc. Throws SectionInputError for dimensions that do not make a section,
 * and for 'other', whose dimensions give only its extent.
 */
export function sectionOutline(d: SectionDimensions, chordTolerance_mm: number): SectionPolygon {
  if (!(chordTolerance_mm > 0) || !Number.isFinite(chordTolerance_mm)) {
    throw new SectionInputError('chordTolerance_mm', `must be a finite number greater than 0, got ${chordTolerance_mm}`);
  }
  switch (d.family) {
    case 'I':
      return iOutline(d, chordTolerance_mm);
    case 'channel':
      return channelOutline(d, chordTolerance_mm);
    case 'tee':
      return teeOutline(d, chordTolerance_mm);
    case 'angle':
      return angleOutline(d, chordTolerance_mm);
    case 'box':
      return boxOutline(d, chordTolerance_mm);
    case 'tube':
      return tubeOutline(d, chordTolerance_mm);
    case 'plate':
      requireFinite(d);
      if (!(d.depth_mm > 0 && d.width_mm > 0)) throw new SectionInputError('depth_mm', 'a plate needs a depth and a width greater than 0');
      return polygonOf(roundedRectangle(d.width_mm, d.depth_mm, 0, chordTolerance_mm));
    case 'other':
      throw new SectionInputError('family', `a section of family 'other' (${d.description}) has no idealised outline`);
  }
}
