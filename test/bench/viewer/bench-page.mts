/**
 * Runs in the benchmark's chromium page: loads one .glb into the viewer engine or into the naive baseline and
 * measures both the same way. Each frame is followed by a one-pixel read, which makes the browser wait for the
 * GPU, so frame times include the drawing and not just the submission.
 */
import { ViewerEngine } from '../../../src/app/viewer/viewer-engine';
import { NaiveViewer } from './naive-viewer.mts';

export interface RunRequest {
  url: string;
  /** JSON list of the model's member GlobalIds. */
  idsUrl: string;
  frames: number;
  recolours: number;
}

export interface RunResult {
  load_ms: number;
  drawCalls: number;
  triangles: number;
  frame_ms: number;
  recolour_ms: number;
  recolourAndFrame_ms: number;
  programs: number;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
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

function canvas(): HTMLCanvasElement {
  return document.getElementById('view') as HTMLCanvasElement;
}

async function runEngine({ url, idsUrl, frames, recolours }: RunRequest): Promise<RunResult> {
  const bytes = await (await fetchOk(url)).arrayBuffer();
  const maps = colourMaps((await (await fetchOk(idsUrl)).json()) as string[], recolours * 2);
  const engine = new ViewerEngine();
  engine.init(canvas());
  engine.resize(canvas().clientWidth, canvas().clientHeight);

  const start = performance.now();
  await engine.loadGlb(bytes);
  engine.readPixel(0, 0);
  const load_ms = performance.now() - start;
  const { drawCalls, triangles } = engine.stats();

  const frameTimes: number[] = [];
  for (let i = 0; i < frames; i++) {
    const t = performance.now();
    engine.orbit(0.03, 0);
    engine.readPixel(0, 0);
    frameTimes.push(performance.now() - t);
  }

  const recolourTimes: number[] = [];
  const recolourFrameTimes: number[] = [];
  for (let i = 0; i < recolours; i++) {
    let t = performance.now();
    engine.setColours(maps[2 * i]);
    recolourTimes.push(performance.now() - t);
    t = performance.now();
    engine.setColours(maps[2 * i + 1]);
    engine.readPixel(0, 0);
    recolourFrameTimes.push(performance.now() - t);
  }
  const programs = engine.stats().programs;
  engine.dispose();
  return {
    load_ms,
    drawCalls,
    triangles,
    frame_ms: median(frameTimes),
    recolour_ms: median(recolourTimes),
    recolourAndFrame_ms: median(recolourFrameTimes),
    programs,
  };
}

async function runNaive({ url, idsUrl, frames, recolours }: RunRequest): Promise<RunResult> {
  const bytes = await (await fetchOk(url)).arrayBuffer();
  const maps = colourMaps((await (await fetchOk(idsUrl)).json()) as string[], recolours * 2);
  const viewer = new NaiveViewer(canvas());
  const start = performance.now();
  await viewer.load(bytes);
  viewer.renderAndWait();
  const load_ms = performance.now() - start;
  const drawCalls = viewer.drawCalls;
  const triangles = viewer.renderer.info.render.triangles;

  const frameTimes: number[] = [];
  for (let i = 0; i < frames; i++) {
    const t = performance.now();
    viewer.orbit(0.03);
    viewer.renderAndWait();
    frameTimes.push(performance.now() - t);
  }

  const recolourTimes: number[] = [];
  const recolourFrameTimes: number[] = [];
  for (let i = 0; i < recolours; i++) {
    let t = performance.now();
    viewer.recolour(maps[2 * i]);
    recolourTimes.push(performance.now() - t);
    t = performance.now();
    viewer.recolour(maps[2 * i + 1]);
    viewer.renderAndWait();
    recolourFrameTimes.push(performance.now() - t);
  }
  return {
    load_ms,
    drawCalls,
    triangles,
    frame_ms: median(frameTimes),
    recolour_ms: median(recolourTimes),
    recolourAndFrame_ms: median(recolourFrameTimes),
    programs: viewer.renderer.info.programs?.length ?? 0,
  };
}

function webGlRenderer(): string {
  const gl = document.createElement('canvas').getContext('webgl2');
  return gl ? String(gl.getParameter(gl.RENDERER)) : 'no WebGL 2';
}

Object.assign(window, { viewerBench: { engine: runEngine, naive: runNaive, webGlRenderer } });
