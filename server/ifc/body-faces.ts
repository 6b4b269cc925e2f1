/**
 * A body item without a profile (faceted and advanced breps, surface models, tessellated face sets, and clipping
 * booleans over them) read into planar faces in element coordinates and model units: what a plane cut needs.
 *
 * Faces are kept in flat arrays rather than objects per point: a body can hold thousands of faces and a model tens of
 * thousands of such bodies. A face's loops are its outer bound first, then its holes; their orientation is not kept,
 * since a cut pairs crossings along a line and needs no sense.
 */
import {
  IFCADVANCEDBREP,
  IFCADVANCEDBREPWITHVOIDS,
  IFCBOOLEANCLIPPINGRESULT,
  IFCBOOLEANRESULT,
  IFCBOXEDHALFSPACE,
  IFCEDGELOOP,
  IFCFACEBASEDSURFACEMODEL,
  IFCFACEOUTERBOUND,
  IFCFACETEDBREP,
  IFCFACETEDBREPWITHVOIDS,
  IFCHALFSPACESOLID,
  IFCINDEXEDPOLYGONALFACEWITHVOIDS,
  IFCLINE,
  IFCPLANE,
  IFCPOLYGONALBOUNDEDHALFSPACE,
  IFCPOLYGONALFACESET,
  IFCPOLYLINE,
  IFCPOLYLOOP,
  IFCSHELLBASEDSURFACEMODEL,
  IFCTRIANGULATEDFACESET,
} from 'web-ifc';
import { type Mat4, normalize, normalMatrix, transformPoint, type Vec3 } from './matrix4';
import { readAxisPlacement } from './placement-reader';
import { FLAT_INTEGER, FLAT_LIST, FLAT_REAL, FLAT_REF, type FlatLine } from './step-line-parser';
import { booleanOf, enumOf, numberOf, refOf, refsOf, type StepLines, type StepValue } from './step-lines';

export interface BodyFaces {
  /** x, y, z of every vertex, element coordinates, model units. */
  positions: Float64Array;
  /** Vertex numbers of every loop, one loop after another. */
  loopVertices: Uint32Array;
  /** Where each loop starts in loopVertices, with one more entry closing the last loop. */
  loopStarts: Uint32Array;
  /** Where each face's loops start in loopStarts (outer bound first), with one more entry closing the last face. */
  faceStarts: Uint32Array;
}

/** Material removed by a clipping half space: everything on the side `normal` points to (unit, element coordinates). */
export interface HalfSpaceClip {
  point: Vec3;
  normal: Vec3;
}

export type BodyFacesReading =
  | { status: 'read'; faces: BodyFaces; clips: HalfSpaceClip[]; ifcType: string }
  | { status: 'failed'; reason: string };

/** Grows the flat arrays of a BodyFaces. */
class FaceBuilder {
  readonly positions: number[] = [];
  private readonly loopVertices: number[] = [];
  private readonly loopStarts: number[] = [];
  private readonly faceStarts: number[] = [];

  get vertexCount(): number {
    return this.positions.length / 3;
  }

  addVertex(x: number, y: number, z: number): number {
    this.positions.push(x, y, z);
    return this.positions.length / 3 - 1;
  }

  startFace(): void {
    this.faceStarts.push(this.loopStarts.length);
  }

  /** A loop of fewer than three vertices bounds nothing and is left out. */
  addLoop(vertices: readonly number[]): void {
    if (vertices.length < 3) return;
    this.loopStarts.push(this.loopVertices.length);
    for (const v of vertices) this.loopVertices.push(v);
  }

  build(): BodyFaces {
    // Faces whose loops were all left out are dropped.
    const faceStarts: number[] = [];
    for (let f = 0; f < this.faceStarts.length; f++) {
      const end = f + 1 < this.faceStarts.length ? this.faceStarts[f + 1] : this.loopStarts.length;
      if (end > this.faceStarts[f]) faceStarts.push(this.faceStarts[f]);
    }
    faceStarts.push(this.loopStarts.length);
    return {
      positions: Float64Array.from(this.positions),
      loopVertices: Uint32Array.from(this.loopVertices),
      loopStarts: Uint32Array.from([...this.loopStarts, this.loopVertices.length]),
      faceStarts: Uint32Array.from(faceStarts),
    };
  }
}

