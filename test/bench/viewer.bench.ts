/**
 * 3D view benchmark (`npm run bench:viewer`): synthetic frames of 5k / 20k / 50k I-section members, shown in
 * headless chromium by the viewer engine and by a naive one-mesh-per-element baseline. Prints medians over several
 * runs (a fresh page each) and the baseline / engine ratio for: time from .glb received to first frame, draw calls,
 * frame time while orbiting, time to recolour every member. Targets: ≤ 20 draw calls at 50k, recolour < 16 ms at 20k.
 *
 * Environment: VIEWER_BENCH_SIZES=5000,20000 to choose sizes, VIEWER_BENCH_RUNS=3 for runs per size. Chromium
 * renders with SwiftShader (software WebGL), so frame times are CPU rasterisation, far slower than any GPU.
 */
import { build } from 'esbuild';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { type AddressInfo } from 'node:net';
import { createServer } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { launchChromium } from '../e2e/chromium';
import { type RunResult, median } from './viewer/bench-run';
import { syntheticFrameGlb } from './viewer/synthetic-frame-glb';

const SIZES = (process.env['VIEWER_BENCH_SIZES'] ?? '5000,20000,50000').split(',').map(Number);
const RUNS = Number(process.env['VIEWER_BENCH_RUNS'] ?? 3);
// Bump when the generator changes, so cached models are made again.
const MODEL_VERSION = 2;
const VIEWPORT = { width: 1280, height: 720 };

type Kind = 'engine' | 'naive';

/** Generated models are kept between runs in the temp folder; making the 50k one takes a while. */
async function modelFiles(size: number, folder: string): Promise<{ glb: string; ids: string }> {
  const glb = join(folder, `frame-${size}-v${MODEL_VERSION}.glb`);
  const ids = join(folder, `frame-${size}-v${MODEL_VERSION}.ids.json`);
  if (!existsSync(glb) || !existsSync(ids)) {
    const start = performance.now();
    const model = await syntheticFrameGlb(size);
    writeFileSync(glb, model.glb);
    writeFileSync(ids, JSON.stringify(model.memberGlobalIds));
    const mb = (model.glb.byteLength / 1e6).toFixed(1);
    console.log(`generated ${size} members (${mb} MB) in ${((performance.now() - start) / 1000).toFixed(1)} s`);
  }
  return { glb, ids };
}

async function bundlePage(): Promise<string> {
  const result = await build({
    entryPoints: [join(__dirname, 'viewer', 'bench-page.mts')],
    bundle: true,
    write: false,
    format: 'iife',
    platform: 'browser',
    target: 'es2022',
    logLevel: 'warning',
  });
  return result.outputFiles[0].text;
}

const PAGE_HTML = `<!doctype html><html><head><meta charset="utf-8"><title>viewer bench</title>
<style>html,body{margin:0}canvas{display:block;width:${VIEWPORT.width}px;height:${VIEWPORT.height}px}</style>
</head><body><canvas id="view"></canvas><script src="/bench.js"></script></body></html>`;

interface ServedFile {
  path?: string;
  body?: string;
  type: string;
}

function serve(files: ReadonlyMap<string, ServedFile>): Promise<{ url: string; close(): void }> {
  const server = createServer((request, response) => {
    const file = files.get(request.url ?? '');
    if (!file) {
      response.writeHead(404).end();
      return;
    }
    const body = file.body ?? readFileSync(file.path!);
    response.writeHead(200, { 'content-type': file.type, 'content-length': Buffer.byteLength(body) }).end(body);
  });
  return new Promise((resolve) =>
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as AddressInfo;
      resolve({ url: `http://127.0.0.1:${port}`, close: () => server.close() });
    }),
  );
}

function format(value: number, digits = 1): string {
  return value.toFixed(digits).padStart(10);
}

