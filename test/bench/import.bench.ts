/**
 * Results import benchmark (`npm run bench:import`): a generated CSV of 1,000,000 rows (20,000 members × 50 load
 * combinations) against an invented 20,000-member model. Prints medians over several runs of
 *   - bare csv-parse of the file with the same options in flowing mode, counting records (the ceiling);
 *   - our import + match: the streaming reader with validation, a sink that discards rows or one that collects
 *     governing shears (what a check run needs), then matching the keys to the members;
 * and the speed ratio bare / ours (target ≥ 0.5), then a full check-run computation over the matched shears
 * (target < 5 s). Environment: IMPORT_BENCH_RUNS=5 for runs per measurement.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { parse } from 'csv-parse';
import { findSection, toSectionInput } from '../../server/catalogue/catalogue';
import { recommendedParameters } from '../../server/checks/check-parameters';
import { computeCheckRun } from '../../server/checks/check-run-compute';
import type { MemberRecord } from '../../server/ifc/model-read-result';
import { parseColumnMapping } from '../../server/results/column-mapping';
import type { CsvFormat } from '../../server/results/csv-format';
import { csvParseOptions } from '../../server/results/csv-records';
import { GoverningShearCollector, governingShearsByMember } from '../../server/results/governing-shear';
import { matchResultsToMembers } from '../../server/results/member-matching';
import { readResults } from '../../server/results/results-reader';

const MEMBERS = 20_000;
const COMBINATIONS = 50;
const RUNS = Number(process.env['IMPORT_BENCH_RUNS'] ?? 5);
// Bump when the generated file changes, so a cached one is made again.
const FILE_VERSION = 1;
const PROFILES = ['W24X62', 'W18X50', 'W14X90', 'W21X44', 'W16X26', 'W12X14'];

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

function tag(member: number): string {
  return `B-${String(member).padStart(5, '0')}`;
}

/** Written once into the temp folder and reused; shears in kN between −400 and +400. */
function resultsFile(): string {
  const folder = path.join(os.tmpdir(), 'taulens-bench-import');
  fs.mkdirSync(folder, { recursive: true });
  const file = path.join(folder, `results-${MEMBERS}x${COMBINATIONS}-v${FILE_VERSION}.csv`);
  if (fs.existsSync(file)) return file;
  const start = performance.now();
  const out = fs.openSync(`${file}.part`, 'w');
  fs.writeSync(out, 'member,combination,shear\n');
  for (let m = 0; m < MEMBERS; m++) {
    let block = '';
    for (let c = 0; c < COMBINATIONS; c++) block += `${tag(m)},ULS-${c + 1},${(((m * 7919 + c * 104729) % 8000) / 10 - 400).toFixed(1)}\n`;
    fs.writeSync(out, block);
  }
  fs.closeSync(out);
  fs.renameSync(`${file}.part`, file);
  console.log(`generated ${file} (${(fs.statSync(file).size / 1e6).toFixed(1)} MB) in ${((performance.now() - start) / 1000).toFixed(1)} s`);
  return file;
}

function model(): MemberRecord[] {
  return Array.from({ length: MEMBERS }, (_, m) => {
    const section = findSection(PROFILES[m % PROFILES.length])!;
    return {
      globalId: `0Bench${String(m).padStart(16, '0')}`,
      expressId: m + 1,
      ifcClass: 'IfcBeam',
      name: section.name,
      tag: tag(m),
      objectType: null,
      predefinedType: 'BEAM',
      storey: `Level ${1 + (m % 10)}`,
      material: { name: 'ASTM A992', grade: 'A992', fy_MPa: 345, assumed: false },
      length_mm: 6000,
      axis: null,
      status: 'ok',
      profile: { name: section.name, source: 'ifc', ifcType: 'IfcIShapeProfileDef', ...toSectionInput(section) },
      section: null,
      flags: [],
    };
  });
}

