/**
 * The 3D view: a plain class around three.js's WebGLRenderer that a component hosts. It renders on demand (camera
 * moves, resizes, data changes; at most one frame pending), draws the members and the context elements as one
 * batch each, picks through an id buffer and disposes everything it created. It knows nothing of Angular; the host
 * hears about hover and selection through the callbacks given to the constructor.
 */
import type { ViewerStats } from './viewer-probe';
import {
  AmbientLight,
  Box3,
  Color,
  DirectionalLight,
  LinearSRGBColorSpace,
  type Material,
  Matrix4,
  MeshBasicMaterial,
  type Object3D,
  MeshLambertMaterial,
  Raycaster,
  Scene,
  Sphere,
  Vector2,
  Vector3,
  WebGLRenderer,
} from 'three';
import { type GLTF, GLTFLoader } from 'three/addons/loaders/GLTFLoader.js';
import { CameraRig, type Projection } from './camera-rig';
import { selectionAfterClick } from './click-selection';
import { STANDARD_VIEWS, type StandardView } from './camera-framing';
import { ElementVisibility } from './element-visibility';
import { GpuPicker } from './gpu-picker';
import { type LoadProgress, ModelLoadError, downloadGlb } from './glb-download';
import { GpuResources } from './gpu-resources';
import { type Vec3, ZERO_OFFSET, ifcToThreeDirection, readModelOffset } from './ifc-axes';
import { type ModelBatch, type ModelBatches, buildModelBatches, disposeLoadedScene } from './model-batches';
import { type SectionAxis, SectionPlane } from './section-plane';
import { SelectionOutline } from './selection-outline';
import { CONTEXT_COLOUR, CONTEXT_OPACITY, NOT_CHECKED_COLOUR, type RgbHex } from './utilisation-colours';
import {
  type ViewerViewpoint,
  ifcCameraToPose,
  poseToIfcCamera,
  sectionPlaneFromIfc,
  sectionPlaneToIfc,
  visibilityOf,
} from './viewpoint';

/** The browser or device offers no WebGL 2, so the 3D view cannot start. */
export class WebGlUnavailableError extends Error {
  override readonly name = 'WebGlUnavailableError';
}

export type GlbSource = ArrayBuffer | string;

export interface ModelSummary {
  members: number;
  contextElements: number;
  /** Meshes the file did not tie to an element, left out. */
  skippedMeshes: number;
  modelOffset_m: Vec3;
}

/** A member under the pointer, at CSS pixels from the canvas's top left. */
export interface ViewerHit {
  globalId: string;
  x_px: number;
  y_px: number;
}


export interface ColourResult {
  /** Members given a colour from the map. */
  coloured: number;
  /** Keys of the map that name no member of the model. */
  notInModel: number;
}

/** Lit shades faces by their angle to the camera; flat shows each member exactly in its legend colour. */
export type Shading = 'lit' | 'flat';

export interface ViewerEngineEvents {
  /** Fires when the member under the pointer changes (or the pointer moves over it); null when there is none. */
  hovered?(hit: ViewerHit | null): void;
  /** Fires when the user changes the selection (click, Escape, hiding selected members), not for `select()`. */
  selectionChanged?(globalIds: readonly string[]): void;
  contextLost?(): void;
}

// Ambient plus a light at the camera, summing to π: three's Lambert BRDF divides by π, so a face square to the
// view shows its colour exactly and faces turned away darken by at most the ambient share.
const AMBIENT_SHARE = 0.6;
const DEFAULT_BACKGROUND = 0xf4f5f3;
const SELECTION_COLOUR = 0x111418;
const HOVER_COLOUR = 0x2e5e5a;
/** A press that moves less than this is a click, not a drag. */
const CLICK_SLOP_PX = 4;
const CLICK_MAX_MS = 600;
const KEY_ORBIT_RAD = Math.PI / 36;
const KEY_PAN_PX = 40;
const KEY_ZOOM_FACTOR = 1.2;

/**
 * Whether WebGL runs in software (SwiftShader, llvmpipe…), as on machines without a GPU and in CI. There every
 * pixel is shaded on the CPU and 4× multisampling about doubles the frame time, so the engine goes without it.
 */
