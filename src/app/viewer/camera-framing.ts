import type { Vec3 } from './ifc-axes';

export type StandardView = 'plan' | 'front' | 'side' | 'iso';

export interface StandardViewDefinition {
  label: string;
  /** Where the camera looks, in IFC axes (Z up, +Y taken as plan north). */
  direction: Vec3;
  /** Top of the screen, in IFC axes. */
  up: Vec3;
}

const ISO_DIRECTION: Vec3 = [-1 / Math.sqrt(3), 1 / Math.sqrt(3), -1 / Math.sqrt(3)];

/** Drawing-office views: plan from above with north up, elevations from the south and the east, an isometric. */
export const STANDARD_VIEWS: Readonly<Record<StandardView, StandardViewDefinition>> = {
  plan: { label: 'Plan', direction: [0, 0, -1], up: [0, 1, 0] },
  front: { label: 'South elevation', direction: [0, 1, 0], up: [0, 0, 1] },
  side: { label: 'East elevation', direction: [-1, 0, 0], up: [0, 0, 1] },
  // Up is the IFC Z axis made square to the view direction.
  iso: { label: 'Isometric', direction: ISO_DIRECTION, up: [-1 / Math.sqrt(6), 1 / Math.sqrt(6), 2 / Math.sqrt(6)] },
};

/**
 * How far a perspective camera must stand from the centre of a sphere to show all of it: the sphere touches the
 * narrower of the two view cones, d = r / sin(α) with α the smaller half-angle (common practice, no source).
 */
export function fitDistance_m(radius_m: number, verticalFieldOfView_deg: number, aspectRatio: number): number {
  const halfVertical_rad = (verticalFieldOfView_deg * Math.PI) / 360;
  const halfHorizontal_rad = Math.atan(Math.tan(halfVertical_rad) * aspectRatio);
  return radius_m / Math.sin(Math.min(halfVertical_rad, halfHorizontal_rad));
}

/** Visible height an orthogonal view needs to show a sphere whole, in either screen direction. */
export function fitHeight_m(radius_m: number, aspectRatio: number): number {
  return 2 * radius_m * Math.max(1, 1 / aspectRatio);
}
