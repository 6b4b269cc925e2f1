/**
 * Runs in the benchmark's chromium page: loads one .glb into the viewer engine or into the naive baseline and
 * measures both the same way. Each frame is followed by a one-pixel read, which makes the browser wait for the
 * GPU, so frame times include the drawing and not just the submission.
 */
import { ViewerEngine } from '../../../src/app/viewer/viewer-engine';
import { type RunRequest, type RunResult, median } from './bench-run';
import { NaiveViewer } from './naive-viewer.mts';

/** The two contenders, seen the same way. */
interface Contender {
  load(bytes: ArrayBuffer): Promise<void>;
  orbit(angle_rad: number): void;
  recolour(colours: ReadonlyMap<string, number>): void;
  /** Issues a frame without waiting for the GPU to draw it. */
  render(): void;
  /** Renders and reads a pixel back. */
  renderAndWait(): void;
  figures(): { drawCalls: number; triangles: number; programs: number };
  dispose(): void;
}

function canvas(): HTMLCanvasElement {
  return document.getElementById('view') as HTMLCanvasElement;
}

function engineContender(): Contender {
  const engine = new ViewerEngine();
  engine.init(canvas());
  return {
    load: async (bytes) => void (await engine.loadGlb(bytes)),
    orbit: (angle_rad) => engine.orbit(angle_rad, 0),
    recolour: (colours) => void engine.setColours(colours),
    render: () => engine.renderNow(),
    renderAndWait: () => void engine.readPixel(0, 0),
    figures: () => engine.stats(),
    dispose: () => engine.dispose(),
  };
}

function naiveContender(): Contender {
  const viewer = new NaiveViewer(canvas());
  return {
    load: (bytes) => viewer.load(bytes),
    orbit: (angle_rad) => viewer.orbit(angle_rad),
    recolour: (colours) => viewer.recolour(colours),
    render: () => viewer.render(),
    renderAndWait: () => viewer.renderAndWait(),
    figures: () => {
      const { render, programs } = viewer.renderer.info;
      return { drawCalls: render.calls, triangles: render.triangles, programs: programs?.length ?? 0 };
    },
    dispose: () => viewer.renderer.dispose(),
  };
}

/** Colour maps prepared before timing, a different one per repetition so no recolour is a no-op. */
function colourMaps(globalIds: readonly string[], count: number): Map<string, number>[] {
  const colour = (i: number, rep: number) => ((i * 2654435761 + rep * 40503) >>> 8) & 0xffffff;
  return Array.from({ length: count }, (_, rep) => new Map(globalIds.map((id, i) => [id, colour(i, rep)])));
}

async function fetchOk(url: string): Promise<Response> {
  const response = await fetch(url);
  if (!response.ok) throw new Error(`${url}: HTTP ${response.status}`);
  return response;
}

function timed(action: () => void): number {
  const start = performance.now();
  action();
  return performance.now() - start;
}

async function measure(contender: Contender, { url, idsUrl, frames, recolours }: RunRequest): Promise<RunResult> {
  const bytes = await (await fetchOk(url)).arrayBuffer();
  const maps = colourMaps((await (await fetchOk(idsUrl)).json()) as string[], recolours * 2);

  const start = performance.now();
  await contender.load(bytes);
  contender.renderAndWait();
  const load_ms = performance.now() - start;
  const { drawCalls, triangles } = contender.figures();

  const frameTimes = Array.from({ length: frames }, () =>
    timed(() => {
      contender.orbit(0.03);
      contender.renderAndWait();
    }),
  );
  const submitTimes = Array.from({ length: frames }, () => {
    contender.orbit(0.03);
    const time = timed(() => contender.render());
    // Drain the GPU before the next sample, untimed.
    contender.renderAndWait();
    return time;
  });
  const recolourTimes: number[] = [];
  const recolourFrameTimes: number[] = [];
  for (let i = 0; i < recolours; i++) {
    recolourTimes.push(timed(() => contender.recolour(maps[2 * i])));
    recolourFrameTimes.push(
      timed(() => {
        contender.recolour(maps[2 * i + 1]);
        contender.renderAndWait();
      }),
    );
  }
  const { programs } = contender.figures();
  contender.dispose();
  return {
    load_ms,
    drawCalls,
    triangles,
    frame_ms: median(frameTimes),
    submit_ms: median(submitTimes),
    recolour_ms: median(recolourTimes),
    recolourAndFrame_ms: median(recolourFrameTimes),
    programs,
  };
}

function webGlRenderer(): string {
  const gl = document.createElement('canvas').getContext('webgl2');
  if (gl === null) return 'no WebGL 2';
  const info = gl.getExtension('WEBGL_debug_renderer_info');
  return String(gl.getParameter(info ? info.UNMASKED_RENDERER_WEBGL : gl.RENDERER));
}

Object.assign(window, {
  viewerBench: {
    engine: (request: RunRequest) => measure(engineContender(), request),
    naive: (request: RunRequest) => measure(naiveContender(), request),
    webGlRenderer,
  },
});