export function rendersInSoftware(): boolean {
  const gl = document.createElement('canvas').getContext('webgl2');
  if (gl === null) return false;
  const info = gl.getExtension('WEBGL_debug_renderer_info');
  const renderer = String(gl.getParameter(info ? info.UNMASKED_RENDERER_WEBGL : gl.RENDERER));
  gl.getExtension('WEBGL_lose_context')?.loseContext();
  return /swiftshader|llvmpipe|softpipe|software/i.test(renderer);
}

/** sRGB byte → linear value (IEC 61966-2-1), so recolouring does no powers per member. */
const SRGB_BYTE_TO_LINEAR = Float32Array.from({ length: 256 }, (_, byte) => {
  const c = byte / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
});

const _matrix = /*@__PURE__*/ new Matrix4();
const _box = /*@__PURE__*/ new Box3();
const _point = /*@__PURE__*/ new Vector3();
const _ndc = /*@__PURE__*/ new Vector2();
const _colour = /*@__PURE__*/ new Color();
const _pixel = new Uint8Array(4);

export class ViewerEngine {
  private renderer: WebGLRenderer | null = null;
  private rig: CameraRig | null = null;
  private picker: GpuPicker | null = null;
  private readonly scene = new Scene();
  private readonly engineResources = new GpuResources();
  private readonly modelResources = new GpuResources();
  private readonly section = new SectionPlane(this.engineResources);
  private readonly selectedOutline = new SelectionOutline(this.engineResources, SELECTION_COLOUR, this.section.planes);
  private readonly hoverOutline = new SelectionOutline(this.engineResources, HOVER_COLOUR, this.section.planes);
  private readonly headlight = new DirectionalLight(0xffffff, Math.PI * (1 - AMBIENT_SHARE));
  private readonly raycaster = new Raycaster();
  private readonly listeners = new AbortController();

  private readonly materials = {
    lit: this.engineResources.track(new MeshLambertMaterial({ clippingPlanes: this.section.planes })),
    flat: this.engineResources.track(new MeshBasicMaterial({ clippingPlanes: this.section.planes })),
    context: this.engineResources.track(
      new MeshLambertMaterial({
        color: CONTEXT_COLOUR,
        transparent: true,
        opacity: CONTEXT_OPACITY,
        depthWrite: false,
        clippingPlanes: this.section.planes,
      }),
    ),
  };
  private shading: Shading = 'lit';

  private model: ModelBatches | null = null;
  private modelOffset_m: Vec3 = ZERO_OFFSET;
  private readonly bounds = new Box3();
  private readonly boundingSphere = new Sphere();
  private loadToken = 0;

  private readonly visibility = new ElementVisibility();
  private selected: string[] = [];
  private hoveredId: string | null = null;

  private framePending = false;
  private renderWanted = false;
  private hoverWanted = false;
  private frameHandle = 0;
  private readonly pointer = { x_px: 0, y_px: 0, downX_px: 0, downY_px: 0, down_ms: 0, pressed: false };
  private readonly lastFrame = { drawCalls: 0, triangles: 0 };
  private disposed = false;

  constructor(private readonly events: ViewerEngineEvents = {}) {}

  /** Starts WebGL on the canvas. Throws WebGlUnavailableError where the browser offers no WebGL 2. */
  init(canvas: HTMLCanvasElement): void {
    // camera and renderer
    let renderer: WebGLRenderer;
    try {
      renderer = new WebGLRenderer({ canvas, antialias: !rendersInSoftware(), powerPreference: 'high-performance' });
    } catch (error) {
      throw new WebGlUnavailableError(error instanceof Error ? error.message : String(error));
    }
    renderer.setPixelRatio(Math.min(globalThis.devicePixelRatio ?? 1, 2));
    renderer.localClippingEnabled = true;
    this.renderer = renderer;
    this.picker = new GpuPicker(this.engineResources, this.section.planes);

    // scene
    this.scene.background = new Color(DEFAULT_BACKGROUND);
    this.scene.add(new AmbientLight(0xffffff, Math.PI * AMBIENT_SHARE), this.headlight, this.headlight.target);
    this.scene.add(this.section.helper, this.selectedOutline.object, this.hoverOutline.object);

    // listeners: the capture phase runs before OrbitControls', so a press on the section handle can stop an orbit
    const options = { signal: this.listeners.signal };
    canvas.addEventListener('pointerdown', (event) => this.pressPointer(event), { ...options, capture: true });
    canvas.addEventListener('pointermove', (event) => this.movePointer(event), options);
    canvas.addEventListener('pointerup', (event) => this.releasePointer(event), options);
    canvas.addEventListener('pointerleave', () => this.leaveCanvas(), options);
    canvas.addEventListener('keydown', (event) => this.pressKey(event), options);
    canvas.addEventListener(
      'webglcontextlost',
      (event) => {
        event.preventDefault();
        this.events.contextLost?.();
      },
      options,
    );

    // controls
    this.rig = new CameraRig(canvas);
    this.rig.controls.addEventListener('change', () => this.requestRender());
    this.resize(canvas.clientWidth || 1, canvas.clientHeight || 1);
  }

