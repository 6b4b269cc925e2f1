/**
 * The parts of an element's shape the member reader needs: the Axis curve, and the swept solids of the Body with
 * their profiles, found through boolean results (cut and coped ends), CSG trees and mapped items (a type's
 * representation maps placed by IfcMappedItem). Solid positions are read only when asked for, since most members
 * take their axis from the Axis representation.
 */
import {
  IFCBOOLEANCLIPPINGRESULT,
  IFCBOOLEANRESULT,
  IFCCSGSOLID,
  IFCEXTRUDEDAREASOLID,
  IFCEXTRUDEDAREASOLIDTAPERED,
  IFCFIXEDREFERENCESWEPTAREASOLID,
  IFCMAPPEDITEM,
  IFCREVOLVEDAREASOLID,
  IFCREVOLVEDAREASOLIDTAPERED,
  IFCSECTIONEDSOLID,
  IFCSECTIONEDSOLIDHORIZONTAL,
  IFCSECTIONEDSPINE,
  IFCSURFACECURVESWEPTAREASOLID,
} from 'web-ifc';
import { type AxisCurve, axisCurve } from './axis-curve';
import { add, cross, dot, type Mat4, multiply, norm, normalize, scale, subtract, transformPoint, type Vec3 } from './matrix4';
import { readAxisPlacement, readDirection, readPoint, readTransformationOperator } from './placement-reader';
import { numberOf, refOf, refsOf, type StepLines, type StepValue, textOf } from './step-lines';

export interface SweptSolid {
  solidType: number;
  profileId: number | undefined;
  /** The solid's arguments as read (SweptArea, Position, …). */
  args: StepValue[];
  /** Mapping transforms between the solid's representation and the element (undefined for a direct item). */
  transform: Mat4 | undefined;
  clipped: boolean;
  tapered: boolean;
  /**
   * The cross sections of an IFC4X3 sectioned solid or spine, each with where it sits as a fraction of the length
   * (from the positions' distances along; evenly spaced when the file gives none); `profileId` is the first.
   */
  crossSections?: { profileId: number; at: number }[];
}

export interface ElementShape {
  hasRepresentation: boolean;
  /** The element's Representation refers to a line the file does not have. */
  danglingReference?: number;
  axisItemId: number | undefined;
  solids: SweptSolid[];
  /** Body items that carry no profile (breps, tessellated sets, swept disks), by IFC type. */
  otherBodyTypes: string[];
  /**
   * The same items for a body cut: the item itself (the outermost boolean when booleans clip it), its type code, and
   * the mapping transforms between its representation and the element (undefined for a direct item).
   */
  bodyItems: { itemId: number; type: number; transform: Mat4 | undefined }[];
}

/** A straight or curved member line in element coordinates and model units. */
export type MemberLine = AxisCurve;

const SWEPT = new Set([
  IFCEXTRUDEDAREASOLID,
  IFCEXTRUDEDAREASOLIDTAPERED,
  IFCREVOLVEDAREASOLID,
  IFCREVOLVEDAREASOLIDTAPERED,
  IFCSURFACECURVESWEPTAREASOLID,
  IFCFIXEDREFERENCESWEPTAREASOLID,
]);
const TAPERED = new Set([IFCEXTRUDEDAREASOLIDTAPERED, IFCREVOLVEDAREASOLIDTAPERED]);
const SECTIONED = new Set([IFCSECTIONEDSOLID, IFCSECTIONEDSOLIDHORIZONTAL, IFCSECTIONEDSPINE]);
/** Identifiers of representations that are never the body (ISO 16739 representation identifiers). */
const NOT_BODY = new Set(['AXIS', 'BOX', 'FOOTPRINT', 'ANNOTATION', 'REFERENCE', 'CLEARANCE', 'COG', 'PROFILE', 'LIGHTING', 'SURFACE']);
const MAX_DEPTH = 12;

export class ShapeReader {
  /** Representation maps are shared by every occurrence of a type: read each once. */
  private readonly maps = new Map<number, { origin: Mat4; items: number[] }>();
  private readonly mappedSolids = new Map<number, StepValue[]>();

  constructor(
    private readonly lines: StepLines,
    private readonly radiansPerAngleUnit: number,
  ) {}

  private representationMap(mapId: number | undefined): { origin: Mat4; items: number[] } | undefined {
    if (mapId === undefined) return undefined;
    let map = this.maps.get(mapId);
    if (!map) {
      const line = this.lines.line(mapId);
      const representation = this.lines.line(refOf(line?.args[1]));
      map = { origin: readAxisPlacement(this.lines, refOf(line?.args[0])), items: refsOf(representation?.args[3]) };
      this.maps.set(mapId, map);
    }
    return map;
  }

