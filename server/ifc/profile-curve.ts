/**
 * The closed curve of a profile outline (IfcArbitraryClosedProfileDef's OuterCurve, each of its InnerCurves), read in
 * two steps so that the chord tolerance can follow the profile's size: `readClosedPath` reads the curve into exact
 * pieces in millimetres (straight runs and conic arcs) and checks that they join into a loop; `pathLoop` then replaces
 * the arcs by chords no farther than a sagitta from the true curve and keeps each circle it came from.
 *
 * Curves read: IfcPolyline; IfcTrimmedCurve on IfcLine, IfcCircle or IfcEllipse (trims by parameter and/or point,
 * MasterRepresentation, SenseAgreement); IfcCompositeCurve of IfcCompositeCurveSegment (SameSense .F. reverses the
 * parent), nested; IfcIndexedPolyCurve (IFC4) with IfcLineIndex / IfcArcIndex segments or none; a whole IfcCircle or
 * IfcEllipse. Attribute positions are the same in IFC2X3, IFC4 and IFC4X3 for all of these.
 */
import {
  IFCARCINDEX,
  IFCCARTESIANPOINT,
  IFCCARTESIANPOINTLIST2D,
  IFCCARTESIANPOINTLIST3D,
  IFCCIRCLE,
  IFCCOMPOSITECURVE,
  IFCCOMPOSITECURVESEGMENT,
  IFCELLIPSE,
  IFCINDEXEDPOLYCURVE,
  IFCLINE,
  IFCPOLYLINE,
  IFCTRIMMEDCURVE,
} from 'web-ifc';
import type { OutlineArc, Point2_mm, SectionPolygon } from '../engine/section-family';
import type { Mat4 } from './matrix4';
import { readAxisPlacement } from './placement-reader';
import { booleanOf, enumOf, numberOf, numbersOf, refOf, refsOf, type StepLines, type StepValue } from './step-lines';

/** A straight run through two or more points. */
export interface PolylinePiece {
  kind: 'polyline';
  points: Point2_mm[];
}

/**
 * An arc of a circle or ellipse: centre + a·cos t·u + b·sin t·v for t from start_rad over sweep_rad (negative runs
 * clockwise in the conic's own frame). u and v are unit vectors at right angles; v is not always u turned +90°.
 */
export interface ConicPiece {
  kind: 'conic';
  centre: Point2_mm;
  u: Point2_mm;
  v: Point2_mm;
  a_mm: number;
  b_mm: number;
  start_rad: number;
  sweep_rad: number;
}

export type PathPiece = PolylinePiece | ConicPiece;

export type ClosedPath = { ok: true; pieces: PathPiece[] } | { ok: false; reason: string };

export interface CurveUnits {
  scaleToMm: number;
  radiansPerAngleUnit: number;
}

/** A closed loop of points (closing point not repeated) and the circles its arcs came from. */
export interface CurveLoop {
  points: Point2_mm[];
  arcs: OutlineArc[];
}

const TURN = 2 * Math.PI;
const MAX_NESTING = 6;
/** Pieces whose ends are closer than this share of the path's extent are taken to meet (exporters round coordinates). */
const JOIN_TOLERANCE = 1e-4;

class CurveError extends Error {}

class PathReader {
  constructor(
    private readonly lines: StepLines,
    private readonly units: CurveUnits,
  ) {}

  point(id: number | undefined): Point2_mm {
    const line = this.lines.line(id);
    if (line?.type !== IFCCARTESIANPOINT) throw new CurveError(`point #${id ?? '?'} is missing`);
    return this.coordinates(line.args[0], id);
  }

  coordinates(value: StepValue | undefined, id: number | undefined): Point2_mm {
    const [x, y] = numbersOf(value);
    if (!Number.isFinite(x) || !Number.isFinite(y)) throw new CurveError(`point #${id ?? '?'} has no coordinates`);
    return [x * this.units.scaleToMm, y * this.units.scaleToMm];
  }

