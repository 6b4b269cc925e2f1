/**
 * The section of a member whose body has no profile (a brep or a tessellated set): the body is cut by planes normal to
 * the member axis at stations away from its ends, where cuts, copes and end plates would spoil the section, and the
 * section that repeats between stations is kept. A body whose stations all differ is a varying member and is refused:
 * guessing one of its sections could check the member with a section it does not have.
 */
import type { Point2_mm, SectionPolygon } from '../engine/section-family';
import { polygonProperties } from '../engine/section-polygon';
import { type BodyFaces, type HalfSpaceClip, readBodyFaces } from './body-faces';
import { add, cross, dot, type Mat4, normalize, scale, subtract, type Vec3 } from './matrix4';
import { type CutAxes, planeSection, toSectionPolygon } from './plane-section';
import type { StepLines } from './step-lines';

/** A body item without a profile, with the mapping transform that places it in the element (ElementShape.bodyItems). */
export interface BodyItem {
  itemId: number;
  type: number;
  transform: Mat4 | undefined;
}

export interface BodyCutOptions {
  /** Model units to millimetres. */
  scaleToMm: number;
  /** The member's Axis representation, element coordinates and model units, when it has one. */
  axis?: { start: Vec3; end: Vec3 };
}

/** The plane of the kept section: origin on the axis line through the section's centroid, at the body's start. */
export interface SectionFrame extends CutAxes {
  origin: Vec3;
}

export type BodyCut =
  | {
      status: 'cut';
      /** Millimetres in the frame's u–v plane, centroid at (0, 0). */
      polygon: SectionPolygon;
      /** Element coordinates: w along the axis, v the in-plane direction nearest the element's +Z (+Y for a vertical member). */
      frame: SectionFrame;
      /** The body's extent along its axis, through the section centroid, element coordinates and model units. */
      axis: { start: Vec3; end: Vec3; length: number };
      /** Fractions of the length where the kept section was found. */
      stations: number[];
      ifcType: string;
    }
  /**
   * `notOneSection`: the geometry itself shows the body is not one prismatic member (its section varies, or it cuts
   * into separate pieces), so no name may stand in for it.
   */
  | { status: 'failed'; reason: string; notOneSection?: true };

/** Fractions of the length cut: away from the ends, where copes, notches and end plates sit. */
export const CUT_STATIONS = [0.2, 0.35, 0.5, 0.65, 0.8] as const;
/** Two stations whose area and bounding box agree within this fraction show the same section. */
const SAME_SECTION = 0.001;
/** Without an Axis representation, a body shorter than this many times its cross size has no clear axis. */
const MIN_SLENDERNESS = 1.5;
/** Beyond this |w·Z| the member counts as vertical, and the element's +Y orients its section. */
const VERTICAL = 0.9999;

const failed = (reason: string, notOneSection = false): BodyCut => ({ status: 'failed', reason, ...(notOneSection ? { notOneSection } : {}) });

/** Eigenvalues (ascending) and unit eigenvectors of a symmetric 3×3 matrix [xx, xy, xz, yy, yz, zz], by Jacobi rotations. */
export function symmetricEigen3(m: readonly number[]): { values: number[]; vectors: Vec3[] } {
  const a = [
    [m[0], m[1], m[2]],
    [m[1], m[3], m[4]],
    [m[2], m[4], m[5]],
  ];
  const v = [
    [1, 0, 0],
    [0, 1, 0],
    [0, 0, 1],
  ];
  for (let sweep = 0; sweep < 50; sweep++) {
    const off = a[0][1] ** 2 + a[0][2] ** 2 + a[1][2] ** 2;
    if (off <= 1e-30 * (a[0][0] ** 2 + a[1][1] ** 2 + a[2][2] ** 2) || off === 0) break;
    for (const [p, q] of [
      [0, 1],
      [0, 2],
      [1, 2],
    ]) {
      if (a[p][q] === 0) continue;
      const theta = (a[q][q] - a[p][p]) / (2 * a[p][q]);
      const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
      const c = 1 / Math.sqrt(t * t + 1);
      const s = t * c;
      for (let k = 0; k < 3; k++) {
        const akp = a[k][p];
        const akq = a[k][q];
        a[k][p] = c * akp - s * akq;
        a[k][q] = s * akp + c * akq;
      }
      for (let k = 0; k < 3; k++) {
        const apk = a[p][k];
        const aqk = a[q][k];
        a[p][k] = c * apk - s * aqk;
        a[q][k] = s * apk + c * aqk;
      }
      for (let k = 0; k < 3; k++) {
        const vkp = v[k][p];
        const vkq = v[k][q];
        v[k][p] = c * vkp - s * vkq;
        v[k][q] = s * vkp + c * vkq;
      }
    }
  }
  const order = [0, 1, 2].sort((i, j) => a[i][i] - a[j][j]);
  return { values: order.map((i) => a[i][i]), vectors: order.map((i) => [v[0][i], v[1][i], v[2][i]] as Vec3) };
}

