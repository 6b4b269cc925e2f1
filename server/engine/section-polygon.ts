/**
 * Plane geometry of section outlines: exact properties of a polygon with voids, the checks and clean-up that make an
 * outline from a file or a body cut safe to measure, alignment of a cut that comes in any in-plane orientation, and
 * the crossings of a straight line with the outline that recognition measures with.
 *
 * Properties use the polygon-moment formulas that follow from Green's theorem (exact for straight edges; arcs are
 * already chords here): for each edge with cᵢ = xᵢyᵢ₊₁ − xᵢ₊₁yᵢ,
 *   A = ½Σcᵢ, ∫x dA = ⅙Σcᵢ(xᵢ + xᵢ₊₁), ∫x² dA = 1⁄12 Σcᵢ(xᵢ² + xᵢxᵢ₊₁ + xᵢ₊₁²),
 *   ∫xy dA = 1⁄24 Σcᵢ(xᵢyᵢ₊₁ + 2xᵢyᵢ + 2xᵢ₊₁yᵢ₊₁ + xᵢ₊₁yᵢ), and likewise in y.
 */
import type { OutlineArc, Point2_mm, SectionPolygon } from './section-family';

export interface Bounds_mm {
  minX_mm: number;
  maxX_mm: number;
  minY_mm: number;
  maxY_mm: number;
}

export interface PolygonProperties {
  area_mm2: number;
  centroid_mm: Point2_mm;
  /** Second moments about the axes through the centroid parallel to x and y: ∫(y − ȳ)² dA and ∫(x − x̄)² dA. */
  ix_mm4: number;
  iy_mm4: number;
  /** Product of area ∫(x − x̄)(y − ȳ) dA; zero when x or y is an axis of symmetry. */
  ixy_mm4: number;
  /** Angle from +x to the principal axis with the larger second moment, in (−π/2, π/2]. */
  principalAngle_rad: number;
  iMajor_mm4: number;
  iMinor_mm4: number;
  bounds: Bounds_mm;
}

type Loop = readonly Point2_mm[];

export function loopBounds(loop: Loop): Bounds_mm {
  let minX_mm = Infinity;
  let maxX_mm = -Infinity;
  let minY_mm = Infinity;
  let maxY_mm = -Infinity;
  for (const [x, y] of loop) {
    if (x < minX_mm) minX_mm = x;
    if (x > maxX_mm) maxX_mm = x;
    if (y < minY_mm) minY_mm = y;
    if (y > maxY_mm) maxY_mm = y;
  }
  return loop.length === 0 ? { minX_mm: 0, maxX_mm: 0, minY_mm: 0, maxY_mm: 0 } : { minX_mm, maxX_mm, minY_mm, maxY_mm };
}

/** Signed area of one loop: positive when counter-clockwise. */
export function signedArea_mm2(loop: Loop): number {
  let twice = 0;
  for (let i = 0; i < loop.length; i++) {
    const [x0, y0] = loop[i];
    const [x1, y1] = loop[(i + 1) % loop.length];
    twice += x0 * y1 - x1 * y0;
  }
  return twice / 2;
}

interface RawMoments {
  a: number;
  sx: number;
  sy: number;
  xx: number;
  yy: number;
  xy: number;
}

/** Area integrals of one loop about (ox, oy), signed by its orientation. Shifting the origin keeps large coordinates exact. */
function loopMoments(loop: Loop, ox: number, oy: number): RawMoments {
  const m: RawMoments = { a: 0, sx: 0, sy: 0, xx: 0, yy: 0, xy: 0 };
  for (let i = 0; i < loop.length; i++) {
    const x0 = loop[i][0] - ox;
    const y0 = loop[i][1] - oy;
    const next = loop[(i + 1) % loop.length];
    const x1 = next[0] - ox;
    const y1 = next[1] - oy;
    const c = x0 * y1 - x1 * y0;
    m.a += c;
    m.sx += c * (x0 + x1);
    m.sy += c * (y0 + y1);
    m.xx += c * (x0 * x0 + x0 * x1 + x1 * x1);
    m.yy += c * (y0 * y0 + y0 * y1 + y1 * y1);
    m.xy += c * (x0 * y1 + 2 * x0 * y0 + 2 * x1 * y1 + x1 * y0);
  }
  return { a: m.a / 2, sx: m.sx / 6, sy: m.sy / 6, xx: m.xx / 12, yy: m.yy / 12, xy: m.xy / 24 };
}