  length(value: StepValue | undefined, attribute: string, id: number): number {
    const v = numberOf(value);
    if (v === undefined || !(v > 0)) throw new CurveError(`#${id} has no positive ${attribute}`);
    return v * this.units.scaleToMm;
  }

  curve(id: number | undefined, nesting: number): PathPiece[] {
    const line = this.lines.line(id);
    if (!line) throw new CurveError(`curve #${id ?? '?'} is missing`);
    if (nesting > MAX_NESTING) throw new CurveError(`curve #${line.id} is nested too deeply`);
    switch (line.type) {
      case IFCPOLYLINE:
        return [this.polyline(refsOf(line.args[0]).map((p) => this.point(p)), line.id)];
      case IFCCOMPOSITECURVE:
        return this.composite(line.args, line.id, nesting);
      case IFCTRIMMEDCURVE:
        return [this.trimmed(line.args, line.id)];
      case IFCINDEXEDPOLYCURVE:
        return this.indexed(line.args, line.id);
      case IFCCIRCLE:
      case IFCELLIPSE:
        return [{ ...this.conic(line.type, line.args, line.id), start_rad: 0, sweep_rad: TURN }];
      default:
        throw new CurveError(`it is drawn with ${this.lines.typeName(line.type)}, which is not read`);
    }
  }

  polyline(points: Point2_mm[], id: number): PolylinePiece {
    if (points.length < 2) throw new CurveError(`polyline #${id} has fewer than two points`);
    return { kind: 'polyline', points };
  }

  composite(args: StepValue[], id: number, nesting: number): PathPiece[] {
    const segments = refsOf(args[0]);
    if (segments.length === 0) throw new CurveError(`composite curve #${id} has no segments`);
    const pieces: PathPiece[] = [];
    for (const segmentId of segments) {
      const segment = this.lines.line(segmentId);
      if (segment?.type !== IFCCOMPOSITECURVESEGMENT) {
        throw new CurveError(`segment #${segmentId} of composite curve #${id} is not an IfcCompositeCurveSegment`);
      }
      const parent = this.curve(refOf(segment.args[2]), nesting + 1);
      pieces.push(...((booleanOf(segment.args[1]) ?? true) ? parent : reversed(parent)));
    }
    return pieces;
  }

  /** Centre, axes and semi-axes of an IfcCircle or IfcEllipse, its Position (2D or 3D) read in the x–y plane. */
  conic(type: number, args: StepValue[], id: number): Omit<ConicPiece, 'start_rad' | 'sweep_rad'> {
    const frame = readAxisPlacement(this.lines, refOf(args[0]));
    const s = this.units.scaleToMm;
    const a_mm = this.length(args[1], type === IFCCIRCLE ? 'Radius' : 'SemiAxis1', id);
    const b_mm = type === IFCCIRCLE ? a_mm : this.length(args[2], 'SemiAxis2', id);
    return { kind: 'conic', centre: [frame[12] * s, frame[13] * s], u: unit(frame[0], frame[1]), v: unit(frame[4], frame[5]), a_mm, b_mm };
  }