function transformPositions(positions: Float64Array, m: Mat4): Float64Array {
  for (let i = 0; i < positions.length; i += 3) {
    const x = positions[i];
    const y = positions[i + 1];
    const z = positions[i + 2];
    positions[i] = m[0] * x + m[4] * y + m[8] * z + m[12];
    positions[i + 1] = m[1] * x + m[5] * y + m[9] * z + m[13];
    positions[i + 2] = m[2] * x + m[6] * y + m[10] * z + m[14];
  }
  return positions;
}

/** Thrown inside the reader for a body it cannot read; turned into a 'failed' reading with the message. */
class Unreadable extends Error {}

/** The references in the list at `at` of a flat line (the others skipped, as refsOf does), into `out`. */
function flatRefs(flat: FlatLine, at: number, out: number[]): number[] {
  out.length = 0;
  if (at < 0 || flat.kinds[at] !== FLAT_LIST) return out;
  for (let i = at + 1; i < flat.values[at]; i = flat.next(i)) if (flat.kinds[i] === FLAT_REF && flat.values[i] > 0) out.push(flat.values[i]);
  return out;
}

/** The reference at `at` of a flat line, as refOf reads it. */
function flatRef(flat: FlatLine, at: number): number | undefined {
  return at >= 0 && flat.kinds[at] === FLAT_REF && flat.values[at] > 0 ? flat.values[at] : undefined;
}

/** A finite real or integer at `at` of a flat line (a typed value is left to numberOf). */
function isPlainNumber(flat: FlatLine, at: number): boolean {
  const kind = flat.kinds[at];
  return (kind === FLAT_REAL || kind === FLAT_INTEGER) && Number.isFinite(flat.values[at]);
}

/**
 * True when the list at `at` holds two or more coordinates whose first three are plain numbers: the case read straight
 * from the flat line; anything else goes through the general reading, which gives the same answer or the reason.
 */
function plainCoordinates(flat: FlatLine, at: number): boolean {
  if (flat.kinds[at] !== FLAT_LIST) return false;
  const count = flat.values[at] - at - 1;
  if (count < 2) return false;
  for (let k = 1; k <= Math.min(count, 3); k++) if (!isPlainNumber(flat, at + k)) return false;
  return true;
}

class BodyFaceReader {
  readonly builder = new FaceBuilder();
  /** IfcCartesianPoint ids to vertex numbers: faces of a brep share their corners. */
  private readonly points = new Map<number, number>();
  // Reused between faces and loops; each is used up before the next read of its kind.
  private readonly boundIds: number[] = [];
  private readonly outerBounds: (number | undefined)[] = [];
  private readonly innerBounds: (number | undefined)[] = [];
  private readonly pointIds: number[] = [];
  private readonly vertices: number[] = [];

  constructor(private readonly lines: StepLines) {}

  private vertexOfPoint(pointId: number | undefined): number {
    if (pointId === undefined) throw new Unreadable('a face refers to a point the file does not have');
    let vertex = this.points.get(pointId);
    if (vertex === undefined) {
      const flat = this.lines.flat(pointId);
      if (flat && flat.count > 0 && plainCoordinates(flat, 0)) {
        const v = flat.values;
        const count = v[0] - 1;
        vertex = this.builder.addVertex(v[1], v[2], count >= 3 ? v[3] : 0);
      } else {
        vertex = this.vertexOfPointLine(pointId);
      }
      this.points.set(pointId, vertex);
    }
    return vertex;
  }

  /** The general reading of a point, for what the flat reading leaves (typed values, missing coordinates). */
  private vertexOfPointLine(pointId: number): number {
    const coordinates = this.lines.line(pointId)?.args[0];
    const x = Array.isArray(coordinates) ? numberOf(coordinates[0]) : undefined;
    const y = Array.isArray(coordinates) ? numberOf(coordinates[1]) : undefined;
    const z = Array.isArray(coordinates) ? (numberOf(coordinates[2]) ?? 0) : undefined;
    if (x === undefined || y === undefined || z === undefined) throw new Unreadable(`point #${pointId} has no coordinates`);
    return this.builder.addVertex(x, y, z);
  }

  /** The faces of shells (IfcClosedShell, IfcOpenShell, IfcConnectedFaceSet): CfsFaces is their first attribute. */
  shells(shellIds: readonly number[]): void {
    for (const shellId of shellIds) {
      const flat = this.lines.flat(shellId);
      if (!flat || flat.count === 0) continue;
      for (const faceId of flatRefs(flat, 0, [])) this.face(faceId);
    }
  }

