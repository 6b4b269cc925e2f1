/**
 * Picking through an id buffer: the member batch is drawn once more into a 1×1 target, through a camera whose view
 * is narrowed to the pixel under the pointer, with each instance's id as its colour (layout in pick-id.ts). Cost
 * does not grow with the number of members the way a ray test over 50,000 bounding volumes would, and per-object
 * frustum culling of the narrowed view skips almost every instance.
 */
import {
  type BatchedMesh,
  Color,
  type Material,
  type Object3D,
  type OrthographicCamera,
  type PerspectiveCamera,
  type Plane,
  type Scene,
  ShaderMaterial,
  type WebGLRenderer,
  WebGLRenderTarget,
} from 'three';
import type { GpuResources } from './gpu-resources';
import { decodePickId } from './pick-id';

const PICK_VERTEX_SHADER = /* glsl */ `
#include <common>
#include <batching_pars_vertex>
#include <clipping_planes_pars_vertex>
flat out float vPickId;
void main() {
  #include <begin_vertex>
  #include <batching_vertex>
  #include <project_vertex>
  #include <clipping_planes_vertex>
  #ifdef USE_BATCHING
    vPickId = getIndirectIndex( gl_DrawID ) + 1.0;
  #else
    vPickId = 0.0;
  #endif
}
`;

// Writes id + 1 as little-endian bytes in red, green, blue; exact for ids below 2^24.
const PICK_FRAGMENT_SHADER = /* glsl */ `
#include <clipping_planes_pars_fragment>
flat in float vPickId;
void main() {
  #include <clipping_planes_fragment>
  float id = vPickId;
  float red = mod( id, 256.0 );
  id = floor( id / 256.0 );
  float green = mod( id, 256.0 );
  float blue = floor( id / 256.0 );
  gl_FragColor = vec4( red, green, blue, 255.0 ) / 255.0;
}
`;

const _clearColour = /*@__PURE__*/ new Color();
const _pixel = new Uint8Array(4);

export class GpuPicker {
  private readonly material: ShaderMaterial;
  private readonly target: WebGLRenderTarget;

  constructor(resources: GpuResources, clippingPlanes: Plane[]) {
    this.material = resources.track(
      new ShaderMaterial({ vertexShader: PICK_VERTEX_SHADER, fragmentShader: PICK_FRAGMENT_SHADER, clipping: true }),
    );
    this.material.clippingPlanes = clippingPlanes;
    this.target = resources.track(new WebGLRenderTarget(1, 1));
  }

  /**
   * The instance drawn at a canvas pixel (CSS pixels from the top left), or −1. `hidden` are drawn objects that
   * must not take part (see-through context, section handle, outlines).
   */
  pick(
    renderer: WebGLRenderer,
    scene: Scene,
    camera: PerspectiveCamera | OrthographicCamera,
    batch: BatchedMesh,
    hidden: readonly Object3D[],
    x_px: number,
    y_px: number,
  ): number {
    const width = renderer.domElement.clientWidth;
    const height = renderer.domElement.clientHeight;
    if (!(x_px >= 0 && y_px >= 0 && x_px < width && y_px < height)) return -1;

    const wasVisible = hidden.map((object) => object.visible);
    const material: Material | Material[] = batch.material;
    const clearAlpha = renderer.getClearAlpha();
    renderer.getClearColor(_clearColour);
    const background = scene.background;
    try {
      hidden.forEach((object) => (object.visible = false));
      batch.material = this.material;
      scene.background = null;
      camera.setViewOffset(width, height, Math.floor(x_px), Math.floor(y_px), 1, 1);
      renderer.setRenderTarget(this.target);
      renderer.setClearColor(0x000000, 0);
      renderer.clear();
      renderer.render(scene, camera);
      renderer.readRenderTargetPixels(this.target, 0, 0, 1, 1, _pixel);
    } finally {
      camera.clearViewOffset();
      renderer.setRenderTarget(null);
      renderer.setClearColor(_clearColour, clearAlpha);
      scene.background = background;
      batch.material = material;
      hidden.forEach((object, i) => (object.visible = wasVisible[i]));
    }
    return decodePickId(_pixel[0], _pixel[1], _pixel[2]);
  }
}