  trimmed(args: StepValue[], id: number): PathPiece {
    const basis = this.lines.line(refOf(args[0]));
    if (!basis) throw new CurveError(`trimmed curve #${id} has no basis curve`);
    const sense = booleanOf(args[3]) ?? true;
    // Points unless the file prefers parameters: exporters disagree on the angle unit of conic parameters.
    const preferPoint = enumOf(args[4]) !== 'PARAMETER';
    const trims = [trimSelect(args[1]), trimSelect(args[2])];
    if (basis.type === IFCLINE) {
      const origin = this.point(refOf(basis.args[0]));
      const vector = this.lines.line(refOf(basis.args[1]));
      const [dx, dy] = numbersOf(this.lines.line(refOf(vector?.args[0]))?.args[0]);
      const magnitude = (numberOf(vector?.args[1]) ?? 1) * this.units.scaleToMm;
      // hypot is NaN for a missing direction and 0 for a zero one: neither gives a direction.
      const direction = Math.hypot(dx, dy) > 0 ? unit(dx, dy) : undefined;
      const ends = trims.map(({ point, parameter }) => {
        if (point !== undefined && (preferPoint || parameter === undefined || !direction)) return this.point(point);
        if (parameter === undefined || !direction) throw new CurveError(`trimmed line #${id} has a trim without point or parameter`);
        return [origin[0] + direction[0] * parameter * magnitude, origin[1] + direction[1] * parameter * magnitude] as Point2_mm;
      });
      return { kind: 'polyline', points: ends };
    }
    if (basis.type !== IFCCIRCLE && basis.type !== IFCELLIPSE) {
      throw new CurveError(`trimmed curve #${id} trims ${this.lines.typeName(basis.type)}, which is not read`);
    }
    const conic = this.conic(basis.type, basis.args, basis.id);
    const [t1, t2] = trims.map(({ point, parameter }) => {
      if (parameter !== undefined && (!preferPoint || point === undefined)) return parameter * this.units.radiansPerAngleUnit;
      if (point === undefined) throw new CurveError(`trimmed curve #${id} has a trim without point or parameter`);
      return conicParameter(conic, this.point(point));
    });
    // Equal trims mean the whole conic, not nothing.
    const ccw = positiveAngle(sense ? t2 - t1 : t1 - t2) || TURN;
    return { ...conic, start_rad: t1, sweep_rad: sense ? ccw : -ccw };
  }

  /** IfcIndexedPolyCurve: runs and three-point arcs over a point list, 1-based indices; no segments is one polyline. */
  indexed(args: StepValue[], id: number): PathPiece[] {
    const list = this.lines.line(refOf(args[0]));
    if (list?.type !== IFCCARTESIANPOINTLIST2D && list?.type !== IFCCARTESIANPOINTLIST3D) {
      throw new CurveError(`indexed poly-curve #${id} has no point list`);
    }
    const rows = Array.isArray(list.args[0]) ? list.args[0] : [];
    const points = rows.map((row) => this.coordinates(row, list.id));
    const segments = Array.isArray(args[1]) ? args[1] : [];
    if (segments.length === 0) return [this.polyline(points, id)];
    return segments.map((segment) => {
      const typed = segment !== null && !Array.isArray(segment) ? segment : undefined;
      const at = numbersOf(Array.isArray(typed?.value) ? (typed.value as StepValue[]) : undefined).map((i) => points[i - 1]);
      if (at.length < 2 || at.some((p) => p === undefined)) throw new CurveError(`indexed poly-curve #${id} has a segment with a bad index`);
      if (typed?.typecode === IFCARCINDEX) {
        if (at.length !== 3) throw new CurveError(`indexed poly-curve #${id} has an arc that is not given by three points`);
        return arcThrough(at[0], at[1], at[2]);
      }
      return { kind: 'polyline', points: at };
    });
  }
}

function unit(x: number, y: number): Point2_mm {
  const n = Math.hypot(x, y);
  return [x / n, y / n];
}

function positiveAngle(a: number): number {
  return ((a % TURN) + TURN) % TURN;
}

function trimSelect(value: StepValue | undefined): { point?: number; parameter?: number } {
  const trim: { point?: number; parameter?: number } = {};
  for (const v of Array.isArray(value) ? value : []) {
    const ref = refOf(v);
    if (ref !== undefined) trim.point = ref;
    else trim.parameter ??= numberOf(v);
  }
  return trim;
}

/** Parameter t of the conic point nearest p, read from its angle in the conic's frame (exact on the conic). */
function conicParameter(c: Omit<ConicPiece, 'start_rad' | 'sweep_rad'>, p: Point2_mm): number {
  const dx = p[0] - c.centre[0];
  const dy = p[1] - c.centre[1];
  return Math.atan2((dx * c.v[0] + dy * c.v[1]) / c.b_mm, (dx * c.u[0] + dy * c.u[1]) / c.a_mm);
}

