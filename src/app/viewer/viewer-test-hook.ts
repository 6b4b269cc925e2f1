import { isDevMode } from '@angular/core';
import type { ViewerEngine } from './viewer-engine';
import { VIEWER_TEST_HOOK_KEY, type ViewerTestHook } from './viewer-probe';

function hookEnabled(): boolean {
  try {
    return isDevMode() || globalThis.localStorage?.getItem(VIEWER_TEST_HOOK_KEY) === 'on';
  } catch {
    // Storage can be blocked; then only development builds get the hook.
    return isDevMode();
  }
}

function memberColour(engine: ViewerEngine, globalId: string): [number, number, number, number] | null {
  const [shading, context] = [engine.currentShading(), engine.contextVisible()];
  try {
    engine.setShading('flat');
    engine.setContextVisible(false);
    const point = engine.screenPositionOf(globalId);
    return point === null ? null : engine.readPixel(point.x_px, point.y_px);
  } finally {
    engine.setShading(shading);
    engine.setContextVisible(context);
  }
}

/** Installs the hook when enabled; returns the function that removes it again. */
export function installViewerTestHook(engine: ViewerEngine): () => void {
  if (!hookEnabled()) return () => undefined;
  const hook: ViewerTestHook = {
    readPixel: (x_px, y_px) => engine.readPixel(x_px, y_px),
    screenPositionOf: (globalId) => engine.screenPositionOf(globalId),
    pick: (x_px, y_px) => engine.pick(x_px, y_px),
    memberColour: (globalId) => memberColour(engine, globalId),
    stats: () => engine.stats(),
    getViewpoint: () => engine.getViewpoint(),
    fitTo: (globalIds) => engine.fitTo(globalIds, false),
  };
  const host = globalThis as { __taulensViewer?: ViewerTestHook };
  host.__taulensViewer = hook;
  return () => {
    if (host.__taulensViewer === hook) delete host.__taulensViewer;
  };
}
