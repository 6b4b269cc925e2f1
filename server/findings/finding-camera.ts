/**
 * Cameras for findings that have no viewpoint of their own (raised by a check run): framed on the members' axes,
 * or on the whole model when those members are not in it any more. BCF 3.0 requires a camera in every viewpoint.
 */
import type { MemberRecord } from '../ifc/model-read-result';
import { type ModelBox, framingCamera } from './bcf/bcf-camera';
import type { FindingViewpoint, PerspectiveCamera } from './export/finding-export';

const M_PER_MM = 0.001;
/** Nothing known about the model: look at its origin. */
const ORIGIN_BOX: ModelBox = { min_m: [0, 0, 0], max_m: [0, 0, 0] };

function unionOf(boxes: readonly ModelBox[]): ModelBox | undefined {
  if (boxes.length === 0) return undefined;
  const min = [...boxes[0].min_m];
  const max = [...boxes[0].max_m];
  for (const box of boxes) {
    for (let i = 0; i < 3; i++) {
      min[i] = Math.min(min[i], box.min_m[i]);
      max[i] = Math.max(max[i], box.max_m[i]);
    }
  }
  return { min_m: [min[0], min[1], min[2]], max_m: [max[0], max[1], max[2]] };
}

/** Each member's axis as a box in metres (IFC model coordinates), for the members that have one. */
export function axisBoxes(records: readonly Pick<MemberRecord, 'globalId' | 'axis'>[]): Map<string, ModelBox> {
  const boxes = new Map<string, ModelBox>();
  for (const { globalId, axis } of records) {
    if (!axis) continue;
    const start = axis.start_mm.map((v) => v * M_PER_MM);
    const end = axis.end_mm.map((v) => v * M_PER_MM);
    boxes.set(globalId, {
      min_m: [Math.min(start[0], end[0]), Math.min(start[1], end[1]), Math.min(start[2], end[2])],
      max_m: [Math.max(start[0], end[0]), Math.max(start[1], end[1]), Math.max(start[2], end[2])],
    });
  }
  return boxes;
}

export function cameraFor(memberGlobalIds: readonly string[], boxes: ReadonlyMap<string, ModelBox>): PerspectiveCamera {
  const own = unionOf(memberGlobalIds.flatMap((id) => boxes.get(id) ?? []));
  return framingCamera(own ?? unionOf([...boxes.values()]) ?? ORIGIN_BOX);
}

/** The finding's viewpoint with a camera: its own, or one framing its members with everything visible. */
export function viewpointWithCamera(
  memberGlobalIds: readonly string[],
  viewpoint: FindingViewpoint | undefined,
  boxes: ReadonlyMap<string, ModelBox>,
): FindingViewpoint {
  const base: FindingViewpoint = viewpoint ?? { selectedGlobalIds: memberGlobalIds, visibility: { defaultVisible: true, exceptionGlobalIds: [] } };
  return base.camera ? base : { ...base, camera: cameraFor(memberGlobalIds, boxes) };
}