  /** IfcFace or IfcAdvancedFace: Bounds first; an advanced face must lie on a plane. */
  private face(faceId: number): void {
    const face = this.lines.flat(faceId);
    if (!face) return;
    const surface = flatRef(face, face.attribute(1));
    const boundIds = flatRefs(face, face.count > 0 ? 0 : -1, this.boundIds);
    if (surface !== undefined && this.lines.typeOf(surface) !== IFCPLANE) {
      throw new Unreadable(`it has curved faces (${this.lines.typeName(this.lines.typeOf(surface))})`);
    }
    // Outer bound first, the others in their order.
    const outer = this.outerBounds;
    const inner = this.innerBounds;
    outer.length = 0;
    inner.length = 0;
    for (const boundId of boundIds) {
      const bound = this.lines.flat(boundId);
      if (!bound) continue;
      (bound.type === IFCFACEOUTERBOUND ? outer : inner).push(flatRef(bound, bound.count > 0 ? 0 : -1));
    }
    this.builder.startFace();
    for (const loopId of outer) this.builder.addLoop(this.loop(loopId));
    for (const loopId of inner) this.builder.addLoop(this.loop(loopId));
  }

  private loop(loopId: number | undefined): number[] {
    const flat = this.lines.flat(loopId);
    if (flat?.type === IFCPOLYLOOP) {
      const vertices = this.vertices;
      vertices.length = 0;
      for (const p of flatRefs(flat, flat.count > 0 ? 0 : -1, this.pointIds)) vertices.push(this.vertexOfPoint(p));
      return vertices;
    }
    const type = this.lines.typeOf(loopId);
    if (type === IFCPOLYLOOP) return refsOf(this.lines.line(loopId)?.args[0]).map((p) => this.vertexOfPoint(p));
    if (type === IFCEDGELOOP) return this.edgeLoop(loopId!);
    throw new Unreadable(`a face is bounded by ${this.lines.typeName(type)}`);
  }

  /** IfcEdgeLoop of IfcOrientedEdge (EdgeStart*, EdgeEnd*, EdgeElement, Orientation) over straight IfcEdgeCurve. */
  private edgeLoop(loopId: number): number[] {
    const vertices: number[] = [];
    for (const orientedId of refsOf(this.lines.line(loopId)?.args[0])) {
      const oriented = this.lines.line(orientedId);
      const edge = this.lines.line(refOf(oriented?.args[2]));
      if (!oriented || !edge) throw new Unreadable('an edge loop refers to an edge the file does not have');
      const forward = (booleanOf(oriented.args[3]) ?? true) === (booleanOf(edge.args[3]) ?? true);
      const start = refOf(this.lines.line(refOf(edge.args[forward ? 0 : 1]))?.args[0]);
      const geometryId = refOf(edge.args[2]);
      const geometryType = this.lines.typeOf(geometryId);
      vertices.push(this.vertexOfPoint(start));
      if (geometryType === IFCPOLYLINE) {
        // The polyline's inner points lie on the edge too; its ends are the edge's vertices.
        const inner = refsOf(this.lines.line(geometryId)?.args[0]).slice(1, -1);
        if (!forward) inner.reverse();
        for (const p of inner) vertices.push(this.vertexOfPoint(p));
      } else if (geometryType !== IFCLINE) {
        throw new Unreadable(`it has curved edges (${this.lines.typeName(geometryType)})`);
      }
    }
    return vertices;
  }

  /** IfcPolygonalFaceSet and IfcTriangulatedFaceSet: 1-based indices into the point list, through PnIndex if given. */
  faceSet(line: { type: number; args: StepValue[] }): void {
    const triangulated = line.type === IFCTRIANGULATEDFACESET;
    const pnIndex = (triangulated ? line.args[4] : line.args[3]) ?? null;
    const base = this.pointList(refOf(line.args[0]), Array.isArray(pnIndex) ? pnIndex : null);
    const index = (value: StepValue): number => {
      const i = numberOf(value);
      const vertex = i !== undefined && Number.isInteger(i) ? base[i - 1] : undefined;
      if (vertex === undefined) throw new Unreadable('a face refers to a coordinate index beyond the point list');
      return vertex;
    };
    const indices = (list: StepValue | undefined): number[] => (Array.isArray(list) ? list.map(index) : []);
    if (triangulated) {
      const triangles = line.args[3];
      for (const triangle of Array.isArray(triangles) ? triangles : []) {
        this.builder.startFace();
        this.builder.addLoop(indices(triangle));
      }
      return;
    }
    for (const faceId of refsOf(line.args[2])) {
      const face = this.lines.line(faceId);
      if (!face) continue;
      this.builder.startFace();
      this.builder.addLoop(indices(face.args[0]));
      if (face.type === IFCINDEXEDPOLYGONALFACEWITHVOIDS && Array.isArray(face.args[1])) {
        for (const inner of face.args[1]) this.builder.addLoop(indices(inner));
      }
    }
  }