  resize(width_px: number, height_px: number): void {
    const renderer = this.requireRenderer();
    const width = Math.max(1, Math.round(width_px));
    const height = Math.max(1, Math.round(height_px));
    renderer.setSize(width, height, false);
    this.requireRig().setAspect(width / height);
    this.requestRender();
  }

  /** Asks for one frame; several requests before it is drawn give one frame. */
  requestRender(): void {
    this.renderWanted = true;
    this.scheduleFrame();
  }

  /** Draws now, synchronously; snapshots and pixel reads use it so the drawing buffer holds the frame. */
  renderNow(): void {
    const renderer = this.requireRenderer();
    const rig = this.requireRig();
    this.renderWanted = false;
    const flying = rig.step(performance.now());
    rig.controls.update();
    rig.updateClippingRange();
    this.headlight.position.copy(rig.camera.position);
    this.headlight.target.position.copy(rig.target);
    renderer.render(this.scene, rig.camera);
    this.lastFrame.drawCalls = renderer.info.render.calls;
    this.lastFrame.triangles = renderer.info.render.triangles;
    if (flying) this.requestRender();
  }

  /**
   * Loads a revision's .glb (bytes, or a same-origin URL fetched with the session cookie), replacing the model
   * shown. Resolves to null when a later call replaced this one before it finished.
   */
  async loadGlb(source: GlbSource, onProgress?: (progress: LoadProgress) => void): Promise<ModelSummary | null> {
    const token = ++this.loadToken;
    const bytes = typeof source === 'string' ? await downloadGlb(source, onProgress) : source;
    onProgress?.({ phase: 'build', fraction: null });
    let gltf: GLTF;
    try {
      gltf = await new GLTFLoader().parseAsync(bytes, '');
    } catch (error) {
      const reason = error instanceof Error ? error.message : String(error);
      throw new ModelLoadError(`The model file is not a glTF binary the 3D view can read (${reason}).`);
    }
    if (token !== this.loadToken || this.disposed) {
      disposeLoadedScene(gltf.scene);
      return null;
    }
    let offset: Vec3;
    try {
      offset = readModelOffset(gltf.scene.userData);
    } catch (error) {
      disposeLoadedScene(gltf.scene);
      throw new ModelLoadError((error as Error).message);
    }
    this.clearModel();
    const materials = { member: this.memberMaterial(), context: this.materials.context };
    let model: ModelBatches;
    try {
      model = buildModelBatches(gltf.scene, materials, this.modelResources);
    } catch (error) {
      this.modelResources.disposeAll();
      throw new ModelLoadError(`The model file could not be drawn: ${(error as Error).message}`);
    }
    this.model = model;
    this.modelOffset_m = offset;
    this.bounds.makeEmpty();
    for (const batch of this.batches()) {
      this.scene.add(batch.mesh);
      if (batch.mesh.boundingBox) this.bounds.union(batch.mesh.boundingBox);
    }
    if (this.bounds.isEmpty()) this.bounds.set(new Vector3(-1, -1, -1), new Vector3(1, 1, 1));
    this.bounds.getBoundingSphere(this.boundingSphere);
    this.section.setBounds(this.bounds);
    this.requireRig().setSceneRadius(this.boundingSphere.radius);
    this.setColours(new Map());
    this.requireRig().frame(this.boundingSphere, false, ...this.standardViewVectors('iso'));
    this.requestRender();
    onProgress?.({ phase: 'build', fraction: 1 });
    return {
      members: model.members?.index.elementCount ?? 0,
      contextElements: model.context?.index.elementCount ?? 0,
      skippedMeshes: model.skippedMeshes,
      modelOffset_m: offset,
    };
  }

