/**
 * A default camera for findings raised without a 3D view (check runs, the CLI): looks at the members' bounding box
 * from above, diagonally, so the whole box fits in the view. Model coordinates, metres, Z up.
 */
import type { ModelVector, PerspectiveCamera } from '../export/finding-export';

export interface ModelBox {
  min_m: ModelVector;
  max_m: ModelVector;
}

/** 60° is inside both 2.1's allowed 45–60° and 3.0's range, so the camera is written unchanged in either release. */
const FIELD_OF_VIEW_DEG = 60;
const ASPECT_RATIO = 4 / 3;
/** Looking down-diagonally (towards +X, +Y, −Z), the usual way a frame is shown in an axonometric view. */
const VIEW_DIRECTION: ModelVector = [1, 1, -1];
/** A single short member still gets a readable amount of context around it. */
const MIN_RADIUS_M = 1;

function normalised(v: ModelVector): ModelVector {
  const length = Math.hypot(v[0], v[1], v[2]);
  return [v[0] / length, v[1] / length, v[2] / length];
}

export function framingCamera(box: ModelBox): PerspectiveCamera {
  const centre: ModelVector = [
    (box.min_m[0] + box.max_m[0]) / 2,
    (box.min_m[1] + box.max_m[1]) / 2,
    (box.min_m[2] + box.max_m[2]) / 2,
  ];
  const radius_m = Math.max(
    MIN_RADIUS_M,
    Math.hypot(box.max_m[0] - box.min_m[0], box.max_m[1] - box.min_m[1], box.max_m[2] - box.min_m[2]) / 2,
  );
  // The bounding sphere touches the narrower (vertical) view cone: distance = r / sin(fov/2).
  const distance_m = radius_m / Math.sin(((FIELD_OF_VIEW_DEG / 2) * Math.PI) / 180);
  const direction = normalised(VIEW_DIRECTION);
  // Up is world Z made perpendicular to the view direction.
  const up = normalised([-direction[2] * direction[0], -direction[2] * direction[1], 1 - direction[2] * direction[2]]);
  return {
    kind: 'perspective',
    viewPoint_m: [centre[0] - direction[0] * distance_m, centre[1] - direction[1] * distance_m, centre[2] - direction[2] * distance_m],
    direction,
    up,
    fieldOfView_deg: FIELD_OF_VIEW_DEG,
    aspectRatio: ASPECT_RATIO,
  };
}