/**
 * Area, centroid and centroidal second moments of the outline; voids subtract whatever their orientation. A loop
 * with no area gives zeros (and the centroid at the centre of the bounds), never NaN.
 */
export function polygonProperties(p: SectionPolygon): PolygonProperties {
  const bounds = loopBounds(p.outer);
  const ox = (bounds.minX_mm + bounds.maxX_mm) / 2;
  const oy = (bounds.minY_mm + bounds.maxY_mm) / 2;
  const total: RawMoments = { a: 0, sx: 0, sy: 0, xx: 0, yy: 0, xy: 0 };
  const add = (loop: Loop, solid: boolean): void => {
    const m = loopMoments(loop, ox, oy);
    // Orientation decides the sign of the raw sums; a void always removes material.
    const sign = (m.a >= 0) === solid ? 1 : -1;
    for (const key of Object.keys(total) as (keyof RawMoments)[]) total[key] += sign * m[key];
  };
  add(p.outer, true);
  for (const v of p.voids) add(v, false);
  if (!(total.a > 0)) {
    return { area_mm2: 0, centroid_mm: [ox, oy], ix_mm4: 0, iy_mm4: 0, ixy_mm4: 0, principalAngle_rad: 0, iMajor_mm4: 0, iMinor_mm4: 0, bounds };
  }
  const cx = total.sx / total.a;
  const cy = total.sy / total.a;
  const ix_mm4 = total.yy - total.a * cy * cy;
  const iy_mm4 = total.xx - total.a * cx * cx;
  const ixy_mm4 = total.xy - total.a * cx * cy;
  // I(θ) about an axis at θ is (Ix+Iy)/2 + (Ix−Iy)/2·cos2θ − Ixy·sin2θ; its maximum is where this angle points.
  const half = (ix_mm4 - iy_mm4) / 2;
  const radius = Math.hypot(half, ixy_mm4);
  const principal = radius === 0 ? 0 : Math.atan2(-ixy_mm4, half) / 2;
  return {
    area_mm2: total.a,
    centroid_mm: [cx + ox, cy + oy],
    ix_mm4,
    iy_mm4,
    ixy_mm4,
    principalAngle_rad: principal <= -Math.PI / 2 ? principal + Math.PI : principal,
    iMajor_mm4: (ix_mm4 + iy_mm4) / 2 + radius,
    iMinor_mm4: (ix_mm4 + iy_mm4) / 2 - radius,
    bounds,
  };
}

// ---------------------------------------------------------------------------------------------------------------
// Normalising

export type NormalisedPolygon = { status: 'valid'; polygon: SectionPolygon } | { status: 'invalid'; reason: string };

/** Points closer than this fraction of the outline's size are the same point; the same for "on a line". */
const SAME_POINT_RELATIVE = 1e-9;

function distanceFromLine(p: Point2_mm, a: Point2_mm, b: Point2_mm): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const length = Math.hypot(dx, dy);
  if (length === 0) return Math.hypot(p[0] - a[0], p[1] - a[1]);
  return Math.abs(dx * (p[1] - a[1]) - dy * (p[0] - a[0])) / length;
}

/** Drops repeated points (the closing point too) and points on the line through their neighbours, spikes included. */
function cleanLoop(loop: Loop, eps: number): Point2_mm[] {
  const points = [...loop];
  let k = 0;
  let unchanged = 0;
  while (points.length >= 3 && unchanged < points.length) {
    const n = points.length;
    k %= n;
    const prev = points[(k + n - 1) % n];
    const p = points[k];
    const next = points[(k + 1) % n];
    const repeated = Math.abs(p[0] - next[0]) <= eps && Math.abs(p[1] - next[1]) <= eps;
    const spikeTip = Math.abs(prev[0] - next[0]) <= eps && Math.abs(prev[1] - next[1]) <= eps;
    if (repeated || spikeTip || distanceFromLine(p, prev, next) <= eps) {
      points.splice(k, 1);
      // Removing a point can make its predecessor collinear or repeated: look at it again.
      k = k === 0 ? points.length - 1 : k - 1;
      unchanged = 0;
    } else {
      k++;
      unchanged++;
    }
  }
  return points;
}

interface Segment {
  loop: number;
  index: number;
  a: Point2_mm;
  b: Point2_mm;
  minY: number;
  maxY: number;
}

