/**
 * The benchmark's baseline: the same .glb shown the plain way, one three.js mesh (and one material, for its own
 * colour) per element, each drawn with its own draw call. Same renderer settings and lights as the engine.
 */
import {
  AmbientLight,
  Box3,
  Color,
  DirectionalLight,
  Mesh,
  MeshLambertMaterial,
  PerspectiveCamera,
  Scene,
  Sphere,
  Vector3,
  WebGLRenderer,
} from 'three';
import { GLTFLoader } from 'three/addons/loaders/GLTFLoader.js';
import { rendersInSoftware } from '../../../src/app/viewer/viewer-engine';

export class NaiveViewer {
  readonly renderer: WebGLRenderer;
  private readonly scene = new Scene();
  private readonly camera = new PerspectiveCamera(45, 1, 0.1, 5000);
  private readonly headlight = new DirectionalLight(0xffffff, Math.PI * 0.4);
  private readonly centre = new Vector3();
  private readonly pixel = new Uint8Array(4);
  private meshes: { globalId: string; material: MeshLambertMaterial }[] = [];

  constructor(canvas: HTMLCanvasElement) {
    // Multisampling as the engine decides it, so both draw the same pixels.
    this.renderer = new WebGLRenderer({ canvas, antialias: !rendersInSoftware() });
    this.renderer.setPixelRatio(1);
    this.renderer.setSize(canvas.clientWidth, canvas.clientHeight, false);
    this.camera.aspect = canvas.clientWidth / canvas.clientHeight;
    this.scene.background = new Color(0xf4f5f3);
    this.scene.add(new AmbientLight(0xffffff, Math.PI * 0.6), this.headlight, this.headlight.target);
  }

  async load(bytes: ArrayBuffer): Promise<void> {
    const gltf = await new GLTFLoader().parseAsync(bytes, '');
    gltf.scene.traverse((object) => {
      if (!(object instanceof Mesh)) return;
      const material = new MeshLambertMaterial();
      object.material = material;
      this.meshes.push({ globalId: String(object.userData['globalId']), material });
    });
    this.scene.add(gltf.scene);
    const sphere = new Box3().setFromObject(gltf.scene).getBoundingSphere(new Sphere());
    this.centre.copy(sphere.center);
    const distance = sphere.radius / Math.sin((22.5 * Math.PI) / 180);
    this.camera.position.copy(sphere.center).add(new Vector3(1, 1, 1).setLength(distance));
    this.camera.far = distance * 4;
    this.camera.updateProjectionMatrix();
  }

  orbit(angle_rad: number): void {
    this.camera.position.sub(this.centre).applyAxisAngle(new Vector3(0, 1, 0), angle_rad).add(this.centre);
  }

  recolour(colours: ReadonlyMap<string, number>): void {
    for (const { globalId, material } of this.meshes) material.color.setHex(colours.get(globalId) ?? 0xc8c8c8);
  }

  render(): void {
    this.camera.lookAt(this.centre);
    this.headlight.position.copy(this.camera.position);
    this.headlight.target.position.copy(this.centre);
    this.renderer.render(this.scene, this.camera);
  }

  /** Renders and reads one pixel back, which waits for the GPU to finish the frame. */
  renderAndWait(): void {
    this.render();
    const gl = this.renderer.getContext();
    gl.readPixels(0, 0, 1, 1, gl.RGBA, gl.UNSIGNED_BYTE, this.pixel);
  }
}
