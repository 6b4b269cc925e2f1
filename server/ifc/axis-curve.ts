/**
 * The curve of a member's Axis representation: start, end and length along the curve, in the representation's
 * coordinates and model units. Straight members are polylines or trimmed lines; curved ones trimmed circles,
 * indexed poly-curves with arc segments, or composite curves of these.
 */
import {
  IFCARCINDEX,
  IFCCARTESIANPOINTLIST2D,
  IFCCARTESIANPOINTLIST3D,
  IFCCIRCLE,
  IFCCOMPOSITECURVE,
  IFCINDEXEDPOLYCURVE,
  IFCLINE,
  IFCPOLYLINE,
  IFCTRIMMEDCURVE,
} from 'web-ifc';
import { add, cross, dot, norm, normalize, scale, subtract, transformPoint, type Vec3 } from './matrix4';
import { readAxisPlacement, readDirection, readPoint } from './placement-reader';
import { booleanOf, numberOf, numbersOf, refOf, refsOf, type StepLines, type StepValue } from './step-lines';

export interface AxisCurve {
  start: Vec3;
  end: Vec3;
  length: number;
  curved: boolean;
}

const MAX_DEPTH = 6;

function polylineThrough(points: readonly Vec3[]): AxisCurve | undefined {
  if (points.length < 2) return undefined;
  let length = 0;
  for (let i = 1; i < points.length; i++) length += norm(subtract(points[i], points[i - 1]));
  return { start: points[0], end: points[points.length - 1], length, curved: false };
}

/** Length of the circular arc from a through b to c (straight if the three are in line). */
function arcLength(a: Vec3, b: Vec3, c: Vec3): number {
  const ab = subtract(b, a);
  const ac = subtract(c, a);
  const normal = cross(ab, ac);
  const area2 = norm(normal);
  const chord = norm(ac);
  if (area2 < 1e-12 * (norm(ab) * chord || 1)) return norm(ab) + norm(subtract(c, b));
  const radius = (norm(ab) * norm(subtract(c, b)) * chord) / (2 * area2);
  // Angle at the centre subtended by a→c, on the side through b.
  const half = Math.asin(Math.min(1, chord / (2 * radius)));
  const bOnMinorArc = dot(subtract(b, a), subtract(b, c)) < 0;
  return radius * (bOnMinorArc ? 2 * half : 2 * Math.PI - 2 * half);
}

function pointList(lines: StepLines, id: number | undefined): Vec3[] {
  const line = lines.line(id);
  if (!line || (line.type !== IFCCARTESIANPOINTLIST3D && line.type !== IFCCARTESIANPOINTLIST2D)) return [];
  const rows = Array.isArray(line.args[0]) ? line.args[0] : [];
  return rows.map((row) => {
    const [x, y, z] = numbersOf(row);
    return [x, y, z ?? 0] as Vec3;
  });
}

/** IfcIndexedPolyCurve: straight runs and three-point arcs over a point list (1-based indices). */
function indexedPolyCurve(lines: StepLines, args: StepValue[]): AxisCurve | undefined {
  const points = pointList(lines, refOf(args[0]));
  const segments = Array.isArray(args[1]) ? args[1] : [];
  if (segments.length === 0) return polylineThrough(points);
  let length = 0;
  let curved = false;
  let first: Vec3 | undefined;
  let last: Vec3 | undefined;
  for (const segment of segments) {
    const v = segment !== null && !Array.isArray(segment) ? segment.value : undefined;
    const indices = Array.isArray(v) ? numbersOf(v as StepValue[]) : [];
    const at = indices.map((i) => points[i - 1]);
    if (at.length < 2 || at.some((p) => !p)) return undefined;
    first ??= at[0];
    last = at[at.length - 1];
    if (at.length === 3 && segment !== null && !Array.isArray(segment) && segment.typecode === IFCARCINDEX) {
      length += arcLength(at[0], at[1], at[2]);
      curved = true;
    } else {
      length += polylineThrough(at)?.length ?? 0;
    }
  }
  return first && last ? { start: first, end: last, length, curved } : undefined;
}

/** One trimming select: its parameter and/or its point. */
function trimOf(lines: StepLines, value: StepValue | undefined): { parameter?: number; point?: Vec3 } {
  const values = Array.isArray(value) ? value : [];
  let parameter: number | undefined;
  let point: Vec3 | undefined;
  for (const v of values) {
    const ref = refOf(v);
    if (ref !== undefined) point = readPoint(lines, ref);
    else parameter ??= numberOf(v);
  }
  return { parameter, point };
}