/** The circular arc from a through b to c; three points in line make a straight run. */
function arcThrough(a: Point2_mm, b: Point2_mm, c: Point2_mm): PathPiece {
  const bx = b[0] - a[0];
  const by = b[1] - a[1];
  const cx = c[0] - a[0];
  const cy = c[1] - a[1];
  const d = 2 * (bx * cy - by * cx);
  const size = Math.hypot(cx, cy) || Math.hypot(bx, by);
  if (Math.abs(d) <= 1e-12 * size * size) return { kind: 'polyline', points: [a, b, c] };
  const b2 = bx * bx + by * by;
  const c2 = cx * cx + cy * cy;
  const centre: Point2_mm = [a[0] + (cy * b2 - by * c2) / d, a[1] + (bx * c2 - cx * b2) / d];
  const angle = (p: Point2_mm): number => Math.atan2(p[1] - centre[1], p[0] - centre[0]);
  const start = angle(a);
  // d > 0: a → b → c turns counter-clockwise.
  const ccw = positiveAngle(angle(c) - start);
  const r = Math.hypot(a[0] - centre[0], a[1] - centre[1]);
  return { kind: 'conic', centre, u: [1, 0], v: [0, 1], a_mm: r, b_mm: r, start_rad: start, sweep_rad: d > 0 ? ccw : ccw - TURN };
}

function reversed(pieces: PathPiece[]): PathPiece[] {
  return pieces
    .slice()
    .reverse()
    .map((p) =>
      p.kind === 'polyline' ? { kind: 'polyline', points: p.points.slice().reverse() } : { ...p, start_rad: p.start_rad + p.sweep_rad, sweep_rad: -p.sweep_rad },
    );
}

function conicPoint(c: ConicPiece, t: number): Point2_mm {
  const ca = c.a_mm * Math.cos(t);
  const sb = c.b_mm * Math.sin(t);
  return [c.centre[0] + ca * c.u[0] + sb * c.v[0], c.centre[1] + ca * c.u[1] + sb * c.v[1]];
}

function startOf(p: PathPiece): Point2_mm {
  return p.kind === 'polyline' ? p.points[0] : conicPoint(p, p.start_rad);
}

function endOf(p: PathPiece): Point2_mm {
  return p.kind === 'polyline' ? p.points[p.points.length - 1] : conicPoint(p, p.start_rad + p.sweep_rad);
}

/** Largest of width and height of the box around the path's piece ends and whole conics (enough for a tolerance). */
export function pathExtent_mm(pieces: readonly PathPiece[]): number {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  const take = (x: number, y: number): void => {
    minX = Math.min(minX, x);
    maxX = Math.max(maxX, x);
    minY = Math.min(minY, y);
    maxY = Math.max(maxY, y);
  };
  for (const p of pieces) {
    if (p.kind === 'polyline') for (const [x, y] of p.points) take(x, y);
    else {
      const r = Math.max(p.a_mm, p.b_mm);
      take(p.centre[0] - r, p.centre[1] - r);
      take(p.centre[0] + r, p.centre[1] + r);
    }
  }
  return Math.max(maxX - minX, maxY - minY, 0);
}

/**
 * Reads the curve with this id into pieces that join end to start and close, in millimetres. A curve that is not
 * read, a missing point, or a gap gives a plain reason instead.
 */
export function readClosedPath(lines: StepLines, curveId: number | undefined, units: CurveUnits): ClosedPath {
  let pieces: PathPiece[];
  try {
    pieces = new PathReader(lines, units).curve(curveId, 0);
  } catch (error) {
    if (error instanceof CurveError) return { ok: false, reason: error.message };
    throw error;
  }
  const tolerance = JOIN_TOLERANCE * pathExtent_mm(pieces);
  for (let i = 0; i < pieces.length; i++) {
    const end = endOf(pieces[i]);
    const next = startOf(pieces[(i + 1) % pieces.length]);
    const gap = Math.hypot(next[0] - end[0], next[1] - end[1]);
    if (!(gap <= tolerance)) {
      const where = i === pieces.length - 1 ? 'between its end and its start' : `after its piece ${i + 1} of ${pieces.length}`;
      return { ok: false, reason: `it is open: a gap of ${round(gap)} mm ${where}, at (${round(end[0])}, ${round(end[1])}) mm` };
    }
  }
  return { ok: true, pieces };
}