  read(productShapeId: number | undefined): ElementShape {
    const shape: ElementShape = { hasRepresentation: false, axisItemId: undefined, solids: [], otherBodyTypes: [], bodyItems: [] };
    const productShape = this.lines.line(productShapeId);
    if (!productShape) return productShapeId === undefined ? shape : { ...shape, danglingReference: productShapeId };
    const representations = refsOf(productShape.args[2]).map((id) => this.lines.line(id)).filter((r) => r !== undefined);
    shape.hasRepresentation = representations.length > 0;
    const bodies = representations.filter((r) => textOf(r.args[1])?.toUpperCase().startsWith('BODY'));
    const bodyCandidates = bodies.length > 0 ? bodies : representations.filter((r) => !NOT_BODY.has(textOf(r.args[1])?.toUpperCase() ?? ''));
    for (const representation of representations) {
      if (textOf(representation.args[1])?.toUpperCase() === 'AXIS') shape.axisItemId ??= refsOf(representation.args[3])[0];
    }
    for (const body of bodyCandidates) {
      for (const item of refsOf(body.args[3])) this.collect(item, undefined, false, shape, 0);
    }
    return shape;
  }

  /** Solids inside a representation map are shared by every occurrence: read each once. */
  private mappedSolidArgs(itemId: number): StepValue[] {
    let args = this.mappedSolids.get(itemId);
    if (!args) {
      args = this.lines.line(itemId)?.args ?? [];
      this.mappedSolids.set(itemId, args);
    }
    return args;
  }

  /** `booleanRoot`: the outermost boolean whose first operand chain led here, which a body cut reads with its clippings. */
  private collect(itemId: number, transform: Mat4 | undefined, clipped: boolean, shape: ElementShape, depth: number, booleanRoot?: number): void {
    // The type alone first: brep and tessellated bodies can be long lines that are never needed.
    const type = this.lines.typeOf(itemId);
    if (depth > MAX_DEPTH || type === 0) return;
    if (SWEPT.has(type)) {
      const args = transform ? this.mappedSolidArgs(itemId) : (this.lines.line(itemId)?.args ?? []);
      shape.solids.push({ solidType: type, profileId: refOf(args[0]), args, transform, clipped, tapered: TAPERED.has(type) });
      return;
    }
    if (SECTIONED.has(type)) {
      const args = transform ? this.mappedSolidArgs(itemId) : (this.lines.line(itemId)?.args ?? []);
      const profileIds = refsOf(args[1]);
      const at = this.sectionFractions(type, refsOf(args[2]), profileIds.length);
      const crossSections = profileIds.map((profileId, i) => ({ profileId, at: at[i] }));
      shape.solids.push({ solidType: type, profileId: profileIds[0], args, transform, clipped, tapered: profileIds.length > 1, crossSections });
      return;
    }
    if (type === IFCBOOLEANRESULT || type === IFCBOOLEANCLIPPINGRESULT) {
      const first = refOf(this.lines.line(itemId)?.args[1]);
      if (first !== undefined) this.collect(first, transform, true, shape, depth + 1, booleanRoot ?? itemId);
      return;
    }
    if (type === IFCCSGSOLID) {
      const root = refOf(this.lines.line(itemId)?.args[0]);
      if (root !== undefined) this.collect(root, transform, clipped, shape, depth + 1);
      return;
    }
    if (type === IFCMAPPEDITEM) {
      const mapped = this.lines.line(itemId);
      const map = this.representationMap(refOf(mapped?.args[0]));
      if (!map) return;
      // As web-ifc places mapped geometry: the mapping target applied after the map's origin.
      const local = multiply(readTransformationOperator(this.lines, refOf(mapped?.args[1])), map.origin);
      const combined = transform ? multiply(transform, local) : local;
      for (const item of map.items) this.collect(item, combined, clipped, shape, depth + 1);
      return;
    }
    shape.otherBodyTypes.push(this.lines.typeName(type));
    const bodyItem = booleanRoot ?? itemId;
    shape.bodyItems.push({ itemId: bodyItem, type: this.lines.typeOf(bodyItem), transform });
  }