/** Unit normal (Newell) and area of each face's outer loop. */
function faceNormals(faces: BodyFaces): { normals: Float64Array; areas: Float64Array } {
  const { positions: p, loopVertices, loopStarts, faceStarts } = faces;
  const count = faceStarts.length - 1;
  const normals = new Float64Array(3 * count);
  const areas = new Float64Array(count);
  for (let f = 0; f < count; f++) {
    const start = loopStarts[faceStarts[f]];
    const end = loopStarts[faceStarts[f] + 1];
    let nx = 0;
    let ny = 0;
    let nz = 0;
    for (let k = start; k < end; k++) {
      const a = 3 * loopVertices[k];
      const b = 3 * loopVertices[k + 1 < end ? k + 1 : start];
      nx += (p[a + 1] - p[b + 1]) * (p[a + 2] + p[b + 2]);
      ny += (p[a + 2] - p[b + 2]) * (p[a] + p[b]);
      nz += (p[a] - p[b]) * (p[a + 1] + p[b + 1]);
    }
    const length = Math.hypot(nx, ny, nz);
    areas[f] = length / 2;
    if (length > 0) normals.set([nx / length, ny / length, nz / length], 3 * f);
  }
  return { normals, areas };
}

/**
 * The direction a body is long in: first the principal direction of its vertices, then refined to the direction
 * most nearly at right angles to its side faces (a prism's sides are exactly parallel to its axis, whereas copes and
 * cut ends tilt the vertices' spread).
 */
export function bodyDirection(faces: BodyFaces): Vec3 | undefined {
  const p = faces.positions;
  const n = p.length / 3;
  if (n < 4) return undefined;
  const mean: Vec3 = [0, 0, 0];
  for (let i = 0; i < p.length; i += 3) {
    mean[0] += p[i] / n;
    mean[1] += p[i + 1] / n;
    mean[2] += p[i + 2] / n;
  }
  const c = [0, 0, 0, 0, 0, 0];
  for (let i = 0; i < p.length; i += 3) {
    const x = p[i] - mean[0];
    const y = p[i + 1] - mean[1];
    const z = p[i + 2] - mean[2];
    c[0] += x * x;
    c[1] += x * y;
    c[2] += x * z;
    c[3] += y * y;
    c[4] += y * z;
    c[5] += z * z;
  }
  const spread = symmetricEigen3(c);
  if (!(spread.values[2] > 0)) return undefined;
  const rough = spread.vectors[2];
  const { normals, areas } = faceNormals(faces);
  const s = [0, 0, 0, 0, 0, 0];
  for (let f = 0; f < areas.length; f++) {
    const nx = normals[3 * f];
    const ny = normals[3 * f + 1];
    const nz = normals[3 * f + 2];
    // Side faces only: end faces, cut ends and cope faces across the member would pull the direction off.
    if (Math.abs(nx * rough[0] + ny * rough[1] + nz * rough[2]) > 0.5) continue;
    const a = areas[f];
    s[0] += a * nx * nx;
    s[1] += a * nx * ny;
    s[2] += a * nx * nz;
    s[3] += a * ny * ny;
    s[4] += a * ny * nz;
    s[5] += a * nz * nz;
  }
  const sides = symmetricEigen3(s);
  const refined = sides.vectors[0];
  const direction = sides.values[1] > 0 && Math.abs(dot(refined, rough)) > 0.9 ? refined : rough;
  // A body has no sense of its own: point the axis along its largest component, positive.
  const largest = [0, 1, 2].reduce((best, i) => (Math.abs(direction[i]) > Math.abs(direction[best]) ? i : best), 0);
  return direction[largest] < 0 ? scale(direction, -1) : direction;
}

