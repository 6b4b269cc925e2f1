/**
 * Points, directions and coordinate systems of IFC geometry, read into double-precision transforms in model units:
 * object placements, and the coordinate systems inside a representation (solid positions, mapping origins, targets).
 */
import {
  IFCAXIS2PLACEMENT2D,
  IFCAXIS2PLACEMENT3D,
  IFCCARTESIANTRANSFORMATIONOPERATOR2DNONUNIFORM,
  IFCCARTESIANTRANSFORMATIONOPERATOR3DNONUNIFORM,
} from 'web-ifc';
import { axis2Placement, identity, type Mat4, transformationOperator, type Vec3 } from './matrix4';
import { numberOf, numbersOf, refOf, type StepLines } from './step-lines';

function vector(values: readonly number[]): Vec3 | undefined {
  if (values.length < 2 || values.some((v) => !Number.isFinite(v))) return undefined;
  return [values[0], values[1], values[2] ?? 0];
}

/** IfcCartesianPoint (2D points get z = 0). */
export function readPoint(lines: StepLines, id: number | undefined): Vec3 | undefined {
  return vector(numbersOf(lines.line(id)?.args[0]));
}

/** IfcDirection, as written (not normalised). */
export function readDirection(lines: StepLines, id: number | undefined): Vec3 | undefined {
  return vector(numbersOf(lines.line(id)?.args[0]));
}

/** IfcAxis2Placement3D or IfcAxis2Placement2D as a transform; identity when absent. */
export function readAxisPlacement(lines: StepLines, id: number | undefined): Mat4 {
  const line = lines.line(id);
  if (!line) return identity();
  const origin = readPoint(lines, refOf(line.args[0])) ?? [0, 0, 0];
  if (line.type === IFCAXIS2PLACEMENT3D) {
    return axis2Placement(origin, readDirection(lines, refOf(line.args[1])), readDirection(lines, refOf(line.args[2])));
  }
  if (line.type === IFCAXIS2PLACEMENT2D) return axis2Placement(origin, undefined, readDirection(lines, refOf(line.args[1])));
  return identity();
}

/** IfcCartesianTransformationOperator2D/3D (and their non-uniform variants); identity when absent. */
export function readTransformationOperator(lines: StepLines, id: number | undefined): Mat4 {
  const line = lines.line(id);
  if (!line) return identity();
  const [axis1, axis2, localOrigin, scaleArg, ...rest] = line.args;
  const origin = readPoint(lines, refOf(localOrigin)) ?? [0, 0, 0];
  const s = numberOf(scaleArg) ?? 1;
  const a1 = readDirection(lines, refOf(axis1));
  const a2 = readDirection(lines, refOf(axis2));
  if (line.type === IFCCARTESIANTRANSFORMATIONOPERATOR2DNONUNIFORM) {
    return transformationOperator(origin, a1, a2, undefined, [s, numberOf(rest[0]) ?? s, 1]);
  }
  const is3d = rest.length > 0;
  const a3 = is3d ? readDirection(lines, refOf(rest[0])) : undefined;
  const scales: Vec3 =
    line.type === IFCCARTESIANTRANSFORMATIONOPERATOR3DNONUNIFORM ? [s, numberOf(rest[1]) ?? s, numberOf(rest[2]) ?? s] : [s, s, is3d ? s : 1];
  return transformationOperator(origin, a1, a2, a3, scales);
}

/**
 * World transform of an object placement (IfcLocalPlacement chains, grid and linear placements), in model units,
 * by web-ifc: it keeps the placements it has resolved, which makes it faster than reading the chain here.
 */
export function readObjectPlacement(lines: StepLines, placementId: number | undefined): Mat4 {
  if (placementId === undefined) return identity();
  const flat = lines.api.GetWorldTransformMatrix(lines.modelId, placementId);
  return flat && flat.length === 16 ? Float64Array.from(flat) : identity();
}
