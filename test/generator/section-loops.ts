/**
 * Section outlines as closed loops of straight and circular segments, in millimetres in the profile's x–y plane
 * (origin at the centre of the bounding box, as IfcParameterizedProfileDef places it). One description feeds every
 * way the generator writes a section: curves with exact arcs, polylines with the arcs as a few chords, and bodies.
 * The outer loop runs counter-clockwise, voids clockwise.
 */
import type { SectionDimensions } from '../../server/engine/section-family';

export type Point2 = readonly [number, number];

export interface LineSegment {
  kind: 'line';
  from: Point2;
  to: Point2;
}

export interface ArcSegment {
  kind: 'arc';
  from: Point2;
  to: Point2;
  centre: Point2;
  radius_mm: number;
  /** Angle of `from` seen from the centre. */
  start_rad: number;
  /** Signed: positive counter-clockwise. */
  sweep_rad: number;
}

export type Segment = LineSegment | ArcSegment;
export type Loop = Segment[];

export interface SectionLoops {
  outer: Loop;
  voids: Loop[];
}

/** A corner of a polygon, rounded by a tangent arc when `radius_mm` > 0. */
export interface Corner {
  at: Point2;
  radius_mm?: number;
}

/** A Z-section (no SectionDimensions family of its own): web along y, top flange to +x, bottom flange to −x. */
export interface ZDimensions {
  family: 'z';
  depth_mm: number;
  flangeWidth_mm: number;
  webThickness_mm: number;
  flangeThickness_mm: number;
  rootRadius_mm: number;
}

export type DrawableSection = SectionDimensions | ZDimensions;

const sub = (a: Point2, b: Point2): Point2 => [a[0] - b[0], a[1] - b[1]];
const norm = (v: Point2): Point2 => {
  const l = Math.hypot(v[0], v[1]);
  return [v[0] / l, v[1] / l];
};

function arc(centre: Point2, radius_mm: number, from: Point2, to: Point2, sweep_rad: number): ArcSegment {
  return { kind: 'arc', from, to, centre, radius_mm, start_rad: Math.atan2(from[1] - centre[1], from[0] - centre[0]), sweep_rad };
}

/** The loop through the corners, each rounded corner replaced by the arc tangent to both of its edges. */
export function roundedLoop(corners: readonly Corner[]): Loop {
  const n = corners.length;
  const ends = corners.map((corner, i) => {
    const p = corner.at;
    const r = corner.radius_mm ?? 0;
    if (r <= 0) return { in: p, out: p, arc: undefined };
    const toPrev = norm(sub(corners[(i + n - 1) % n].at, p));
    const toNext = norm(sub(corners[(i + 1) % n].at, p));
    const half = Math.acos(Math.max(-1, Math.min(1, toPrev[0] * toNext[0] + toPrev[1] * toNext[1]))) / 2;
    const tangent = r / Math.tan(half);
    const bisector = norm([toPrev[0] + toNext[0], toPrev[1] + toNext[1]]);
    const centre: Point2 = [p[0] + (bisector[0] * r) / Math.sin(half), p[1] + (bisector[1] * r) / Math.sin(half)];
    const tIn: Point2 = [p[0] + toPrev[0] * tangent, p[1] + toPrev[1] * tangent];
    const tOut: Point2 = [p[0] + toNext[0] * tangent, p[1] + toNext[1] * tangent];
    // A left turn (convex corner of a counter-clockwise loop) is swept counter-clockwise.
    const turn = -toPrev[0] * toNext[1] + toPrev[1] * toNext[0];
    return { in: tIn, out: tOut, arc: arc(centre, r, tIn, tOut, Math.sign(turn) * (Math.PI - 2 * half)) };
  });
  const loop: Loop = [];
  ends.forEach((end, i) => {
    if (end.arc) loop.push(end.arc);
    const next = ends[(i + 1) % n].in;
    if (Math.hypot(next[0] - end.out[0], next[1] - end.out[1]) > 1e-9) loop.push({ kind: 'line', from: end.out, to: next });
  });
  return loop;
}