/** In-plane axes for a member along unit vector w: v nearest the element's +Z (+Y for a vertical member), u = v × w. */
export function cutAxes(w: Vec3): CutAxes {
  const up: Vec3 = Math.abs(w[2]) > VERTICAL ? [0, 1, 0] : [0, 0, 1];
  const v = normalize(subtract(up, scale(w, dot(up, w))))!;
  return { u: cross(v, w), v, w };
}

/** Extent of the vertices along w, and across it (the larger and the smaller of the u and v extents), model units. */
function extents(faces: BodyFaces, axes: CutAxes): { from: number; to: number; across: number; thinnest: number } {
  const p = faces.positions;
  const low = [Infinity, Infinity, Infinity];
  const high = [-Infinity, -Infinity, -Infinity];
  for (let i = 0; i < p.length; i += 3) {
    const along = [axes.u, axes.v, axes.w].map((a) => p[i] * a[0] + p[i + 1] * a[1] + p[i + 2] * a[2]);
    for (let k = 0; k < 3; k++) {
      low[k] = Math.min(low[k], along[k]);
      high[k] = Math.max(high[k], along[k]);
    }
  }
  const [acrossU, acrossV] = [high[0] - low[0], high[1] - low[1]];
  return { from: low[2], to: high[2], across: Math.max(acrossU, acrossV), thinnest: Math.min(acrossU, acrossV) };
}

/** All items' faces in one set: a body written as several items is cut as one. */
function mergeFaces(sets: readonly BodyFaces[]): BodyFaces {
  if (sets.length === 1) return sets[0];
  const total = (pick: (s: BodyFaces) => ArrayLike<number>, less = 0): number => sets.reduce((sum, s) => sum + pick(s).length - less, 0);
  const positions = new Float64Array(total((s) => s.positions));
  const loopVertices = new Uint32Array(total((s) => s.loopVertices));
  const loopStarts = new Uint32Array(total((s) => s.loopStarts, 1) + 1);
  const faceStarts = new Uint32Array(total((s) => s.faceStarts, 1) + 1);
  let [vertices, indices, loops, faces] = [0, 0, 0, 0];
  for (const s of sets) {
    positions.set(s.positions, 3 * vertices);
    for (let i = 0; i < s.loopVertices.length; i++) loopVertices[indices + i] = s.loopVertices[i] + vertices;
    for (let i = 0; i + 1 < s.loopStarts.length; i++) loopStarts[loops + i] = s.loopStarts[i] + indices;
    for (let i = 0; i + 1 < s.faceStarts.length; i++) faceStarts[faces + i] = s.faceStarts[i] + loops;
    vertices += s.positions.length / 3;
    indices += s.loopVertices.length;
    loops += s.loopStarts.length - 1;
    faces += s.faceStarts.length - 1;
  }
  loopStarts[loops] = indices;
  faceStarts[faces] = loops;
  return { positions, loopVertices, loopStarts, faceStarts };
}

/** True when a clipping removes material from this section (some point of it, in model units, lies on the removed side). */
function clippedAt(outer: readonly Point2_mm[], offset: number, axes: CutAxes, clips: readonly HalfSpaceClip[], size: number): boolean {
  return clips.some((clip) =>
    outer.some(([u, v]) => {
      const point = add(add(scale(axes.u, u), scale(axes.v, v)), scale(axes.w, offset));
      return dot(subtract(point, clip.point), clip.normal) > 1e-9 * size;
    }),
  );
}

const sameWithin = (a: number, b: number, reference: number): boolean => Math.abs(a - b) <= SAME_SECTION * reference;

/**
 * Cuts a member's body items into its section. Never throws: a body that cannot give one section answers a reason in
 * plain words, for the member to be skipped rather than checked with a wrong section.
 */