  /**
   * Colours every member: from the map by GlobalId, `fallback` for the rest. Only the batch's small colour texture
   * changes. Context elements keep their pale grey.
   */
  setColours(colours: ReadonlyMap<string, RgbHex>, fallback: RgbHex = NOT_CHECKED_COLOUR): ColourResult {
    const members = this.model?.members;
    if (!members) return { coloured: 0, notInModel: colours.size };
    const { mesh, index } = members;
    let coloured = 0;
    let current = -1;
    for (let element = 0; element < index.elementCount; element++) {
      const fromMap = colours.get(index.globalIds[element]);
      if (fromMap !== undefined) coloured++;
      const colour = fromMap ?? fallback;
      if (colour !== current) {
        // The colour texture holds linear values; the table does the sRGB decoding.
        _colour.setRGB(
          SRGB_BYTE_TO_LINEAR[(colour >> 16) & 0xff],
          SRGB_BYTE_TO_LINEAR[(colour >> 8) & 0xff],
          SRGB_BYTE_TO_LINEAR[colour & 0xff],
          LinearSRGBColorSpace,
        );
        current = colour;
      }
      for (let instance = index.firstInstanceOf(element); instance < index.endInstanceOf(element); instance++) {
        mesh.setColorAt(instance, _colour);
      }
    }
    this.requestRender();
    return { coloured, notInModel: colours.size - coloured };
  }

  /** Background behind the model, any CSS colour three.js reads (hex, rgb()); the host passes its theme surface. */
  setBackground(cssColour: string): void {
    (this.scene.background as Color).setStyle(cssColour);
    this.requestRender();
  }

  currentShading(): Shading {
    return this.shading;
  }

  setShading(shading: Shading): void {
    this.shading = shading;
    if (this.model?.members) this.model.members.mesh.material = this.memberMaterial();
    this.requestRender();
  }

  /** Shows only these members (a filter such as "only failing"); null shows all. Context elements stay. */
  setVisible(globalIds: Iterable<string> | null): void {
    this.visibility.filterMembers(globalIds);
    this.applyVisibility();
  }

  /** Shows only these elements, members or context, until `showAll()`. */
  isolate(globalIds: Iterable<string>): void {
    this.visibility.isolate(globalIds);
    this.applyVisibility();
  }

  hide(globalIds: Iterable<string>): void {
    this.visibility.hide(globalIds);
    this.applyVisibility();
  }

  /** Undoes hide and isolate; the member filter stays, as its own control shows. */
  showAll(): void {
    this.visibility.showAll();
    this.applyVisibility();
  }

  contextVisible(): boolean {
    return this.visibility.contextVisible;
  }

  setContextVisible(visible: boolean): void {
    this.visibility.contextVisible = visible;
    this.applyVisibility();
  }

  /** Replaces the selection (GlobalIds not in the model are dropped). Does not fire `selectionChanged`. */
  select(globalIds: readonly string[]): void {
    this.selected = globalIds.filter((globalId) => this.batchOf(globalId) !== null);
    this.outline(this.selectedOutline, this.selected);
  }

  selection(): readonly string[] {
    return this.selected;
  }

  /** The member drawn at a canvas point (CSS pixels from the top left), or null. Context elements are not picked. */
  pick(x_px: number, y_px: number): string | null {
    const members = this.model?.members;
    const picker = this.picker;
    if (!members || !picker) return null;
    const others: Object3D[] = [this.section.helper, this.selectedOutline.object, this.hoverOutline.object];
    if (this.model?.context) others.push(this.model.context.mesh);
    const camera = this.requireRig().camera;
    const instance = picker.pick(this.requireRenderer(), this.scene, camera, members.mesh, others, x_px, y_px);
    return members.index.globalIdOfInstance(instance);
  }