function sideOf(p: Point2_mm, a: Point2_mm, b: Point2_mm): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  return (dx * (p[1] - a[1]) - dy * (p[0] - a[0])) / Math.hypot(dx, dy);
}

function onSegment(p: Point2_mm, a: Point2_mm, b: Point2_mm, eps: number): boolean {
  if (Math.abs(sideOf(p, a, b)) > eps) return false;
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const t = ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / (dx * dx + dy * dy);
  return t >= 0 && t <= 1;
}

/** Whether two segments cross or touch (an end within eps of the other segment). */
function segmentsMeet(s: Segment, t: Segment, eps: number): boolean {
  const d1 = sideOf(s.a, t.a, t.b);
  const d2 = sideOf(s.b, t.a, t.b);
  const d3 = sideOf(t.a, s.a, s.b);
  const d4 = sideOf(t.b, s.a, s.b);
  const crosses = ((d1 > eps && d2 < -eps) || (d1 < -eps && d2 > eps)) && ((d3 > eps && d4 < -eps) || (d3 < -eps && d4 > eps));
  return crosses || onSegment(s.a, t.a, t.b, eps) || onSegment(s.b, t.a, t.b, eps) || onSegment(t.a, s.a, s.b, eps) || onSegment(t.b, s.a, s.b, eps);
}

function adjacent(s: Segment, t: Segment, loopLengths: readonly number[]): boolean {
  if (s.loop !== t.loop) return false;
  const n = loopLengths[s.loop];
  return (s.index + 1) % n === t.index || (t.index + 1) % n === s.index;
}

/** The first pair of edges (of any loops) that cross or touch, other than neighbours sharing their corner. */
function firstMeetingEdges(loops: readonly Loop[], eps: number): [Segment, Segment] | undefined {
  const segments: Segment[] = [];
  loops.forEach((loop, l) =>
    loop.forEach((a, i) => {
      const b = loop[(i + 1) % loop.length];
      segments.push({ loop: l, index: i, a, b, minY: Math.min(a[1], b[1]), maxY: Math.max(a[1], b[1]) });
    }),
  );
  // Sweep in y: only segments whose y ranges overlap can meet.
  segments.sort((s, t) => s.minY - t.minY);
  const lengths = loops.map((loop) => loop.length);
  for (let i = 0; i < segments.length; i++) {
    const s = segments[i];
    for (let j = i + 1; j < segments.length && segments[j].minY <= s.maxY + eps; j++) {
      const t = segments[j];
      if (Math.min(s.a[0], s.b[0]) > Math.max(t.a[0], t.b[0]) + eps || Math.min(t.a[0], t.b[0]) > Math.max(s.a[0], s.b[0]) + eps) continue;
      if (!adjacent(s, t, lengths) && segmentsMeet(s, t, eps)) return [s, t];
    }
  }
  return undefined;
}

