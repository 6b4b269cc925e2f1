/**
 * One section plane through the model, with a see-through sheet showing where it cuts and a handle that is dragged
 * along the plane's normal. The plane lives in `planes`, an array the engine hands to every model material as its
 * clipping planes, so switching the cut on or off is a matter of filling or emptying that array.
 */
import {
  Box3,
  ConeGeometry,
  DoubleSide,
  EdgesGeometry,
  Group,
  LineBasicMaterial,
  LineSegments,
  Mesh,
  MeshBasicMaterial,
  Plane,
  PlaneGeometry,
  type Raycaster,
  type Ray,
  SphereGeometry,
  Vector3,
} from 'three';
import type { GpuResources } from './gpu-resources';
import { type Vec3, ifcToThreeDirection, threeToIfcDirection } from './ifc-axes';

/** The IFC axis the cut is square to: z gives a horizontal cut (a plan), x and y vertical cuts. */
export type SectionAxis = 'x' | 'y' | 'z';

export const SECTION_AXIS_LABELS: Readonly<Record<SectionAxis, string>> = {
  z: 'Horizontal cut',
  x: 'Vertical cut across X',
  y: 'Vertical cut across Y',
};

/** Side kept for each axis, in IFC axes: below a horizontal cut, the lower-coordinate side of a vertical one. */
const KEPT_SIDE: Readonly<Record<SectionAxis, Vec3>> = { x: [-1, 0, 0], y: [0, -1, 0], z: [0, 0, -1] };

// Copper from the product's seed colours: apart from every utilisation and status colour.
const SECTION_COLOUR = 0xb8622d;

const _centre = /*@__PURE__*/ new Vector3();
const _point = /*@__PURE__*/ new Vector3();
const _w = /*@__PURE__*/ new Vector3();
const _corner = /*@__PURE__*/ new Vector3();
const _origin = /*@__PURE__*/ new Vector3();
const _u = /*@__PURE__*/ new Vector3();
const _v = /*@__PURE__*/ new Vector3();

/** The sheet is this much larger than the model's outline, so its edge reads as the cut's edge. */
const SHEET_ROOM = 1.1;

export class SectionPlane {
  /** Empty while the cut is off; holds `plane` while it is on. Shared with the materials, never replaced. */
  readonly planes: Plane[] = [];
  readonly plane = new Plane(new Vector3(0, -1, 0), 0);
  /** Sheet and handle; the engine adds it to the scene. */
  readonly helper = new Group();

  private readonly bounds = new Box3();
  private readonly handle = new Group();
  private readonly sheet: Mesh;
  private readonly outline: LineSegments;
  private dragStartDistance_m: number | null = null;
  private dragStartConstant = 0;

  constructor(resources: GpuResources) {
    const sheetMaterial = resources.track(
      new MeshBasicMaterial({
        color: SECTION_COLOUR,
        transparent: true,
        opacity: 0.08,
        side: DoubleSide,
        depthWrite: false,
      }),
    );
    const lineMaterial = resources.track(new LineBasicMaterial({ color: SECTION_COLOUR }));
    const handleMaterial = resources.track(new MeshBasicMaterial({ color: SECTION_COLOUR }));
    const sheetGeometry = resources.track(new PlaneGeometry(1, 1));
    this.sheet = new Mesh(sheetGeometry, sheetMaterial);
    this.outline = new LineSegments(resources.track(new EdgesGeometry(sheetGeometry)), lineMaterial);

    // A knob with an arrow head to either side: the handle moves the cut both ways along its normal.
    const knob = new Mesh(resources.track(new SphereGeometry(0.35, 16, 12)), handleMaterial);
    const arrowGeometry = resources.track(new ConeGeometry(0.3, 0.7, 16));
    const ahead = new Mesh(arrowGeometry, handleMaterial);
    const behind = new Mesh(arrowGeometry, handleMaterial);
    ahead.position.set(0, 0, 0.9);
    ahead.rotation.x = Math.PI / 2;
    behind.position.set(0, 0, -0.9);
    behind.rotation.x = -Math.PI / 2;
    this.handle.add(knob, ahead, behind);
    this.helper.add(this.sheet, this.outline, this.handle);
    this.helper.visible = false;
  }

  get active(): boolean {
    return this.planes.length > 0;
  }

  /** The IFC axis the active cut is square to, or null for a cut at another angle (from a viewpoint). */
  get axis(): SectionAxis | null {
    const normal = threeToIfcDirection([this.plane.normal.x, this.plane.normal.y, this.plane.normal.z]);
    const index = normal.findIndex((component) => Math.abs(component) > 0.9999);
    return index < 0 ? null : (['x', 'y', 'z'] as const)[index];
  }

  /** The model's box, which sizes the sheet and limits how far the handle goes. */
  setBounds(box: Box3): void {
    this.bounds.copy(box);
    if (this.active) this.updateHelper();
  }

