/**
 * The view's two cameras (perspective and orthogonal, sharing one orbit pivot) and their navigation: mouse and
 * touch through OrbitControls, programmatic orbit / pan / zoom for the keyboard, framing and short flights.
 */
import { OrthographicCamera, PerspectiveCamera, type Sphere, Vector3 } from 'three';
import { OrbitControls } from 'three/addons/controls/OrbitControls.js';
import { fitDistance_m, fitHeight_m } from './camera-framing';
import type { Vec3 } from './ifc-axes';
import type { CameraPose } from './viewpoint';

export type Projection = 'perspective' | 'orthogonal';

const DEFAULT_FIELD_OF_VIEW_DEG = 45;
/** Room around a framed sphere, so it does not touch the canvas edges. */
const FRAMING_MARGIN = 1.08;
const FLIGHT_DURATION_MS = 450;

interface Flight {
  start_ms: number;
  fromPosition: Vector3;
  fromTarget: Vector3;
  toPosition: Vector3;
  toTarget: Vector3;
  fromHeight_m: number;
  toHeight_m: number;
}

const _direction = /*@__PURE__*/ new Vector3();
const _up = /*@__PURE__*/ new Vector3();
const _offset = /*@__PURE__*/ new Vector3();

function toVec3(v: Vector3): Vec3 {
  return [v.x, v.y, v.z];
}

export class CameraRig {
  readonly perspective = new PerspectiveCamera(DEFAULT_FIELD_OF_VIEW_DEG, 1, 0.01, 1000);
  readonly orthographic = new OrthographicCamera(-1, 1, 1, -1, 0.01, 1000);
  readonly controls: OrbitControls;

  private active: PerspectiveCamera | OrthographicCamera = this.perspective;
  private aspectRatio = 1;
  /** Visible height of the orthogonal view at zoom 1. */
  private orthographicHeight_m = 10;
  private sceneRadius_m = 10;
  private flight: Flight | null = null;

  constructor(domElement: HTMLElement) {
    this.controls = new OrbitControls(this.perspective, domElement);
    this.controls.enableDamping = true;
    this.controls.dampingFactor = 0.2;
    this.controls.zoomToCursor = true;
  }

  get camera(): PerspectiveCamera | OrthographicCamera {
    return this.active;
  }

  get projection(): Projection {
    return this.active === this.perspective ? 'perspective' : 'orthogonal';
  }

  get target(): Vector3 {
    return this.controls.target;
  }

  get animating(): boolean {
    return this.flight !== null;
  }

  setAspect(aspectRatio: number): void {
    this.aspectRatio = aspectRatio;
    this.perspective.aspect = aspectRatio;
    this.applyOrthographicFrustum();
    this.perspective.updateProjectionMatrix();
  }

  setSceneRadius(radius_m: number): void {
    this.sceneRadius_m = Math.max(radius_m, 0.1);
  }

  /** Near and far planes follow the pivot distance, which keeps depth precision where the model is. */
  updateClippingRange(): void {
    const distance = this.active.position.distanceTo(this.controls.target);
    const near = this.active === this.perspective ? Math.max(0.005, distance / 500) : 0.005;
    const far = distance + this.sceneRadius_m * 4;
    if (this.active.near !== near || this.active.far !== far) {
      this.active.near = near;
      this.active.far = far;
      this.active.updateProjectionMatrix();
    }
  }

  setProjection(projection: Projection): void {
    if (projection === this.projection) return;
    const halfTan = Math.tan((this.perspective.fov * Math.PI) / 360);
    const distance = this.active.position.distanceTo(this.controls.target);
    if (projection === 'orthogonal') {
      this.orthographicHeight_m = 2 * distance * halfTan;
      this.orthographic.zoom = 1;
      this.orthographic.position.copy(this.perspective.position);
      this.orthographic.quaternion.copy(this.perspective.quaternion);
      this.active = this.orthographic;
    } else {
      const visibleHeight = this.orthographicHeight_m / this.orthographic.zoom;
      _offset.subVectors(this.orthographic.position, this.controls.target).setLength(visibleHeight / (2 * halfTan));
      this.perspective.position.copy(this.controls.target).add(_offset);
      this.active = this.perspective;
    }
    this.controls.object = this.active;
    this.applyOrthographicFrustum();
    this.controls.update();
  }

  /** Frames a sphere, looking along `direction` with `up` at the top (three.js axes; default: as now). */
  frame(sphere: Sphere, animate: boolean, direction?: Vector3, up?: Vector3): void {
    const look = direction ? _direction.copy(direction).normalize() : this.active.getWorldDirection(_direction);
    const radius = Math.max(sphere.radius, 0.05) * FRAMING_MARGIN;
    const distance = fitDistance_m(radius, this.perspective.fov, this.aspectRatio);
    const toTarget = sphere.center.clone();
    const toPosition = toTarget.clone().addScaledVector(look, -distance);
    // Without a requested up, the screen keeps its current up (a turned plan stays turned).
    this.nudgeOffVertical(toPosition, look, up ?? _up.set(0, 1, 0).applyQuaternion(this.active.quaternion), distance);
    const toHeight = fitHeight_m(radius, this.aspectRatio);
    this.moveTo(toPosition, toTarget, toHeight, animate);
  }

