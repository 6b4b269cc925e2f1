/**
 * Saved views of the model: camera, selected and visible members, section plane. Public viewpoints are in IFC
 * axes with the model offset added, which is what BCF's visinfo.xsd expects (metres, Z up), so findings can
 * export them as they are; the engine works with `CameraPose`, the same camera in three.js axes.
 */
import {
  type Vec3,
  dot,
  ifcToThreeDirection,
  ifcToThreePoint,
  normalise,
  threeToIfcDirection,
  threeToIfcPoint,
} from './ifc-axes';

interface CameraAim {
  /** Unit vector the camera looks along. */
  direction: Vec3;
  /** Unit vector pointing to the top of the view, at right angles to the direction. */
  up: Vec3;
  /** Width / height of the view. */
  aspectRatio: number;
}

export type CameraLens =
  | { kind: 'perspective'; /** Vertical field of view. */ fieldOfView_deg: number }
  | { kind: 'orthogonal'; /** Visible height of the view. */ viewToWorldScale_m: number };

/** A camera in IFC axes (BCF's PerspectiveCamera or OrthogonalCamera). */
export type ViewerCamera = CameraAim & CameraLens & { viewPoint_m: Vec3 };

/** A camera in three.js axes, as the engine places it. */
export type CameraPose = CameraAim & CameraLens & { position: Vec3 };

export interface ViewerClippingPlane {
  location_m: Vec3;
  /** Plane normal, pointing to the side that is cut away (as BCF defines it). */
  direction: Vec3;
}

/** Which elements are shown: all but the exceptions, or only the exceptions (BCF's DefaultVisibility). */
export interface ViewerVisibility {
  defaultVisible: boolean;
  exceptionGlobalIds: string[];
}

/** The same fields as the findings API's viewpoint; a viewpoint raised by a check run may come without camera. */
export interface ViewerViewpoint {
  camera?: ViewerCamera;
  selectedGlobalIds: string[];
  visibility: ViewerVisibility;
  clippingPlanes: ViewerClippingPlane[];
}

/** A three.js plane: it keeps the points where normal · p + constant ≥ 0. */
export interface ThreePlane {
  normal: Vec3;
  constant: number;
}

export class ViewpointError extends Error {
  override readonly name = 'ViewpointError';
}

function finiteVec3(v: Vec3, what: string): Vec3 {
  if (!Array.isArray(v) || v.length !== 3 || !v.every(Number.isFinite)) {
    throw new ViewpointError(`The viewpoint's ${what} must be three finite numbers.`);
  }
  return v;
}

function unitVec3(v: Vec3, what: string): Vec3 {
  finiteVec3(v, what);
  try {
    return normalise(v);
  } catch {
    throw new ViewpointError(`The viewpoint's ${what} has zero length.`);
  }
}

function checkedLens(lens: CameraLens): CameraLens {
  if (lens.kind === 'perspective') {
    if (!(lens.fieldOfView_deg > 0 && lens.fieldOfView_deg < 180)) {
      throw new ViewpointError(`The field of view must lie between 0° and 180°, got ${lens.fieldOfView_deg}.`);
    }
    return { kind: 'perspective', fieldOfView_deg: lens.fieldOfView_deg };
  }
  if (!(lens.viewToWorldScale_m > 0 && Number.isFinite(lens.viewToWorldScale_m))) {
    const height = lens.viewToWorldScale_m;
    throw new ViewpointError(`The visible height of an orthogonal view must be positive, got ${height}.`);
  }
  return { kind: 'orthogonal', viewToWorldScale_m: lens.viewToWorldScale_m };
}

type DirectionMap = (v: Vec3) => Vec3;

function mappedAim(camera: CameraAim, mapDirection: DirectionMap): CameraAim {
  if (!(camera.aspectRatio > 0 && Number.isFinite(camera.aspectRatio))) {
    throw new ViewpointError(`The aspect ratio must be positive, got ${camera.aspectRatio}.`);
  }
  return {
    direction: mapDirection(unitVec3(camera.direction, 'direction')),
    up: mapDirection(unitVec3(camera.up, 'up vector')),
    aspectRatio: camera.aspectRatio,
  };
}

export function poseToIfcCamera(pose: CameraPose, modelOffset_m: Vec3): ViewerCamera {
  return {
    ...checkedLens(pose),
    viewPoint_m: threeToIfcPoint(finiteVec3(pose.position, 'camera position'), modelOffset_m),
    ...mappedAim(pose, threeToIfcDirection),
  };
}

/** Checks a camera that came from outside (a saved finding, a BCF file) and turns it into three.js axes. */
export function ifcCameraToPose(camera: ViewerCamera, modelOffset_m: Vec3): CameraPose {
  return {
    ...checkedLens(camera),
    position: ifcToThreePoint(finiteVec3(camera.viewPoint_m, 'camera position'), modelOffset_m),
    ...mappedAim(camera, ifcToThreeDirection),
  };
}

/** The section plane for BCF; its location is the point of the plane nearest to `nearPoint` (three.js axes). */
export function sectionPlaneToIfc(plane: ThreePlane, nearPoint: Vec3, modelOffset_m: Vec3): ViewerClippingPlane {
  const normal = normalise(plane.normal);
  const distance = dot(normal, nearPoint) + plane.constant;
  const onPlane: Vec3 = [
    nearPoint[0] - distance * normal[0],
    nearPoint[1] - distance * normal[1],
    nearPoint[2] - distance * normal[2],
  ];
  const cutAway = threeToIfcDirection([-normal[0], -normal[1], -normal[2]]);
  return { location_m: threeToIfcPoint(onPlane, modelOffset_m), direction: cutAway };
}

export function sectionPlaneFromIfc(plane: ViewerClippingPlane, modelOffset_m: Vec3): ThreePlane {
  const location = ifcToThreePoint(finiteVec3(plane.location_m, 'clipping plane location'), modelOffset_m);
  const cutAway = ifcToThreeDirection(unitVec3(plane.direction, 'clipping plane direction'));
  const normal: Vec3 = [-cutAway[0], -cutAway[1], -cutAway[2]];
  return { normal, constant: -dot(normal, location) };
}

/** The shorter of the two ways BCF can say which elements are visible. */
export function visibilityOf(globalIds: readonly string[], isVisible: (globalId: string) => boolean): ViewerVisibility {
  const visible: string[] = [];
  const hidden: string[] = [];
  for (const globalId of globalIds) (isVisible(globalId) ? visible : hidden).push(globalId);
  return hidden.length <= visible.length
    ? { defaultVisible: true, exceptionGlobalIds: hidden }
    : { defaultVisible: false, exceptionGlobalIds: visible };
}