export function cutMemberBody(lines: StepLines, items: readonly BodyItem[], options: BodyCutOptions): BodyCut {
  if (items.length === 0) return failed('The member has no body to cut.');
  const sets: BodyFaces[] = [];
  const clips: HalfSpaceClip[] = [];
  const types = new Set<string>();
  for (const item of items) {
    const reading = readBodyFaces(lines, item.itemId, item.transform);
    if (reading.status === 'failed') return failed(reading.reason);
    sets.push(reading.faces);
    clips.push(...reading.clips);
    types.add(reading.ifcType);
  }
  const body: CutInput = { faces: mergeFaces(sets), clips, ifcType: [...types].join(' + '), options };
  let cuts = cutCaches.get(lines);
  if (!cuts) {
    cuts = new CutCache();
    cutCaches.set(lines, cuts);
  }
  return cuts.get(body) ?? cuts.add(body, cutFaces(body));
}

/** What a cut depends on: the same input always gives the same cut. */
interface CutInput {
  faces: BodyFaces;
  clips: readonly HalfSpaceClip[];
  ifcType: string;
  options: BodyCutOptions;
}

const CACHED_CUTS = 4096;

/**
 * Cuts of bodies already cut in this model. Members of one size and length have the same body in their own
 * coordinates (every beam of one size, in real exports), so most bodies are cut once. Found by a hash of the input
 * and kept only when every number is equal. A cut is shared by the members that have it: read, never written.
 */
class CutCache {
  private readonly entries = new Map<number, { input: CutInput; cut: BodyCut }[]>();
  private count = 0;

  get(input: CutInput): BodyCut | undefined {
    return this.entries.get(hashOf(input))?.find((entry) => sameInput(entry.input, input))?.cut;
  }

  add(input: CutInput, cut: BodyCut): BodyCut {
    // Past the limit, the oldest hash goes: a model of all-different bodies keeps a bounded cache.
    if (this.count >= CACHED_CUTS) {
      const [oldest, list] = this.entries.entries().next().value as [number, unknown[]];
      this.entries.delete(oldest);
      this.count -= list.length;
    }
    const hash = hashOf(input);
    const list = this.entries.get(hash);
    if (list) list.push({ input, cut });
    else this.entries.set(hash, [{ input, cut }]);
    this.count++;
    return cut;
  }
}

const cutCaches = new WeakMap<StepLines, CutCache>();

const hashWords = new Float64Array(1);
const hashBits = new Uint32Array(hashWords.buffer);

/** FNV-1a over the bits of every number of the faces (a hash, checked by sameInput). */
function hashOf({ faces, options }: CutInput): number {
  let h = 0x811c9dc5;
  const mix = (x: number): void => {
    hashWords[0] = x;
    h = Math.imul(h ^ hashBits[0], 0x01000193);
    h = Math.imul(h ^ hashBits[1], 0x01000193);
  };
  for (const v of faces.positions) mix(v);
  for (const v of faces.loopVertices) h = Math.imul(h ^ v, 0x01000193);
  for (const v of faces.loopStarts) h = Math.imul(h ^ v, 0x01000193);
  for (const v of faces.faceStarts) h = Math.imul(h ^ v, 0x01000193);
  mix(options.scaleToMm);
  return h >>> 0;
}

const sameNumbers = (a: ArrayLike<number>, b: ArrayLike<number>): boolean => {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
};

function sameInput(a: CutInput, b: CutInput): boolean {
  const sameClip = (x: HalfSpaceClip, y: HalfSpaceClip): boolean => sameNumbers(x.point, y.point) && sameNumbers(x.normal, y.normal);
  const sameAxis = (x: BodyCutOptions['axis'], y: BodyCutOptions['axis']): boolean => (x && y ? sameNumbers(x.start, y.start) && sameNumbers(x.end, y.end) : x === y);
  return (
    a.ifcType === b.ifcType &&
    a.options.scaleToMm === b.options.scaleToMm &&
    sameAxis(a.options.axis, b.options.axis) &&
    a.clips.length === b.clips.length &&
    a.clips.every((clip, i) => sameClip(clip, b.clips[i])) &&
    sameNumbers(a.faces.positions, b.faces.positions) &&
    sameNumbers(a.faces.loopVertices, b.faces.loopVertices) &&
    sameNumbers(a.faces.loopStarts, b.faces.loopStarts) &&
    sameNumbers(a.faces.faceStarts, b.faces.faceStarts)
  );
}