  fitAll(animate = true): void {
    if (this.model === null) return;
    this.requireRig().frame(this.boundingSphere, animate);
    this.requestRender();
  }

  /** Frames these elements; the results table's "show in 3D" flies here. */
  fitTo(globalIds: Iterable<string>, animate = true): void {
    const box = this.boxOf(globalIds);
    if (box.isEmpty()) return;
    this.requireRig().frame(box.getBoundingSphere(new Sphere()), animate);
    this.requestRender();
  }

  setStandardView(view: StandardView, animate = true): void {
    if (this.model === null) return;
    this.requireRig().frame(this.boundingSphere, animate, ...this.standardViewVectors(view));
    this.requestRender();
  }

  /** Turns the camera about its pivot, as the arrow keys do. */
  orbit(left_rad: number, up_rad: number): void {
    this.requireRig().orbit(left_rad, up_rad);
    this.requestRender();
  }

  setProjection(projection: Projection): void {
    this.requireRig().setProjection(projection);
    this.requestRender();
  }

  projection(): Projection {
    return this.requireRig().projection;
  }

  /** Cuts the model square to an IFC axis, through its middle; null removes the cut. */
  setSection(axis: SectionAxis | null): void {
    if (axis === null) this.section.disable();
    else this.section.enable(axis);
    this.requestRender();
  }

  flipSection(): void {
    this.section.flip();
    this.requestRender();
  }

  /** The cut now shown: null for none, `{ axis: null }` for a cut at an angle (restored from a viewpoint). */
  sectionState(): { axis: SectionAxis | null } | null {
    return this.section.active ? { axis: this.section.axis } : null;
  }

  /** The current view in IFC axes, ready for a finding's BCF viewpoint. */
  getViewpoint(): ViewerViewpoint {
    const centre: Vec3 = [this.boundingSphere.center.x, this.boundingSphere.center.y, this.boundingSphere.center.z];
    const { normal, constant } = this.section.plane;
    return {
      camera: poseToIfcCamera(this.requireRig().pose(), this.modelOffset_m),
      selectedGlobalIds: [...this.selected],
      visibility: visibilityOf(this.allGlobalIds(), (globalId) => this.isShown(globalId, this.isContext(globalId))),
      clippingPlanes: this.section.active
        ? [sectionPlaneToIfc({ normal: [normal.x, normal.y, normal.z], constant }, centre, this.modelOffset_m)]
        : [],
    };
  }

  /**
   * Restores a saved view. Everything is checked before anything changes, so a bad viewpoint throws a
   * ViewpointError and leaves the view as it was. Clears the member filter: the viewpoint says what is visible.
   */
  setViewpoint(viewpoint: ViewerViewpoint): void {
    const pose = viewpoint.camera ? ifcCameraToPose(viewpoint.camera, this.modelOffset_m) : null;
    const planes = viewpoint.clippingPlanes.map((plane) => sectionPlaneFromIfc(plane, this.modelOffset_m));
    const rig = this.requireRig();

    if (pose !== null) {
      const direction = new Vector3(...pose.direction);
      const ahead = _point.copy(this.boundingSphere.center).sub(new Vector3(...pose.position)).dot(direction);
      rig.setPose(pose, Math.max(ahead, this.boundingSphere.radius * 0.05));
    } else if (viewpoint.selectedGlobalIds.length > 0) {
      // Without a camera, the selected members are what the viewpoint is about.
      this.fitTo(viewpoint.selectedGlobalIds, false);
    }

    this.visibility.restore(viewpoint.visibility.defaultVisible, viewpoint.visibility.exceptionGlobalIds);
    // BCF allows several planes; the view keeps one, the first.
    if (planes.length === 0) this.section.disable();
    else this.section.setPlane(new Vector3(...planes[0].normal), planes[0].constant);
    this.applyVisibility();
    this.select(viewpoint.selectedGlobalIds);
    this.requestRender();
  }

  /** The canvas as a PNG, as shown now. */
  snapshotPng(): Promise<Blob> {
    this.renderNow();
    const canvas = this.requireRenderer().domElement;
    // Called in the same task as the render, so the drawing buffer still holds the frame.
    return new Promise((resolve, reject) =>
      canvas.toBlob(
        (blob) => (blob ? resolve(blob) : reject(new Error('The browser could not encode the view as PNG.'))),
        'image/png',
      ),
    );
  }