  /** Where the camera is and how it looks, in three.js axes. */
  pose(): CameraPose {
    const direction = toVec3(this.active.getWorldDirection(_direction));
    const up = toVec3(_up.set(0, 1, 0).applyQuaternion(this.active.quaternion));
    const aim = { position: toVec3(this.active.position), direction, up, aspectRatio: this.aspectRatio };
    return this.active === this.perspective
      ? { kind: 'perspective', fieldOfView_deg: this.perspective.fov, ...aim }
      : { kind: 'orthogonal', viewToWorldScale_m: this.orthographicHeight_m / this.orthographic.zoom, ...aim };
  }

  /** Places the camera as a pose says; the orbit pivot sits `pivotDistance_m` ahead of it. */
  setPose(pose: CameraPose, pivotDistance_m: number): void {
    this.flight = null;
    this.setProjection(pose.kind);
    const position = new Vector3(...pose.position);
    const direction = _direction.set(...pose.direction).normalize();
    const target = position.clone().addScaledVector(direction, pivotDistance_m);
    this.nudgeOffVertical(position, direction, _up.set(...pose.up), pivotDistance_m);
    if (pose.kind === 'perspective') {
      this.perspective.fov = pose.fieldOfView_deg;
      this.perspective.updateProjectionMatrix();
    } else {
      this.orthographicHeight_m = pose.viewToWorldScale_m;
      this.orthographic.zoom = 1;
    }
    this.moveTo(position, target, this.orthographicHeight_m, false);
  }

  orbit(left_rad: number, up_rad: number): void {
    this.controls.rotateLeft(left_rad);
    this.controls.rotateUp(up_rad);
  }

  pan(dx_px: number, dy_px: number): void {
    this.controls.pan(dx_px, dy_px);
  }

  /** Factor > 1 comes closer (or zooms in, for the orthogonal camera). */
  zoom(factor: number): void {
    if (factor > 1) this.controls.dollyOut(factor);
    else this.controls.dollyIn(1 / factor);
  }

  /** Advances a flight; true while one is under way. Called once per rendered frame. */
  step(now_ms: number): boolean {
    const flight = this.flight;
    if (flight === null) return false;
    const progress = Math.min(1, (now_ms - flight.start_ms) / FLIGHT_DURATION_MS);
    const eased = progress * progress * (3 - 2 * progress);
    this.active.position.lerpVectors(flight.fromPosition, flight.toPosition, eased);
    this.controls.target.lerpVectors(flight.fromTarget, flight.toTarget, eased);
    this.orthographicHeight_m = flight.fromHeight_m + (flight.toHeight_m - flight.fromHeight_m) * eased;
    this.applyOrthographicFrustum();
    this.controls.update();
    if (progress >= 1) this.flight = null;
    return this.flight !== null;
  }

  dispose(): void {
    this.controls.dispose();
  }

  /**
   * OrbitControls keeps the world's up; looking straight down, the screen's up then follows from where the camera
   * sits. Stepping back a hair against `up` makes that the requested up (north for a plan).
   */
  private nudgeOffVertical(position: Vector3, direction: Vector3, up: Vector3, distance_m: number): void {
    if (Math.abs(direction.y) < 0.9999) return;
    position.addScaledVector(_offset.copy(up).setY(0).normalize(), -distance_m * 1e-4);
  }

  private moveTo(position: Vector3, target: Vector3, height_m: number, animate: boolean): void {
    const reduceMotion = globalThis.matchMedia?.('(prefers-reduced-motion: reduce)').matches ?? false;
    if (this.active === this.orthographic) {
      // Zoom folds into the height, so a flight interpolates one number.
      this.orthographicHeight_m /= this.orthographic.zoom;
      this.orthographic.zoom = 1;
    }
    if (animate && !reduceMotion) {
      this.flight = {
        start_ms: performance.now(),
        fromPosition: this.active.position.clone(),
        fromTarget: this.controls.target.clone(),
        toPosition: position,
        toTarget: target,
        fromHeight_m: this.orthographicHeight_m,
        toHeight_m: this.active === this.orthographic ? height_m : this.orthographicHeight_m,
      };
      return;
    }
    this.flight = null;
    this.active.position.copy(position);
    this.controls.target.copy(target);
    if (this.active === this.orthographic) this.orthographicHeight_m = height_m;
    this.applyOrthographicFrustum();
    this.controls.update();
  }

  private applyOrthographicFrustum(): void {
    const half = this.orthographicHeight_m / 2;
    this.orthographic.top = half;
    this.orthographic.bottom = -half;
    this.orthographic.left = -half * this.aspectRatio;
    this.orthographic.right = half * this.aspectRatio;
    this.orthographic.updateProjectionMatrix();
  }
}