function trimmedCurve(lines: StepLines, args: StepValue[], radiansPerAngleUnit: number, depth: number): AxisCurve | undefined {
  const basis = lines.line(refOf(args[0]));
  const t1 = trimOf(lines, args[1]);
  const t2 = trimOf(lines, args[2]);
  const sense = booleanOf(args[3]) ?? true;
  if (!basis) return undefined;
  if (basis.type === IFCLINE) {
    const origin = readPoint(lines, refOf(basis.args[0])) ?? [0, 0, 0];
    const vectorLine = lines.line(refOf(basis.args[1]));
    const direction = readDirection(lines, refOf(vectorLine?.args[0]));
    const magnitude = numberOf(vectorLine?.args[1]) ?? 1;
    const along = (t: number | undefined): Vec3 | undefined =>
      t === undefined || !direction ? undefined : add(origin, scale(normalize(direction) ?? [1, 0, 0], t * magnitude));
    const start = t1.point ?? along(t1.parameter);
    const end = t2.point ?? along(t2.parameter);
    return start && end ? { start, end, length: norm(subtract(end, start)), curved: false } : undefined;
  }
  if (basis.type === IFCCIRCLE) {
    const frame = readAxisPlacement(lines, refOf(basis.args[0]));
    const radius = numberOf(basis.args[1]);
    if (!(radius && radius > 0)) return undefined;
    const centre: Vec3 = [frame[12], frame[13], frame[14]];
    const x: Vec3 = [frame[0], frame[1], frame[2]];
    const y: Vec3 = [frame[4], frame[5], frame[6]];
    const angleOf = (trim: { parameter?: number; point?: Vec3 }): number | undefined => {
      if (trim.parameter !== undefined) return trim.parameter * radiansPerAngleUnit;
      if (!trim.point) return undefined;
      const d = subtract(trim.point, centre);
      return Math.atan2(dot(d, y), dot(d, x));
    };
    const a1 = angleOf(t1);
    const a2 = angleOf(t2);
    if (a1 === undefined || a2 === undefined) return undefined;
    const turn = 2 * Math.PI;
    const span = (((sense ? a2 - a1 : a1 - a2) % turn) + turn) % turn || turn;
    const at = (a: number): Vec3 => transformPoint(frame, [radius * Math.cos(a), radius * Math.sin(a), 0]);
    return { start: t1.point ?? at(a1), end: t2.point ?? at(a2), length: radius * span, curved: true };
  }
  return depth < MAX_DEPTH ? axisCurve(lines, basis.id, radiansPerAngleUnit, depth + 1) : undefined;
}

function compositeCurve(lines: StepLines, args: StepValue[], radiansPerAngleUnit: number, depth: number): AxisCurve | undefined {
  let result: AxisCurve | undefined;
  for (const segmentId of refsOf(args[0])) {
    const segment = lines.line(segmentId);
    const part = segment ? axisCurve(lines, refOf(segment.args[2]), radiansPerAngleUnit, depth + 1) : undefined;
    if (!part) return undefined;
    const sameSense = booleanOf(segment?.args[1]) ?? true;
    const [from, to] = sameSense ? [part.start, part.end] : [part.end, part.start];
    result = result
      ? { start: result.start, end: to, length: result.length + part.length, curved: result.curved || part.curved }
      : { start: from, end: to, length: part.length, curved: part.curved };
  }
  return result;
}

/** The curve of one Axis representation item, or undefined when it is not a curve this reader knows. */
export function axisCurve(lines: StepLines, itemId: number | undefined, radiansPerAngleUnit: number, depth = 0): AxisCurve | undefined {
  const item = lines.line(itemId);
  if (!item || depth > MAX_DEPTH) return undefined;
  switch (item.type) {
    case IFCPOLYLINE:
      return polylineThrough(refsOf(item.args[0]).map((id) => readPoint(lines, id)).filter((p): p is Vec3 => p !== undefined));
    case IFCTRIMMEDCURVE:
      return trimmedCurve(lines, item.args, radiansPerAngleUnit, depth);
    case IFCINDEXEDPOLYCURVE:
      return indexedPolyCurve(lines, item.args);
    case IFCCOMPOSITECURVE:
      return compositeCurve(lines, item.args, radiansPerAngleUnit, depth);
    default:
      return undefined;
  }
}