  /** The colour on screen at a canvas point (CSS pixels from the top left), as sRGB bytes [r, g, b, a]. */
  readPixel(x_px: number, y_px: number): [number, number, number, number] {
    this.renderNow();
    const renderer = this.requireRenderer();
    const gl = renderer.getContext();
    const ratio = renderer.getPixelRatio();
    const x = Math.floor(x_px * ratio);
    const y = gl.drawingBufferHeight - 1 - Math.floor(y_px * ratio);
    gl.readPixels(x, y, 1, 1, gl.RGBA, gl.UNSIGNED_BYTE, _pixel);
    return [_pixel[0], _pixel[1], _pixel[2], _pixel[3]];
  }

  /**
   * A canvas point (CSS pixels) where the element is visible, or null when it is hidden, off screen or covered.
   * For members the point is confirmed by picking, so a pixel read there shows that member's colour.
   */
  screenPositionOf(globalId: string): { x_px: number; y_px: number } | null {
    const batch = this.batchOf(globalId);
    if (batch === null || !this.isShown(globalId, batch === this.model?.context)) return null;
    const box = this.boxOf([globalId]);
    const size = box.getSize(new Vector3());
    const axis = size.x >= size.y && size.x >= size.z ? 'x' : size.y >= size.z ? 'y' : 'z';
    const canvas = this.requireRenderer().domElement;
    const camera = this.requireRig().camera;
    // The camera's matrices are otherwise brought up to date by the next render.
    camera.updateMatrixWorld();
    // Along the element's long axis through the middle of its box: a beam's web, a column's core.
    for (const along of [0.5, 0.3, 0.7, 0.15, 0.85]) {
      box.getCenter(_point);
      _point[axis] = box.min[axis] + size[axis] * along;
      _point.project(camera);
      if (Math.abs(_point.x) > 1 || Math.abs(_point.y) > 1 || Math.abs(_point.z) > 1) continue;
      const x_px = ((_point.x + 1) / 2) * canvas.clientWidth;
      const y_px = ((1 - _point.y) / 2) * canvas.clientHeight;
      if (batch === this.model?.context || this.pick(x_px, y_px) === globalId) return { x_px, y_px };
    }
    return null;
  }

  /** Figures of the last frame and the GPU memory held; zeros once disposed. */
  stats(): ViewerStats {
    const info = this.renderer?.info ?? { memory: { geometries: 0, textures: 0 }, programs: null };
    return {
      drawCalls: this.lastFrame.drawCalls,
      triangles: this.lastFrame.triangles,
      geometries: info.memory.geometries,
      textures: info.memory.textures,
      programs: info.programs?.length ?? 0,
      members: this.model?.members?.index.elementCount ?? 0,
      contextElements: this.model?.context?.index.elementCount ?? 0,
    };
  }

  dispose(): void {
    this.disposed = true;
    cancelAnimationFrame(this.frameHandle);
    this.listeners.abort();
    this.clearModel();
    this.selectedOutline.clear();
    this.hoverOutline.clear();
    this.engineResources.disposeAll();
    this.rig?.dispose();
    if (this.renderer) {
      this.renderer.renderLists.dispose();
      this.renderer.dispose();
      // Frees the GPU memory now instead of whenever the browser collects the canvas.
      this.renderer.forceContextLoss();
    }
    this.renderer = null;
    this.rig = null;
  }

  // frames

  private scheduleFrame(): void {
    if (this.framePending || this.disposed || this.renderer === null) return;
    this.framePending = true;
    this.frameHandle = requestAnimationFrame(() => this.drawFrame());
  }

  private drawFrame(): void {
    this.framePending = false;
    if (this.hoverWanted) {
      this.hoverWanted = false;
      this.updateHover();
    }
    if (this.renderWanted) this.renderNow();
  }

  // model state

  private memberMaterial(): Material {
    return this.shading === 'lit' ? this.materials.lit : this.materials.flat;
  }