function round(v: number): number {
  return Math.round(v * 1000) / 1000;
}

/**
 * Parameter step along a conic whose chord stays within `sagitta_mm` of it: exact for a circle, and for an ellipse
 * the circle of its flattest curvature radius (a³/b² for a ≥ b bounds the chord error from above).
 */
function conicStep_rad(c: ConicPiece, sagitta_mm: number): number {
  const big = Math.max(c.a_mm, c.b_mm);
  const small = Math.min(c.a_mm, c.b_mm);
  const radius = (big * big * big) / (small * small);
  return 2 * Math.acos(1 - Math.min(1, sagitta_mm / radius));
}

/**
 * The loop of points through a closed path: every piece's points but its last (the next piece starts there), arcs
 * as chords within `sagitta_mm`, repeated points dropped. Each circular arc's circle is listed once.
 */
export function pathLoop(pieces: readonly PathPiece[], sagitta_mm: number): CurveLoop {
  const points: Point2_mm[] = [];
  const arcs: OutlineArc[] = [];
  const push = (p: Point2_mm): void => {
    const last = points[points.length - 1];
    if (!last || last[0] !== p[0] || last[1] !== p[1]) points.push(p);
  };
  for (const piece of pieces) {
    if (piece.kind === 'polyline') {
      for (let i = 0; i < piece.points.length - 1; i++) push(piece.points[i]);
      continue;
    }
    const n = Math.max(1, Math.ceil(Math.abs(piece.sweep_rad) / conicStep_rad(piece, sagitta_mm)));
    for (let i = 0; i < n; i++) push(conicPoint(piece, piece.start_rad + (piece.sweep_rad * i) / n));
    if (piece.a_mm === piece.b_mm && !arcs.some((a) => sameCircle(a, piece))) arcs.push({ centre: piece.centre, radius_mm: piece.a_mm });
  }
  const first = points[0];
  const last = points[points.length - 1];
  if (points.length > 1 && first[0] === last[0] && first[1] === last[1]) points.pop();
  return { points, arcs };
}

function sameCircle(a: OutlineArc, c: ConicPiece): boolean {
  return a.radius_mm === c.a_mm && a.centre[0] === c.centre[0] && a.centre[1] === c.centre[1];
}

/** Twice the signed area of a loop: positive when it runs counter-clockwise. */
export function signedDoubleArea_mm2(points: readonly Point2_mm[]): number {
  let sum = 0;
  for (let i = 0, j = points.length - 1; i < points.length; j = i++) sum += points[j][0] * points[i][1] - points[i][0] * points[j][1];
  return sum;
}

/** The loop turned to run counter-clockwise (ccw true) or clockwise; the same array when it already does. */
export function oriented(points: Point2_mm[], ccw: boolean): Point2_mm[] {
  return signedDoubleArea_mm2(points) > 0 === ccw ? points : points.slice().reverse();
}

/**
 * The polygon through a 2D operator (x' = m·x, origin in model units): points and arcs moved, loops turned back to
 * outer counter-clockwise and voids clockwise (a mirror reverses them). Arcs stay only under a similarity, which
 * keeps circles circles.
 */
export function transformedPolygon(polygon: SectionPolygon, m: Mat4, scaleToMm: number): SectionPolygon {
  const at = ([x, y]: Point2_mm): Point2_mm => [m[0] * x + m[4] * y + m[12] * scaleToMm, m[1] * x + m[5] * y + m[13] * scaleToMm];
  const sx = Math.hypot(m[0], m[1]);
  const similar = Math.abs(sx - Math.hypot(m[4], m[5])) <= 1e-9 * sx && Math.abs(m[0] * m[4] + m[1] * m[5]) <= 1e-9 * sx * sx;
  const arcs = similar ? polygon.arcs?.map((a) => ({ centre: at(a.centre), radius_mm: a.radius_mm * sx })) : undefined;
  return {
    outer: oriented(polygon.outer.map(at), true),
    voids: polygon.voids.map((v) => oriented(v.map(at), false)),
    ...(arcs?.length ? { arcs } : {}),
  };
}