  /** The points of a point list read straight from its flat line; undefined (nothing added) when one is not plain. */
  private flatPointList(listId: number | undefined): number | undefined {
    const flat = this.lines.flat(listId);
    if (!flat || flat.count === 0 || flat.kinds[0] !== FLAT_LIST) return undefined;
    const end = flat.values[0];
    let count = 0;
    for (let at = 1; at < end; at = flat.next(at), count++) if (!plainCoordinates(flat, at)) return undefined;
    const v = flat.values;
    for (let at = 1; at < end; at = flat.next(at)) this.builder.addVertex(v[at + 1], v[at + 2], v[at] - at - 1 >= 3 ? v[at + 3] : 0);
    return count;
  }

  /** The general reading of a point list. */
  private pointListLine(listId: number | undefined): number {
    const coordinates = this.lines.line(listId)?.args[0];
    if (!Array.isArray(coordinates)) throw new Unreadable('its point list is missing');
    for (const point of coordinates) {
      const p = Array.isArray(point) ? point : [];
      const x = numberOf(p[0]);
      const y = numberOf(p[1]);
      const z = numberOf(p[2]) ?? 0;
      if (x === undefined || y === undefined) throw new Unreadable('its point list has a point without coordinates');
      this.builder.addVertex(x, y, z);
    }
    return coordinates.length;
  }

  /** Vertex numbers of an IfcCartesianPointList3D, in PnIndex order when PnIndex is given. */
  private pointList(listId: number | undefined, pnIndex: StepValue[] | null): number[] {
    const first = this.builder.vertexCount;
    const count = this.flatPointList(listId) ?? this.pointListLine(listId);
    if (!pnIndex) return Array.from({ length: count }, (_, i) => first + i);
    return pnIndex.map((value) => {
      const i = numberOf(value);
      if (i === undefined || !Number.isInteger(i) || i < 1 || i > count) throw new Unreadable('its PnIndex points beyond the point list');
      return first + i - 1;
    });
  }
}

const HALF_SPACES = new Set([IFCHALFSPACESOLID, IFCPOLYGONALBOUNDEDHALFSPACE, IFCBOXEDHALFSPACE]);

/**
 * The half space a clipping removes. A bounded half space removes less than its plane says; taking the whole side is
 * the cautious reading, since the cut only uses it to avoid stations where material was removed.
 */
function halfSpaceClip(lines: StepLines, halfSpaceId: number, transform: Mat4 | undefined): HalfSpaceClip {
  const halfSpace = lines.line(halfSpaceId);
  const planeId = refOf(halfSpace?.args[0]);
  if (!halfSpace || lines.typeOf(planeId) !== IFCPLANE) throw new Unreadable('a clipping half space is not bounded by a plane');
  const position = readAxisPlacement(lines, refOf(lines.line(planeId)?.args[0]));
  // AgreementFlag TRUE: the plane's normal points away from the half space's material (ISO 16739 IfcHalfSpaceSolid).
  const sense = booleanOf(halfSpace.args[1]) === false ? 1 : -1;
  const localNormal: Vec3 = [position[8] * sense, position[9] * sense, position[10] * sense];
  const localPoint: Vec3 = [position[12], position[13], position[14]];
  if (!transform) return { point: localPoint, normal: normalize(localNormal)! };
  const n = normalMatrix(transform);
  const normal = normalize([
    n[0] * localNormal[0] + n[3] * localNormal[1] + n[6] * localNormal[2],
    n[1] * localNormal[0] + n[4] * localNormal[1] + n[7] * localNormal[2],
    n[2] * localNormal[0] + n[5] * localNormal[1] + n[8] * localNormal[2],
  ]);
  if (!normal) throw new Unreadable('a clipping half space is flattened by its mapping');
  return { point: transformPoint(transform, localPoint), normal };
}