  /** Cuts through the middle of the model, square to an IFC axis. */
  enable(axis: SectionAxis): void {
    const normal = new Vector3(...ifcToThreeDirection(KEPT_SIDE[axis]));
    this.bounds.getCenter(_centre);
    this.plane.setFromNormalAndCoplanarPoint(normal, _centre);
    this.show();
  }

  /** Any plane (three.js axes): it keeps the side its normal points to. */
  setPlane(normal: Vector3, constant: number): void {
    this.plane.set(normal.clone().normalize(), constant);
    this.show();
  }

  flip(): void {
    this.plane.negate();
    this.updateHelper();
  }

  disable(): void {
    this.planes.length = 0;
    this.helper.visible = false;
    this.dragStartDistance_m = null;
  }

  /** Starts a drag when the ray meets the handle. */
  beginDrag(raycaster: Raycaster): boolean {
    if (!this.active || raycaster.intersectObject(this.handle, true).length === 0) return false;
    const distance = this.distanceAlongNormal(raycaster.ray);
    if (distance === null) return false;
    this.dragStartDistance_m = distance;
    this.dragStartConstant = this.plane.constant;
    return true;
  }

  get dragging(): boolean {
    return this.dragStartDistance_m !== null;
  }

  /** Moves the cut so the handle stays under the pointer, within the model's extent along the normal. */
  dragTo(ray: Ray): void {
    if (this.dragStartDistance_m === null) return;
    const distance = this.distanceAlongNormal(ray);
    if (distance === null) return;
    const [lowest, highest] = this.extentAlongNormal();
    const constant = this.dragStartConstant - (distance - this.dragStartDistance_m);
    // Points p on the plane satisfy n·p = −constant.
    this.plane.constant = -Math.min(highest, Math.max(lowest, -constant));
    this.updateHelper();
  }

  endDrag(): void {
    this.dragStartDistance_m = null;
  }

  private show(): void {
    if (!this.active) this.planes.push(this.plane);
    this.helper.visible = true;
    this.updateHelper();
  }

  /** Where the handle's axis comes closest to the ray, as a distance along the normal; null when they run parallel. */
  private distanceAlongNormal(ray: Ray): number | null {
    const normal = this.plane.normal;
    this.plane.projectPoint(this.bounds.getCenter(_centre), _point);
    _w.subVectors(_point, ray.origin);
    const b = normal.dot(ray.direction);
    const denominator = 1 - b * b;
    if (denominator < 1e-6) return null;
    const t = (b * ray.direction.dot(_w) - normal.dot(_w)) / denominator;
    return normal.dot(_point) + t;
  }

  /** The range of n·p over the model's box corners, a little widened so the cut can clear the model. */
  private extentAlongNormal(): [number, number] {
    const [lowest, highest] = this.extentAlong(this.plane.normal, _origin.set(0, 0, 0));
    const margin = (highest - lowest) * 0.01;
    return [lowest - margin, highest + margin];
  }

  private updateHelper(): void {
    if (this.bounds.isEmpty()) return;
    this.plane.projectPoint(this.bounds.getCenter(_centre), _point);
    this.helper.position.copy(_point);
    // The sheet and handle are modelled facing +Z; turn +Z onto the plane normal.
    this.helper.quaternion.setFromUnitVectors(_w.set(0, 0, 1), this.plane.normal);
    // The sheet covers the model's box as seen along the normal, with a little room around it.
    _u.set(1, 0, 0).applyQuaternion(this.helper.quaternion);
    _v.set(0, 1, 0).applyQuaternion(this.helper.quaternion);
    const [uMin, uMax] = this.extentAlong(_u, _point);
    const [vMin, vMax] = this.extentAlong(_v, _point);
    for (const part of [this.sheet, this.outline]) {
      part.position.set((uMin + uMax) / 2, (vMin + vMax) / 2, 0);
      part.scale.set((uMax - uMin) * SHEET_ROOM, (vMax - vMin) * SHEET_ROOM, 1);
    }
    this.handle.scale.setScalar(this.bounds.getSize(_w).length() * 0.02);
  }

  /** Range of (corner − origin) · axis over the model's box corners. */
  private extentAlong(axis: Vector3, origin: Vector3): [number, number] {
    let lowest = Infinity;
    let highest = -Infinity;
    for (let corner = 0; corner < 8; corner++) {
      _corner.set(
        corner & 1 ? this.bounds.max.x : this.bounds.min.x,
        corner & 2 ? this.bounds.max.y : this.bounds.min.y,
        corner & 4 ? this.bounds.max.z : this.bounds.min.z,
      );
      const along = _corner.sub(origin).dot(axis);
      lowest = Math.min(lowest, along);
      highest = Math.max(highest, along);
    }
    return [lowest, highest];
  }
}