/** The cut of one body (see cutMemberBody). */
function cutFaces({ faces, clips, ifcType, options }: CutInput): BodyCut {
  if (faces.positions.length === 0) return failed(`Its body (${ifcType}) is empty.`);

  let w: Vec3 | undefined;
  if (options.axis) {
    w = normalize(subtract(options.axis.end, options.axis.start));
    if (!w) return failed('Its Axis has no length.');
  } else {
    w = bodyDirection(faces);
    if (!w) return failed(`Its body (${ifcType}) has no length.`);
  }
  const axes = cutAxes(w);
  const { from, to, across, thinnest } = extents(faces, axes);
  const length = to - from;
  const size = Math.max(length, across);
  if (!(length > 1e-9 * size)) return failed(`Its body (${ifcType}) has no length along the member.`);
  if (!(thinnest > 1e-9 * size)) return failed(`Its body (${ifcType}) is flat: it has no thickness across the member.`);
  if (!options.axis && length < MIN_SLENDERNESS * across) {
    return failed(`Its body (${ifcType}) is too short for its axis to be found: ${length.toPrecision(3)} long, ${across.toPrecision(3)} across, in model units.`);
  }

  const sections = CUT_STATIONS.map((station) => {
    const offset = from + station * length;
    const section = planeSection(faces, axes, offset, across);
    if (section.status === 'section' && clippedAt(section.outer, offset, axes, clips, size)) {
      return { status: 'failed' as const, reason: 'a clipping of the body removes material there' };
    }
    return section;
  });
  const cuts = sections.flatMap((s, i) => (s.status === 'section' ? [{ ...s, station: CUT_STATIONS[i] }] : []));
  if (cuts.length === 0) {
    const reasons = sections.map((s) => (s.status === 'failed' ? s.reason : ''));
    const pieces = sections.some((s) => s.status === 'failed' && 'pieces' in s && s.pieces !== undefined);
    return failed(`Its body (${ifcType}) gives no section: ${reasons[Math.floor(reasons.length / 2)]}.`, pieces);
  }
  const same = (a: (typeof cuts)[number], b: (typeof cuts)[number]): boolean => {
    const reference = Math.max(a.bounds[2] - a.bounds[0], a.bounds[3] - a.bounds[1]);
    return sameWithin(a.area, b.area, Math.abs(a.area)) && a.bounds.every((value, k) => sameWithin(value, b.bounds[k], reference));
  };
  // The largest group of agreeing stations; among equals, the one with a station nearest mid-length.
  let best: typeof cuts = [];
  for (const cut of cuts) {
    const group = cuts.filter((other) => same(cut, other));
    const nearMiddle = (g: typeof cuts): number => Math.min(...g.map((c) => Math.abs(c.station - 0.5)));
    if (group.length > best.length || (group.length === best.length && nearMiddle(group) < nearMiddle(best))) best = group;
  }
  if (best.length < 2) {
    if (cuts.length >= 2) return failed('The section varies along the member.', true);
    return failed(`Its body (${ifcType}) gives one section only: ${sections.find((s) => s.status === 'failed')!.reason}.`);
  }
  const kept = best.reduce((a, b) => (Math.abs(b.station - 0.5) < Math.abs(a.station - 0.5) ? b : a));
  const polygon = toSectionPolygon(kept.outer, kept.voids, options.scaleToMm);
  const [cx_mm, cy_mm] = polygonProperties(polygon).centroid_mm;
  const origin = add(add(scale(axes.u, cx_mm / options.scaleToMm), scale(axes.v, cy_mm / options.scaleToMm)), scale(axes.w, from));
  const centred = (loop: SectionPolygon['outer']): SectionPolygon['outer'] => loop.map(([x, y]) => [x - cx_mm, y - cy_mm] as const);
  return {
    status: 'cut',
    polygon: { outer: centred(polygon.outer), voids: polygon.voids.map(centred) },
    frame: { origin, ...axes },
    axis: { start: origin, end: add(origin, scale(axes.w, length)), length },
    stations: best.map((c) => c.station),
    ifcType,
  };
}
