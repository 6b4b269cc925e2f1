/**
 * What browser tests and the stats overlay read off the engine. Free of three.js and Angular, so a Node-side
 * browser test can import it.
 */
import type { ViewerViewpoint } from './viewpoint';

/** Set this localStorage key to "on" (e.g. in a browser test's init script) to get the hook in a production build. */
export const VIEWER_TEST_HOOK_KEY = 'taulens.viewerTestHook';

export interface ViewerStats {
  drawCalls: number;
  triangles: number;
  geometries: number;
  textures: number;
  programs: number;
  members: number;
  contextElements: number;
}

/** What browser tests may ask the running 3D view, as `window.__taulensViewer`. Read-only apart from the camera. */
export interface ViewerTestHook {
  /** Screen colour at a canvas point (CSS pixels), sRGB bytes. */
  readPixel(x_px: number, y_px: number): [number, number, number, number];
  screenPositionOf(globalId: string): { x_px: number; y_px: number } | null;
  pick(x_px: number, y_px: number): string | null;
  /**
   * The colour a member shows in its legend colour: drawn without shading and without the see-through context in
   * front, read at a point where picking confirms the member; null when it is not visible anywhere.
   */
  memberColour(globalId: string): [number, number, number, number] | null;
  stats(): ViewerStats;
  getViewpoint(): ViewerViewpoint;
  fitTo(globalIds: string[]): void;
}