/** The same loop run the other way (a void is the reverse of the counter-clockwise loop of its shape). */
export function reversedLoop(loop: Loop): Loop {
  return loop
    .map((s): Segment => (s.kind === 'line' ? { kind: 'line', from: s.to, to: s.from } : arc(s.centre, s.radius_mm, s.to, s.from, -s.sweep_rad)))
    .reverse();
}

function circleLoop(radius_mm: number): Loop {
  // Two half circles, so that each arc has distinct ends.
  const right: Point2 = [radius_mm, 0];
  const left: Point2 = [-radius_mm, 0];
  return [arc([0, 0], radius_mm, right, left, Math.PI), arc([0, 0], radius_mm, left, right, Math.PI)];
}

function rectangleCorners(width_mm: number, depth_mm: number, radius_mm = 0): Corner[] {
  const x = width_mm / 2;
  const y = depth_mm / 2;
  const corners: Point2[] = [[-x, -y], [x, -y], [x, y], [-x, y]];
  return corners.map((at) => ({ at, radius_mm }));
}

/** A cold-formed lipped channel of one wall thickness: inside corners at radius r, outside corners at r + t. */
function lippedChannelLoop(h: number, x: number, t: number, r: number, lip: number): Loop {
  return roundedLoop([
    { at: [-x, -h], radius_mm: r + t },
    { at: [x, -h], radius_mm: r + t },
    { at: [x, -h + lip] },
    { at: [x - t, -h + lip] },
    { at: [x - t, -h + t], radius_mm: r },
    { at: [-x + t, -h + t], radius_mm: r },
    { at: [-x + t, h - t], radius_mm: r },
    { at: [x - t, h - t], radius_mm: r },
    { at: [x - t, h - lip] },
    { at: [x, h - lip] },
    { at: [x, h], radius_mm: r + t },
    { at: [-x, h], radius_mm: r + t },
  ]);
}