function printTable(size: number, engine: RunResult, naive: RunResult): void {
  const rows: [string, keyof RunResult, number][] = [
    ['.glb received → first frame (ms)', 'load_ms', 0],
    ['draw calls', 'drawCalls', 0],
    ['triangles drawn', 'triangles', 0],
    ['frame while orbiting (ms)', 'frame_ms', 1],
    ['issuing a frame, CPU only (ms)', 'submit_ms', 2],
    ['recolour all members (ms)', 'recolour_ms', 2],
    ['recolour + next frame (ms)', 'recolourAndFrame_ms', 1],
  ];
  console.log(`\n${size.toLocaleString('en')} members (medians of ${RUNS} runs)`);
  console.log(`${'metric'.padEnd(34)}${'engine'.padStart(10)}${'naive'.padStart(10)}${'naive/engine'.padStart(14)}`);
  for (const [label, key, digits] of rows) {
    const ratio = engine[key] > 0 ? (naive[key] / engine[key]).toFixed(2) : '–';
    console.log(`${label.padEnd(34)}${format(engine[key], digits)}${format(naive[key], digits)}${ratio.padStart(14)}`);
  }
}

function medianResult(results: RunResult[]): RunResult {
  const keys = Object.keys(results[0]) as (keyof RunResult)[];
  return Object.fromEntries(keys.map((key) => [key, median(results.map((r) => r[key]))])) as unknown as RunResult;
}

async function main(): Promise<void> {
  const modelFolder = join(tmpdir(), 'taulens-viewer-bench');
  mkdirSync(modelFolder, { recursive: true });
  const files = new Map<string, ServedFile>([
    ['/', { body: PAGE_HTML, type: 'text/html' }],
    ['/bench.js', { body: await bundlePage(), type: 'text/javascript' }],
  ]);
  for (const size of SIZES) {
    const { glb, ids } = await modelFiles(size, modelFolder);
    files.set(`/models/${size}.glb`, { path: glb, type: 'model/gltf-binary' });
    files.set(`/models/${size}.ids.json`, { path: ids, type: 'application/json' });
  }
  const server = await serve(files);
  const profile = mkdtempSync(join(tmpdir(), 'taulens-viewer-bench-profile-'));
  const context = await launchChromium(profile, VIEWPORT);
  try {
    const probe = await context.newPage();
    await probe.goto(server.url);
    // Strings, not functions: this file is compiled without the DOM library; the page defines viewerBench.
    const gpu = await probe.evaluate('window.viewerBench.webGlRenderer()');
    await probe.close();
    console.log(`chromium WebGL 2 renderer: ${gpu}`);

    const summary: { size: number; engine: RunResult; naive: RunResult }[] = [];
    for (const size of SIZES) {
      const results: Record<Kind, RunResult[]> = { engine: [], naive: [] };
      for (let run = 0; run < RUNS; run++) {
        for (const kind of ['engine', 'naive'] as const) {
          const page = await context.newPage();
          page.on('pageerror', (error) => console.error(`page error (${kind}, ${size}): ${error.message}`));
          await page.goto(server.url);
          const request = {
            url: `/models/${size}.glb`,
            idsUrl: `/models/${size}.ids.json`,
            // The naive baseline takes seconds per frame at 50k in software rendering.
            frames: kind === 'engine' ? 12 : size > 10_000 ? 4 : 8,
            recolours: kind === 'engine' ? 9 : 5,
          };
          const result = (await page.evaluate(`window.viewerBench.${kind}(${JSON.stringify(request)})`)) as RunResult;
          results[kind].push(result);
          await page.close();
        }
      }
      const engine = medianResult(results.engine);
      const naive = medianResult(results.naive);
      summary.push({ size, engine, naive });
      printTable(size, engine, naive);
    }

    console.log('\ntargets');
    for (const { size, engine } of summary) {
      if (size === 50_000) {
        const verdict = engine.drawCalls <= 20 ? 'met' : 'MISSED';
        console.log(`  draw calls at 50k: ${engine.drawCalls} (target ≤ 20): ${verdict}`);
      }
      if (size === 20_000) {
        const verdict = engine.recolour_ms < 16 ? 'met' : 'MISSED';
        console.log(`  recolour of 20k: ${engine.recolour_ms.toFixed(2)} ms (target < 16 ms): ${verdict}`);
      }
    }
  } finally {
    await context.close();
    rmSync(profile, { recursive: true, force: true });
    server.close();
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exitCode = 1;
});