  private batches(): ModelBatch[] {
    return [this.model?.members, this.model?.context].filter((batch): batch is ModelBatch => batch != null);
  }

  private clearModel(): void {
    for (const batch of this.batches()) this.scene.remove(batch.mesh);
    this.model = null;
    this.modelResources.disposeAll();
    this.visibility.reset();
    this.selected = [];
    this.hoveredId = null;
    this.selectedOutline.clear();
    this.hoverOutline.clear();
    this.section.disable();
  }

  private batchOf(globalId: string): ModelBatch | null {
    return this.batches().find((batch) => batch.index.has(globalId)) ?? null;
  }

  private isContext(globalId: string): boolean {
    return this.model?.context?.index.has(globalId) ?? false;
  }

  private allGlobalIds(): string[] {
    return this.batches().flatMap((batch) => batch.index.globalIds);
  }

  private isShown(globalId: string, context: boolean): boolean {
    return this.visibility.isShown(globalId, context);
  }

  private applyVisibility(): void {
    for (const batch of this.batches()) {
      const context = batch === this.model?.context;
      const { mesh, index } = batch;
      for (let element = 0; element < index.elementCount; element++) {
        const shown = this.isShown(index.globalIds[element], context);
        for (let instance = index.firstInstanceOf(element); instance < index.endInstanceOf(element); instance++) {
          mesh.setVisibleAt(instance, shown);
        }
      }
    }
    const stillShown = this.selected.filter((globalId) => this.isShown(globalId, this.isContext(globalId)));
    if (stillShown.length !== this.selected.length) {
      this.selected = stillShown;
      this.outline(this.selectedOutline, stillShown);
      this.events.selectionChanged?.(stillShown);
    }
    this.requestRender();
  }

  private instancesOf(globalIds: readonly string[]): { batch: ModelBatch; instances: number[] } | null {
    const batch = globalIds.length > 0 ? this.batchOf(globalIds[0]) : null;
    if (batch === null) return null;
    const instances: number[] = [];
    for (const element of batch.index.elementsOf(globalIds)) {
      for (let i = batch.index.firstInstanceOf(element); i < batch.index.endInstanceOf(element); i++) instances.push(i);
    }
    return { batch, instances };
  }

  private outline(outline: SelectionOutline, globalIds: readonly string[]): void {
    outline.clear();
    // Selections mix members and context rarely; outlines follow the batch of the first element.
    const found = this.instancesOf(globalIds);
    if (found) outline.show(found.batch.mesh, found.instances);
    this.requestRender();
  }

  /** World box of some elements; empty when none is in the model. */
  private boxOf(globalIds: Iterable<string>): Box3 {
    const box = new Box3();
    const ids = [...globalIds];
    for (const batch of this.batches()) {
      const { mesh, index } = batch;
      for (const element of index.elementsOf(ids)) {
        for (let instance = index.firstInstanceOf(element); instance < index.endInstanceOf(element); instance++) {
          mesh.getBoundingBoxAt(mesh.getGeometryIdAt(instance), _box);
          box.union(_box.applyMatrix4(mesh.getMatrixAt(instance, _matrix)));
        }
      }
    }
    return box;
  }

  private standardViewVectors(view: StandardView): [Vector3, Vector3] {
    const { direction, up } = STANDARD_VIEWS[view];
    return [new Vector3(...ifcToThreeDirection(direction)), new Vector3(...ifcToThreeDirection(up))];
  }

  // pointer and keyboard

  private canvasPoint(event: MouseEvent): { x_px: number; y_px: number } {
    const rect = this.requireRenderer().domElement.getBoundingClientRect();
    return { x_px: event.clientX - rect.left, y_px: event.clientY - rect.top };
  }

  private setRay(x_px: number, y_px: number): void {
    const canvas = this.requireRenderer().domElement;
    _ndc.set((x_px / canvas.clientWidth) * 2 - 1, 1 - (y_px / canvas.clientHeight) * 2);
    this.raycaster.setFromCamera(_ndc, this.requireRig().camera);
  }