/** Loops of a section; throws for a family the generator does not draw. */
export function sectionLoops(d: DrawableSection): SectionLoops {
  switch (d.family) {
    case 'I': {
      const h = d.depth_mm / 2;
      const w = d.webThickness_mm / 2;
      const { topFlange: t, bottomFlange: b } = d;
      return {
        outer: roundedLoop([
          { at: [-b.width_mm / 2, -h] },
          { at: [b.width_mm / 2, -h] },
          { at: [b.width_mm / 2, -h + b.thickness_mm] },
          { at: [w, -h + b.thickness_mm], radius_mm: b.filletRadius_mm },
          { at: [w, h - t.thickness_mm], radius_mm: t.filletRadius_mm },
          { at: [t.width_mm / 2, h - t.thickness_mm] },
          { at: [t.width_mm / 2, h] },
          { at: [-t.width_mm / 2, h] },
          { at: [-t.width_mm / 2, h - t.thickness_mm] },
          { at: [-w, h - t.thickness_mm], radius_mm: t.filletRadius_mm },
          { at: [-w, -h + b.thickness_mm], radius_mm: b.filletRadius_mm },
          { at: [-b.width_mm / 2, -h + b.thickness_mm] },
        ]),
        voids: [],
      };
    }
    case 'channel': {
      const h = d.depth_mm / 2;
      const x = d.width_mm / 2;
      if (d.lip_mm) return { outer: lippedChannelLoop(h, x, d.webThickness_mm, d.rootRadius_mm, d.lip_mm), voids: [] };
      const web = -x + d.webThickness_mm;
      const r = d.rootRadius_mm;
      return {
        outer: roundedLoop([
          { at: [-x, -h] },
          { at: [x, -h] },
          { at: [x, -h + d.flangeThickness_mm] },
          { at: [web, -h + d.flangeThickness_mm], radius_mm: r },
          { at: [web, h - d.flangeThickness_mm], radius_mm: r },
          { at: [x, h - d.flangeThickness_mm] },
          { at: [x, h] },
          { at: [-x, h] },
        ]),
        voids: [],
      };
    }
    case 'tee': {
      const h = d.depth_mm / 2;
      const w = d.webThickness_mm / 2;
      const x = d.width_mm / 2;
      const r = d.rootRadius_mm;
      return {
        outer: roundedLoop([
          { at: [-w, -h] },
          { at: [w, -h] },
          { at: [w, h - d.flangeThickness_mm], radius_mm: r },
          { at: [x, h - d.flangeThickness_mm] },
          { at: [x, h] },
          { at: [-x, h] },
          { at: [-x, h - d.flangeThickness_mm] },
          { at: [-w, h - d.flangeThickness_mm], radius_mm: r },
        ]),
        voids: [],
      };
    }
    case 'angle': {
      const y = d.depth_mm / 2;
      const x = d.width_mm / 2;
      const t = d.thickness_mm;
      return {
        outer: roundedLoop([
          { at: [-x, -y] },
          { at: [x, -y] },
          { at: [x, -y + (d.widthLegThickness_mm ?? t)] },
          { at: [-x + t, -y + (d.widthLegThickness_mm ?? t)], radius_mm: d.rootRadius_mm },
          { at: [-x + t, y] },
          { at: [-x, y] },
        ]),
        voids: [],
      };
    }
    case 'box':
      return {
        outer: roundedLoop(rectangleCorners(d.width_mm, d.depth_mm, d.outerCornerRadius_mm)),
        voids: [reversedLoop(roundedLoop(rectangleCorners(d.width_mm - 2 * d.webThickness_mm, d.depth_mm - 2 * d.flangeThickness_mm, d.innerCornerRadius_mm)))],
      };
    case 'tube':
      return { outer: circleLoop(d.diameter_mm / 2), voids: [reversedLoop(circleLoop(d.diameter_mm / 2 - d.wallThickness_mm))] };
    case 'plate':
      return { outer: roundedLoop(rectangleCorners(d.width_mm, d.depth_mm)), voids: [] };
    case 'z': {
      const h = d.depth_mm / 2;
      const w = d.webThickness_mm / 2;
      const f = d.flangeThickness_mm;
      const r = d.rootRadius_mm;
      return {
        outer: roundedLoop([
          { at: [-w - d.flangeWidth_mm + d.webThickness_mm, -h] },
          { at: [w, -h] },
          { at: [w, h - f], radius_mm: r },
          { at: [-w + d.flangeWidth_mm, h - f] },
          { at: [-w + d.flangeWidth_mm, h] },
          { at: [-w, h] },
          { at: [-w, -h + f], radius_mm: r },
          { at: [w - d.flangeWidth_mm, -h + f] },
        ]),
        voids: [],
      };
    }
    case 'other':
      throw new Error(`the generator cannot draw '${d.description}' from its extent alone`);
  }
}

/** Points of a loop with each arc replaced by chords, `chordsPerQuarter` for a quarter circle (at least one per arc). */
export function chordedLoop(loop: Loop, chordsPerQuarter: number): Point2[] {
  const points: Point2[] = [];
  for (const s of loop) {
    points.push(s.from);
    if (s.kind !== 'arc') continue;
    const chords = Math.max(1, Math.ceil((Math.abs(s.sweep_rad) / (Math.PI / 2)) * chordsPerQuarter - 1e-9));
    for (let k = 1; k < chords; k++) {
      const a = s.start_rad + (s.sweep_rad * k) / chords;
      points.push([s.centre[0] + s.radius_mm * Math.cos(a), s.centre[1] + s.radius_mm * Math.sin(a)]);
    }
  }
  return points;
}

/** Mid point of an arc (the middle index of an IfcArcIndex). */
export function arcMidPoint(s: ArcSegment): Point2 {
  const a = s.start_rad + s.sweep_rad / 2;
  return [s.centre[0] + s.radius_mm * Math.cos(a), s.centre[1] + s.radius_mm * Math.sin(a)];
}