/** The bare library: csv-parse with our options, in flowing mode (its fastest), counting records. */
function countRecords(file: string, format: CsvFormat): Promise<void> {
  return new Promise((resolve, reject) => {
    let records = 0;
    const parser = fs.createReadStream(file).pipe(parse(csvParseOptions(format)));
    parser.on('data', () => records++);
    parser.on('error', reject);
    parser.on('end', () => (records === MEMBERS * COMBINATIONS + 1 ? resolve() : reject(new Error(`bare parse saw ${records} records`))));
  });
}

async function timed<T>(action: () => Promise<T> | T): Promise<{ ms: number; value: T }> {
  const start = performance.now();
  const value = await action();
  return { ms: performance.now() - start, value };
}

async function main(): Promise<void> {
  const file = resultsFile();
  const members = model();
  const mapping = parseColumnMapping({ memberColumn: 'member', combinationColumn: 'combination', shearColumn: 'shear', forceUnit: 'kN' });
  const format: CsvFormat = { encoding: 'utf8', delimiter: ',', decimalSeparator: '.', hasHeaderRow: true };

  const bare: number[] = [];
  const discarding: number[] = [];
  const collecting: number[] = [];
  let collector = new GoverningShearCollector();
  let report = matchResultsToMembers([], members);
  for (let run = 0; run < RUNS; run++) {
    bare.push((await timed(() => countRecords(file, format))).ms);
    discarding.push(
      (
        await timed(async () => {
          const summary = await readResults(file, mapping, () => undefined);
          matchResultsToMembers(summary.memberKeys, members);
        })
      ).ms,
    );
    const collected = await timed(async () => {
      const next = new GoverningShearCollector();
      const summary = await readResults(file, mapping, next.add);
      return { next, matched: matchResultsToMembers(summary.memberKeys, members) };
    });
    collecting.push(collected.ms);
    collector = collected.value.next;
    report = collected.value.matched;
  }
  if (report.counts.matched !== MEMBERS) throw new Error(`matched ${report.counts.matched} of ${MEMBERS} members`);

  const shears = governingShearsByMember(collector.table(), report.matched);
  const parameters = recommendedParameters('aisc360-22-lrfd');
  const checkRuns: number[] = [];
  let summary = computeCheckRun({ members, shears, parameters }).summary;
  for (let run = 0; run < Math.max(3, Math.ceil(RUNS / 2)); run++) {
    const result = await timed(() => computeCheckRun({ members, shears, parameters }));
    checkRuns.push(result.ms);
    summary = result.value.summary;
  }

  const rows = MEMBERS * COMBINATIONS;
  const line = (what: string, ms: number, extra = '') =>
    console.log(`${what.padEnd(44)} ${(ms / 1000).toFixed(2).padStart(6)} s  ${((rows / ms) * 1000 / 1e6).toFixed(2)} M rows/s${extra}`);
  console.log(`\nresults import, ${rows.toLocaleString('en')} rows (${MEMBERS.toLocaleString('en')} members × ${COMBINATIONS} combinations), median of ${RUNS}`);
  line('bare csv-parse (same options, flowing, counting)', median(bare));
  line('import + match, sink discarding rows', median(discarding), `  ratio ${(median(bare) / median(discarding)).toFixed(2)} of bare`);
  line('import + match, collecting governing shears', median(collecting), `  ratio ${(median(bare) / median(collecting)).toFixed(2)} of bare (target ≥ 0.5)`);
  const checkMs = median(checkRuns);
  console.log(
    `check run (AISC 360-22 LRFD), ${rows.toLocaleString('en')} member × combination values: ${(checkMs / 1000).toFixed(2)} s` +
      ` (target < 5 s); ${summary.capacitiesPrepared} capacities prepared; pass ${summary.pass}, fail ${summary.fail}`,
  );
}

main().catch((error: unknown) => {
  console.error(error);
  process.exitCode = 1;
});