  /**
   * Where each cross section of a sectioned solid sits, as a fraction of the length: IfcSectionedSolidHorizontal places
   * them by IfcAxis2PlacementLinear (a point's DistanceAlong its curve), IfcSectionedSpine by IfcAxis2Placement3D
   * (distances between the locations); without readable positions they are taken as evenly spaced.
   */
  private sectionFractions(type: number, positionIds: number[], count: number): number[] {
    const even = Array.from({ length: count }, (_, i) => (count > 1 ? i / (count - 1) : 0));
    if (positionIds.length !== count || count < 2) return even;
    const distances: number[] = [];
    if (type === IFCSECTIONEDSPINE) {
      let along = 0;
      let previous: Vec3 | undefined;
      for (const id of positionIds) {
        const point = readPoint(this.lines, refOf(this.lines.line(id)?.args[0]));
        if (!point) return even;
        if (previous) along += norm(subtract(point, previous));
        distances.push(along);
        previous = point;
      }
    } else {
      for (const id of positionIds) {
        // IfcAxis2PlacementLinear.Location → IfcPointByDistanceExpression.DistanceAlong (a typed length measure).
        const location = this.lines.line(refOf(this.lines.line(id)?.args[0]));
        const along = numberOf(location?.args[0]);
        if (along === undefined) return even;
        distances.push(along);
      }
    }
    const first = distances[0];
    const span = distances[distances.length - 1] - first;
    if (!(span > 0) || distances.some((d, i) => i > 0 && d < distances[i - 1])) return even;
    return distances.map((d) => (d - first) / span);
  }

  /** Position of a swept solid in element coordinates (model units). */
  solidFrame(solid: SweptSolid): Mat4 {
    const position = readAxisPlacement(this.lines, refOf(solid.args[1]));
    return solid.transform ? multiply(solid.transform, position) : position;
  }

  /** The member line of the Axis representation, in element coordinates. */
  axisLine(shape: ElementShape): MemberLine | undefined {
    return shape.axisItemId === undefined ? undefined : axisCurve(this.lines, shape.axisItemId, this.radiansPerAngleUnit);
  }

  /** Frame, unit direction (in frame coordinates) and depth of an extruded solid; undefined for other solids. */
  extrusion(solid: SweptSolid): { frame: Mat4; direction: Vec3; depth: number } | undefined {
    if (solid.solidType !== IFCEXTRUDEDAREASOLID && solid.solidType !== IFCEXTRUDEDAREASOLIDTAPERED) return undefined;
    const direction = normalize(readDirection(this.lines, refOf(solid.args[2])) ?? [0, 0, 1]);
    const depth = numberOf(solid.args[3]);
    if (!direction || !(depth !== undefined && depth > 0)) return undefined;
    return { frame: this.solidFrame(solid), direction, depth };
  }

  /**
   * The member line implied by a swept solid: for an extrusion the path of the profile origin, for a revolution the
   * arc the profile origin describes about the revolution axis.
   */
  solidLine(solid: SweptSolid): MemberLine | undefined {
    const extrusion = this.extrusion(solid);
    if (extrusion) {
      const start = transformPoint(extrusion.frame, [0, 0, 0]);
      const end = transformPoint(extrusion.frame, scale(extrusion.direction, extrusion.depth));
      return { start, end, length: norm(subtract(end, start)), curved: false };
    }
    if (solid.solidType !== IFCREVOLVEDAREASOLID && solid.solidType !== IFCREVOLVEDAREASOLIDTAPERED) return undefined;
    const frame = this.solidFrame(solid);
    const axisPlacement = this.lines.line(refOf(solid.args[2]));
    const axisOrigin = readPoint(this.lines, refOf(axisPlacement?.args[0])) ?? [0, 0, 0];
    const axisDirection = normalize(readDirection(this.lines, refOf(axisPlacement?.args[1])) ?? [0, 0, 1]);
    const angle = (numberOf(solid.args[3]) ?? NaN) * this.radiansPerAngleUnit;
    if (!axisDirection || !Number.isFinite(angle)) return undefined;
    // In the solid's own coordinates the profile origin is (0,0,0); rotate it about the axis (Rodrigues).
    const r = subtract([0, 0, 0], axisOrigin);
    const along = scale(axisDirection, dot(r, axisDirection));
    const radial = subtract(r, along);
    const rotated = add(add(scale(radial, Math.cos(angle)), scale(cross(axisDirection, radial), Math.sin(angle))), add(axisOrigin, along));
    const frameScale = norm([frame[0], frame[1], frame[2]]);
    return {
      start: transformPoint(frame, [0, 0, 0]),
      end: transformPoint(frame, rotated),
      length: norm(radial) * Math.abs(angle) * frameScale,
      curved: true,
    };
  }
}
