/**
 * Ingest benchmark (`npm run bench:ingest [-- extruded|brep]`, both parts without an argument): the whole readModel
 * (parse, members, tessellation, .glb written to disk) against bare web-ifc doing its part of that work (OpenModel +
 * StreamAllMeshes, fetching every piece's vertices and indices) on the same generated 20,000-member model: 'extruded'
 * with the generator's standard paths, 'brep' with every member's body an IfcFacetedBrep only (as some real exports
 * write them), so the section comes from cutting the body. Each run is a fresh child process that loads the same
 * modules, so peak RSS compares like with like; runs alternate between the two and the medians are compared. The time
 * ratio is taken on CPU time (user + system) because the benchmark machine is shared; wall time is printed beside it.
 *
 * Targets (PRODUCT.md, issue 14): time ≤ 1.3 × (extruded) and ≤ 1.5 × (brep), peak memory ≤ 1.5 × bare web-ifc.
 */
import { execFileSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { ifcApi } from '../../server/ifc/open-model';
import { readModel } from '../../server/ifc/read-model';
import { writeFrameFile } from '../generator/generate-frame';

const MEMBERS = Number(process.env.BENCH_MEMBERS ?? 20000);
const RUNS = Number(process.env.BENCH_RUNS ?? 5);
const TARGET_MEMORY = 1.5;

/** Which model a part reads, and its time target. */
const PARTS = {
  extruded: { bodies: 'extruded', targetTime: 1.3 },
  brep: { bodies: 'brep', targetTime: 1.5 },
} as const;
type Part = keyof typeof PARTS;

type Mode = 'bare' | 'taulens';
interface Sample {
  /** Wall-clock time of the work. */
  ms: number;
  /** CPU time (user + system) of the work: the machine is shared, so the ratio is taken on this. */
  cpuMs: number;
  maxRss_MB: number;
}

const cacheDir = path.join(os.tmpdir(), 'taulens-bench');
// The generator's version is part of the name, so a changed generator never reuses an old file.
const modelPathOf = (part: Part): string =>
  path.join(cacheDir, part === 'extruded' ? `harbour-warehouse-${MEMBERS}-IFC4-mm-v1.ifc` : `harbour-warehouse-${MEMBERS}-IFC4-mm-${part}-v1.ifc`);

async function child(mode: Mode, file: string): Promise<void> {
  // Both modes have loaded the same modules (the imports above), so their fixed memory is the same.
  const api = await ifcApi();
  const started = performance.now();
  const cpuStarted = process.cpuUsage();
  if (mode === 'bare') {
    const modelId = api.OpenModel(fs.readFileSync(file));
    api.StreamAllMeshes(modelId, (mesh) => {
      for (let i = 0; i < mesh.geometries.size(); i++) {
        const geometry = api.GetGeometry(modelId, mesh.geometries.get(i).geometryExpressID);
        api.GetVertexArray(geometry.GetVertexData(), geometry.GetVertexDataSize());
        api.GetIndexArray(geometry.GetIndexData(), geometry.GetIndexDataSize());
        geometry.delete();
      }
    });
    api.CloseModel(modelId);
  } else {
    const glbPath = path.join(os.tmpdir(), `taulens-bench-${process.pid}.glb`);
    await readModel(file, { glb: { path: glbPath } });
    fs.rmSync(glbPath, { force: true });
  }
  const cpu = process.cpuUsage(cpuStarted);
  const sample: Sample = { ms: performance.now() - started, cpuMs: (cpu.user + cpu.system) / 1000, maxRss_MB: process.resourceUsage().maxRSS / 1024 };
  process.stdout.write(JSON.stringify(sample));
}

function runChild(mode: Mode, modelPath: string): Sample {
  const out = execFileSync(
    process.execPath,
    ['-r', 'ts-node/register/transpile-only', __filename, '--child', mode, modelPath],
    { env: { ...process.env, TS_NODE_PROJECT: path.resolve(__dirname, '../../tsconfig.server.json') }, encoding: 'utf8', maxBuffer: 1 << 20 },
  );
  return JSON.parse(out) as Sample;
}

const median = (values: number[]): number => {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
};

function runPart(part: Part): void {
  const { bodies, targetTime } = PARTS[part];
  const modelPath = modelPathOf(part);
  fs.mkdirSync(cacheDir, { recursive: true });
  if (!fs.existsSync(modelPath)) {
    const layout = writeFrameFile(modelPath, { members: MEMBERS, schema: 'IFC4', unit: 'mm', bodies });
    console.log(`generated ${modelPath}: ${layout.slots.length} members`);
  }
  console.log(`part '${part}', model: ${modelPath} (${(fs.statSync(modelPath).size / 1e6).toFixed(1)} MB), ${RUNS} runs each, alternating`);
  const samples: Record<Mode, Sample[]> = { bare: [], taulens: [] };
  for (let run = 0; run < RUNS; run++) {
    for (const mode of ['bare', 'taulens'] as const) {
      const sample = runChild(mode, modelPath);
      samples[mode].push(sample);
      console.log(
        `  run ${run + 1} ${mode.padEnd(7)} wall ${sample.ms.toFixed(0).padStart(6)} ms  cpu ${sample.cpuMs.toFixed(0).padStart(6)} ms  peak RSS ${sample.maxRss_MB.toFixed(0).padStart(5)} MB`,
      );
    }
  }
  const wall = { bare: median(samples.bare.map((s) => s.ms)), taulens: median(samples.taulens.map((s) => s.ms)) };
  const time = { bare: median(samples.bare.map((s) => s.cpuMs)), taulens: median(samples.taulens.map((s) => s.cpuMs)) };
  const memory = { bare: median(samples.bare.map((s) => s.maxRss_MB)), taulens: median(samples.taulens.map((s) => s.maxRss_MB)) };
  const timeRatio = time.taulens / time.bare;
  const memoryRatio = memory.taulens / memory.bare;
  console.log(`median wall time bare web-ifc ${wall.bare.toFixed(0)} ms, readModel ${wall.taulens.toFixed(0)} ms → ${(wall.taulens / wall.bare).toFixed(2)} × (load: ${os.loadavg()[0].toFixed(1)})`);
  console.log(`median CPU time  bare web-ifc ${time.bare.toFixed(0)} ms, readModel ${time.taulens.toFixed(0)} ms → ${timeRatio.toFixed(2)} × (target ≤ ${targetTime} ×) ${timeRatio <= targetTime ? 'met' : 'MISSED'}`);
  console.log(`median peak RSS  bare web-ifc ${memory.bare.toFixed(0)} MB, readModel ${memory.taulens.toFixed(0)} MB → ${memoryRatio.toFixed(2)} × (target ≤ ${TARGET_MEMORY} ×) ${memoryRatio <= TARGET_MEMORY ? 'met' : 'MISSED'}`);
}

const childAt = process.argv.indexOf('--child');
if (childAt >= 0) {
  child(process.argv[childAt + 1] as Mode, process.argv[childAt + 2]).catch((error) => {
    console.error(error);
    process.exit(1);
  });
} else {
  const requested = process.argv.slice(2).filter((arg) => !arg.startsWith('-'));
  const unknown = requested.filter((arg) => !(arg in PARTS));
  if (unknown.length > 0) {
    console.error(`unknown part ${unknown.join(', ')}: choose from ${Object.keys(PARTS).join(', ')}`);
    process.exit(2);
  }
  for (const part of requested.length > 0 ? (requested as Part[]) : (Object.keys(PARTS) as Part[])) runPart(part);
}