/** Even–odd test; the point must not lie on the loop (callers test loops that do not meet). */
export function insideLoop(point: Point2_mm, loop: Loop): boolean {
  let inside = false;
  const [px, py] = point;
  for (let i = 0, j = loop.length - 1; i < loop.length; j = i++) {
    const [xi, yi] = loop[i];
    const [xj, yj] = loop[j];
    if (yi > py !== yj > py && px < ((xj - xi) * (py - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

function allFinite(loop: Loop): boolean {
  return loop.every((p) => Array.isArray(p) && p.length >= 2 && Number.isFinite(p[0]) && Number.isFinite(p[1]));
}

function describeLoop(loop: number): string {
  return loop === 0 ? 'the outline' : `opening ${loop}`;
}

/**
 * The outline ready to measure: outer loop counter-clockwise, voids clockwise, repeated and collinear points dropped.
 * Invalid outlines get a reason in plain words: too few points, no area, edges that cross, a void outside the outline.
 */
export function normalisePolygon(p: SectionPolygon): NormalisedPolygon {
  if (!p || !Array.isArray(p.outer) || !Array.isArray(p.voids ?? [])) return { status: 'invalid', reason: 'The section outline is missing.' };
  const loops = [p.outer, ...(p.voids ?? [])];
  if (!loops.every((loop) => Array.isArray(loop) && allFinite(loop))) {
    return { status: 'invalid', reason: 'The section outline has a point whose coordinates are not numbers.' };
  }
  const b = loopBounds(p.outer);
  const eps = SAME_POINT_RELATIVE * Math.max(b.maxX_mm - b.minX_mm, b.maxY_mm - b.minY_mm, 1e-300);
  const cleaned = loops.map((loop) => cleanLoop(loop, eps));
  for (let l = 0; l < cleaned.length; l++) {
    if (cleaned[l].length < 3) {
      return { status: 'invalid', reason: `${capitalise(describeLoop(l))} has fewer than 3 distinct corners, so it encloses no area.` };
    }
  }
  const meeting = firstMeetingEdges(cleaned, eps);
  if (meeting) {
    const [s, t] = meeting;
    const where = s.loop === t.loop ? `${describeLoop(s.loop)} crosses itself` : `${describeLoop(s.loop)} and ${describeLoop(t.loop)} cross or touch`;
    return { status: 'invalid', reason: `The section outline is not a simple closed shape: ${where} near (${fmt(t.a[0])}, ${fmt(t.a[1])}) mm.` };
  }
  const outerArea = signedArea_mm2(cleaned[0]);
  const outer = outerArea < 0 ? [...cleaned[0]].reverse() : cleaned[0];
  const voids: Point2_mm[][] = [];
  for (let l = 1; l < cleaned.length; l++) {
    const loop = cleaned[l];
    if (!insideLoop(loop[0], outer)) return { status: 'invalid', reason: `Opening ${l} of the section lies outside its outline.` };
    const nest = cleaned.findIndex((other, o) => o > 0 && o !== l && insideLoop(loop[0], other));
    if (nest > 0) return { status: 'invalid', reason: `Opening ${l} of the section lies inside opening ${nest}.` };
    voids.push(signedArea_mm2(loop) > 0 ? [...loop].reverse() : loop);
  }
  // Arcs only refine radii: malformed ones are dropped rather than refused.
  const arcs = Array.isArray(p.arcs) ? p.arcs.filter((a) => a && allFinite([a.centre]) && Number.isFinite(a.radius_mm) && a.radius_mm > 0) : [];
  const polygon: SectionPolygon = arcs.length > 0 ? { outer, voids, arcs } : { outer, voids };
  if (!(polygonProperties(polygon).area_mm2 > eps * eps)) return { status: 'invalid', reason: 'The section outline encloses no area.' };
  return { status: 'valid', polygon };
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

function fmt(value_mm: number): string {
  return String(Math.round(value_mm * 10) / 10);
}

// ---------------------------------------------------------------------------------------------------------------
// Placing

/** The outline turned by `rotation_rad` (counter-clockwise) about `centre_mm`, which then lies at the origin. */
export function transformPolygon(p: SectionPolygon, rotation_rad: number, centre_mm: Point2_mm): SectionPolygon {
  const c = Math.cos(rotation_rad);
  const s = Math.sin(rotation_rad);
  const [ox, oy] = centre_mm;
  const move = ([x, y]: Point2_mm): Point2_mm => [c * (x - ox) - s * (y - oy), s * (x - ox) + c * (y - oy)];
  return withLoops(p, move);
}

/** The outline turned by k quarter turns counter-clockwise about the origin, exactly (no trigonometry). */
export function quarterTurn(p: SectionPolygon, k: number): SectionPolygon {
  const turns = ((k % 4) + 4) % 4;
  const move = ([x, y]: Point2_mm): Point2_mm => (turns === 0 ? [x, y] : turns === 1 ? [-y, x] : turns === 2 ? [-x, -y] : [y, -x]);
  return withLoops(p, move);
}

function withLoops(p: SectionPolygon, move: (point: Point2_mm) => Point2_mm): SectionPolygon {
  const moved: SectionPolygon = { outer: p.outer.map(move), voids: p.voids.map((v) => v.map(move)) };
  if (p.arcs) moved.arcs = p.arcs.map((a): OutlineArc => ({ centre: move(a.centre), radius_mm: a.radius_mm }));
  return moved;
}

/** Edges within this angle of the first estimate settle the alignment, so sloped flange faces do not tilt it. */
const ALIGN_REFINE_RAD = (2 * Math.PI) / 180;

/** Length-weighted mean edge direction modulo 90°, from the directions with their angle multiplied by four. */
function dominantDirection_rad(loops: readonly Loop[], near_rad?: number): number {
  let c4 = 0;
  let s4 = 0;
  for (const loop of loops) {
    for (let i = 0; i < loop.length; i++) {
      const dx = loop[(i + 1) % loop.length][0] - loop[i][0];
      const dy = loop[(i + 1) % loop.length][1] - loop[i][1];
      const length = Math.hypot(dx, dy);
      if (length === 0) continue;
      const c = dx / length;
      const s = dy / length;
      // cos 2θ, sin 2θ, then cos 4θ, sin 4θ: axis-parallel edges give exactly (1, 0).
      const c2 = c * c - s * s;
      const s2 = 2 * c * s;
      const cos4 = c2 * c2 - s2 * s2;
      const sin4 = 2 * c2 * s2;
      if (near_rad !== undefined && Math.cos(Math.atan2(sin4, cos4) - 4 * near_rad) < Math.cos(4 * ALIGN_REFINE_RAD)) continue;
      c4 += length * cos4;
      s4 += length * sin4;
    }
  }
  return c4 === 0 && s4 === 0 ? (near_rad ?? 0) : Math.atan2(s4, c4) / 4;
}

export interface AlignedPolygon {
  polygon: SectionPolygon;
  /** Counter-clockwise rotation applied: aligned = R(rotation)·(input − centre). In (−π/4, π/4]. */
  rotation_rad: number;
  /** Centre of the aligned bounding box, in the input's coordinates. */
  centre_mm: Point2_mm;
}

/**
 * The outline turned so that its dominant edge directions (length-weighted, modulo 90°) lie along x and y, and moved
 * so that its bounding box is centred on the origin. A cut of a body comes in any in-plane orientation.
 */
export function alignToEdges(p: SectionPolygon): AlignedPolygon {
  const loops = [p.outer, ...p.voids];
  const first = dominantDirection_rad(loops);
  const direction = dominantDirection_rad(loops, first);
  const rotation_rad = Math.abs(direction) < 1e-12 ? 0 : -direction;
  const turned = transformPolygon(p, rotation_rad, [0, 0]);
  const b = loopBounds(turned.outer);
  const mid: Point2_mm = [(b.minX_mm + b.maxX_mm) / 2, (b.minY_mm + b.maxY_mm) / 2];
  const c = Math.cos(-rotation_rad);
  const s = Math.sin(-rotation_rad);
  return {
    polygon: transformPolygon(turned, 0, mid),
    rotation_rad,
    centre_mm: [c * mid[0] - s * mid[1], s * mid[0] + c * mid[1]],
  };
}

// ---------------------------------------------------------------------------------------------------------------
// Measuring along lines

/** Where a line crosses an edge: the coordinate along the line and the edge's end points. */
export interface Crossing {
  at_mm: number;
  from: Point2_mm;
  to: Point2_mm;
}

/**
 * Crossings of the horizontal line at level y (axis 'y') or of the vertical line at x (axis 'x') with every loop,
 * sorted along the line. Half-open edges (one end counted, the other not) keep a line through a corner honest.
 */
export function crossings(p: SectionPolygon, axis: 'x' | 'y', level_mm: number): Crossing[] {
  const across = axis === 'y' ? 1 : 0;
  const along = 1 - across;
  const found: Crossing[] = [];
  for (const loop of [p.outer, ...p.voids]) {
    for (let i = 0; i < loop.length; i++) {
      const from = loop[i];
      const to = loop[(i + 1) % loop.length];
      const a = from[across];
      const b = to[across];
      if ((a <= level_mm && level_mm < b) || (b <= level_mm && level_mm < a)) {
        const t = (level_mm - a) / (b - a);
        found.push({ at_mm: from[along] + t * (to[along] - from[along]), from, to });
      }
    }
  }
  return found.sort((u, v) => u.at_mm - v.at_mm);
}

/** The solid stretches of the horizontal line at y (axis 'y') or the vertical line at x (axis 'x'), in order. */
export function intervals(p: SectionPolygon, axis: 'x' | 'y', level_mm: number): [number, number][] {
  const found = crossings(p, axis, level_mm);
  const result: [number, number][] = [];
  for (let i = 0; i + 1 < found.length; i += 2) result.push([found[i].at_mm, found[i + 1].at_mm]);
  return result;
}

/** Total solid width of the section at level y: the width function b(y) of elastic shear-stress methods. */
export function widthAtY_mm(p: SectionPolygon, y_mm: number): number {
  return intervals(p, 'y', y_mm).reduce((sum, [a, b]) => sum + (b - a), 0);
}