/** Walks booleans down their first operand, keeping the half spaces they remove; answers the body's own item. */
function unwrapBooleans(lines: StepLines, itemId: number, transform: Mat4 | undefined, clips: HalfSpaceClip[]): number {
  let id = itemId;
  for (let depth = 0; depth < 64; depth++) {
    const type = lines.typeOf(id);
    if (type !== IFCBOOLEANRESULT && type !== IFCBOOLEANCLIPPINGRESULT) return id;
    const line = lines.line(id)!;
    const operator = enumOf(line.args[0]);
    const second = refOf(line.args[2]);
    if (operator !== 'DIFFERENCE') throw new Unreadable(`it is a boolean ${operator?.toLowerCase() ?? 'without operator'}`);
    if (second === undefined || !HALF_SPACES.has(lines.typeOf(second))) {
      throw new Unreadable(`it subtracts ${second === undefined ? 'nothing readable' : lines.typeName(lines.typeOf(second))}, whose extent is not read`);
    }
    clips.push(halfSpaceClip(lines, second, transform));
    const first = refOf(line.args[1]);
    if (first === undefined) throw new Unreadable('a boolean has no first operand');
    id = first;
  }
  throw new Unreadable('its booleans nest too deep');
}

/** A body's faces in its own coordinates, or the reason they cannot be read. Throws only what is not Unreadable. */
function readOwnFaces(lines: StepLines, bodyId: number): BodyFaces | string {
  const type = lines.typeOf(bodyId);
  const ifcType = lines.typeName(type);
  try {
    const line = lines.line(bodyId);
    if (!line) return `The body item #${bodyId} is missing from the file.`;
    const reader = new BodyFaceReader(lines);
    switch (type) {
      case IFCFACETEDBREP:
      case IFCADVANCEDBREP:
        reader.shells([refOf(line.args[0])].filter((id) => id !== undefined));
        break;
      case IFCFACETEDBREPWITHVOIDS:
      case IFCADVANCEDBREPWITHVOIDS:
        reader.shells([refOf(line.args[0]), ...refsOf(line.args[1])].filter((id) => id !== undefined));
        break;
      case IFCSHELLBASEDSURFACEMODEL:
      case IFCFACEBASEDSURFACEMODEL:
        reader.shells(refsOf(line.args[0]));
        break;
      case IFCPOLYGONALFACESET:
      case IFCTRIANGULATEDFACESET:
        reader.faceSet(line);
        break;
      default:
        return `Its body is ${ifcType}, which is not read as faces.`;
    }
    const faces = reader.builder.build();
    return faces.faceStarts.length < 2 ? `Its body (${ifcType}) has no faces.` : faces;
  } catch (error) {
    if (error instanceof Unreadable) return `Its body (${ifcType}) cannot be read as faces: ${error.message}.`;
    throw error;
  }
}

/**
 * Bodies placed through a representation map (IfcMappedItem), by model: many members share one, so each is read once
 * in its own coordinates and only its points are moved for each member.
 */
const mappedBodies = new WeakMap<StepLines, Map<number, BodyFaces | string>>();

function mappedOwnFaces(lines: StepLines, bodyId: number): BodyFaces | string {
  let bodies = mappedBodies.get(lines);
  if (!bodies) {
    bodies = new Map();
    mappedBodies.set(lines, bodies);
  }
  let own = bodies.get(bodyId);
  if (own === undefined) {
    own = readOwnFaces(lines, bodyId);
    bodies.set(bodyId, own);
  }
  return own;
}

/**
 * Reads one body item (with the mapping transform that places it in the element) into planar faces. Never throws:
 * a body it cannot read answers a reason in plain words. The arrays of a mapped body's faces other than its
 * positions are shared between the members that map it: they are read, never written.
 */
export function readBodyFaces(lines: StepLines, itemId: number, transform: Mat4 | undefined): BodyFacesReading {
  const clips: HalfSpaceClip[] = [];
  let bodyId: number;
  try {
    bodyId = unwrapBooleans(lines, itemId, transform, clips);
  } catch (error) {
    if (error instanceof Unreadable) return { status: 'failed', reason: `Its body (${lines.typeName(lines.typeOf(itemId))}) cannot be read as faces: ${error.message}.` };
    throw error;
  }
  const own = transform ? mappedOwnFaces(lines, bodyId) : readOwnFaces(lines, bodyId);
  if (typeof own === 'string') return { status: 'failed', reason: own };
  const faces = transform ? { ...own, positions: transformPositions(own.positions.slice(), transform) } : own;
  const ifcType = lines.typeName(lines.typeOf(bodyId));
  for (const v of faces.positions) {
    if (!Number.isFinite(v)) return { status: 'failed', reason: `Its body (${ifcType}) has a point that is not a number.` };
  }
  return { status: 'read', faces, clips, ifcType };
}