  private pressPointer(event: PointerEvent): void {
    const { x_px, y_px } = this.canvasPoint(event);
    Object.assign(this.pointer, { downX_px: x_px, downY_px: y_px, down_ms: performance.now(), pressed: true });
    if (!this.section.active || event.button !== 0) return;
    this.setRay(x_px, y_px);
    if (this.section.beginDrag(this.raycaster)) {
      this.requireRig().controls.enabled = false;
      this.requireRenderer().domElement.setPointerCapture(event.pointerId);
    }
  }

  private movePointer(event: PointerEvent): void {
    const { x_px, y_px } = this.canvasPoint(event);
    Object.assign(this.pointer, { x_px, y_px });
    if (this.section.dragging) {
      this.setRay(x_px, y_px);
      this.section.dragTo(this.raycaster.ray);
      this.requestRender();
    } else if (event.buttons === 0 && event.pointerType === 'mouse') {
      this.hoverWanted = true;
      this.scheduleFrame();
    }
  }

  private releasePointer(event: PointerEvent): void {
    this.pointer.pressed = false;
    if (this.section.dragging) {
      this.section.endDrag();
      this.requireRig().controls.enabled = true;
      return;
    }
    const { x_px, y_px } = this.canvasPoint(event);
    const moved = Math.hypot(x_px - this.pointer.downX_px, y_px - this.pointer.downY_px);
    if (event.button !== 0 || moved > CLICK_SLOP_PX || performance.now() - this.pointer.down_ms > CLICK_MAX_MS) return;
    const additive = event.shiftKey || event.ctrlKey || event.metaKey;
    this.changeSelection(selectionAfterClick(this.selected, this.pick(x_px, y_px), additive));
  }

  private leaveCanvas(): void {
    this.hoverWanted = false;
    this.setHovered(null);
  }

  private updateHover(): void {
    const rig = this.requireRig();
    // Picking while the camera still moves would chase a moving target.
    if (this.pointer.pressed || rig.animating) return;
    const globalId = this.pick(this.pointer.x_px, this.pointer.y_px);
    this.setHovered(globalId === null ? null : { globalId, x_px: this.pointer.x_px, y_px: this.pointer.y_px });
  }

  private setHovered(hit: ViewerHit | null): void {
    const globalId = hit?.globalId ?? null;
    if (globalId !== this.hoveredId) {
      this.hoveredId = globalId;
      this.outline(this.hoverOutline, globalId === null ? [] : [globalId]);
    }
    this.events.hovered?.(hit);
  }

  private changeSelection(globalIds: string[]): void {
    this.select(globalIds);
    this.events.selectionChanged?.(this.selected);
  }

  private pressKey(event: KeyboardEvent): void {
    const action = this.keyAction(event.key, event.shiftKey);
    if (action === null) return;
    event.preventDefault();
    action();
    this.requestRender();
  }

  /** Arrows orbit (with Shift: pan), + and − zoom, F frames the selection or the model, Escape deselects. */
  private keyAction(key: string, shift: boolean): (() => void) | null {
    const rig = this.requireRig();
    const turn = (left: number, up: number) => () =>
      shift ? rig.pan(left * KEY_PAN_PX, up * KEY_PAN_PX) : rig.orbit(left * KEY_ORBIT_RAD, up * KEY_ORBIT_RAD);
    switch (key) {
      case 'ArrowLeft':
        return turn(1, 0);
      case 'ArrowRight':
        return turn(-1, 0);
      case 'ArrowUp':
        return turn(0, 1);
      case 'ArrowDown':
        return turn(0, -1);
      case '+':
      case '=':
        return () => rig.zoom(KEY_ZOOM_FACTOR);
      case '-':
      case '_':
        return () => rig.zoom(1 / KEY_ZOOM_FACTOR);
      case 'f':
      case 'F':
        return () => (this.selected.length > 0 ? this.fitTo(this.selected) : this.fitAll());
      case 'Escape':
        return () => this.changeSelection([]);
      default:
        return null;
    }
  }

  private requireRenderer(): WebGLRenderer {
    if (this.renderer === null) throw new Error('ViewerEngine: call init(canvas) first (or the engine was disposed).');
    return this.renderer;
  }

  private requireRig(): CameraRig {
    if (this.rig === null) throw new Error('ViewerEngine: call init(canvas) first (or the engine was disposed).');
    return this.rig;
  }
}
