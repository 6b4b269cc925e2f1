/**
 * Results import benchmark (`npm run bench:import`): a generated CSV of 1,000,000 rows (20,000 members × 50 load
 * combinations) against an invented 20,000-member model. Prints medians over several runs of
 *   - bare csv-parse of the file with the same options in flowing mode, counting records (the ceiling);
 *   - our import + match: the streaming reader with validation, a sink that discards rows or one that collects
 *     governing shears (what a check run needs), then matching the keys to the members;
 * and the speed ratio bare / ours (target ≥ 0.5), then a full check-run computation over the matched shears
 * (target < 5 s). Then the same through the running server (real SQLite, worker threads, file storage), as a user
 * would: the import of the file including storing it (result set, keys, governing-shear file) against the bare
 * parse, a whole check run from POST to done including storing 20,000 member rows, and the results table API at
 * 50,000 members: p50/p95 of sort + filter + page requests over HTTP (target p95 < 50 ms).
 * Environment: IMPORT_BENCH_RUNS=5 for runs per measurement (the server part takes half as many, at least 2).
 */
import { randomUUID } from 'node:crypto';
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
import { ModelMemberRecord } from '../../server/models/model-member-record.entity';
import { ModelRevision } from '../../server/models/model-revision.entity';
import type { ApiAgent } from '../fixtures/api-agent';
import { type TestApp, startTestApp } from '../fixtures/test-app';
import { createTeam } from '../fixtures/test-accounts';

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

function model(count = MEMBERS): MemberRecord[] {
  return Array.from({ length: count }, (_, m) => {
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
      profile: { name: section.name, family: 'I', source: 'ifc-profile', ifcType: 'IfcIShapeProfileDef', ...toSectionInput(section) },
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
  await throughServer(file, median(bare));
}

// --- Through the server -------------------------------------------------------------------------------------------

const TABLE_MEMBERS = 50_000;
const TABLE_REQUESTS = 300;

/** A ready revision with these members, written as the ingest stores them (only the part later features read). */
async function readyRevision(app: TestApp, projectId: string, number: number, members: readonly MemberRecord[]): Promise<string> {
  const id = randomUUID();
  // insert, not save: save opens its own transaction, which would tangle with the findings sync on the shared connection.
  await app.dataSource.getRepository(ModelRevision).insert({
    id,
    projectId,
    number,
    fileName: `bench-frame-${members.length}.ifc`,
    sizeBytes: 0,
    sha256: `${number}`.padStart(64, '0'),
    status: 'ready' as const,
    counts: { members: members.length, ok: members.length, notApplicable: 0, flagged: 0, context: 0 },
  });
  const revision = { id };
  const records = app.dataSource.getRepository(ModelMemberRecord);
  for (let start = 0; start < members.length; start += 500) {
    await records.insert(members.slice(start, start + 500).map((member) => ({ revisionId: revision.id, expressId: member.expressId, record: JSON.stringify(member) })));
  }
  return revision.id;
}

async function importThroughApi(agent: ApiAgent, projectId: string, revisionId: string, file: string, name: string): Promise<{ uploadMs: number; importMs: number; id: string }> {
  const upload = await timed(() => agent.post(`/api/projects/${projectId}/results/uploads`).attach('file', file).expect(201));
  const mapping = { memberColumn: 'member', combinationColumn: 'combination', shearColumn: 'shear', forceUnit: 'kN' };
  const imported = await timed(() =>
    agent.post(`/api/projects/${projectId}/results`).send({ uploadId: upload.value.body.upload.id, mapping, modelRevisionId: revisionId, name }).expect(201),
  );
  return { uploadMs: upload.ms, importMs: imported.ms, id: imported.value.body.resultSet.id };
}

async function runThroughApi(agent: ApiAgent, projectId: string, revisionId: string, resultSetId: string): Promise<{ ms: number; id: string }> {
  return timed(async () => {
    const started = await agent.post(`/api/projects/${projectId}/checks`).send({ modelRevisionId: revisionId, resultSetId, standard: 'aisc360-22-lrfd', parameters: {} }).expect(202);
    for (;;) {
      const { body } = await agent.get(`/api/projects/${projectId}/checks/${started.body.run.id}`).expect(200);
      if (body.run.status === 'failed') throw new Error(`bench run failed: ${body.run.error}`);
      if (body.run.status === 'done') return body.run.id as string;
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
  }).then(({ ms, value }) => ({ ms, id: value }));
}

/** The table queries a user makes: sorts, filters and pages, in a fixed mix. */
function tableQuery(i: number): Record<string, string | number> {
  const sorts = ['utilisation', 'tag', 'VEd_kN', 'profileName', 'storey', 'status'];
  const query: Record<string, string | number> = { sort: sorts[i % sorts.length], dir: i % 2 ? 'asc' : 'desc', page: i % 7, pageSize: 50 };
  if (i % 3 === 0) query.status = i % 2 ? 'fail' : 'pass';
  if (i % 4 === 1) query.storey = `Level ${1 + (i % 10)}`;
  if (i % 5 === 2) query.profile = PROFILES[i % PROFILES.length];
  if (i % 6 === 3) Object.assign(query, { minUtil: 0.5, maxUtil: 0.9 });
  if (i % 9 === 4) query.q = `B-0${i % 10}`;
  return query;
}

function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

async function throughServer(file: string, bareMs: number): Promise<void> {
  const runs = Math.max(2, Math.ceil(RUNS / 2));
  const app = await startTestApp();
  try {
    const team = await createTeam(app.dataSource);
    const projectId = team.project.id;
    const [coordinator, engineer] = await Promise.all([app.signIn(team.coordinator), app.signIn(team.engineer)]);
    const revisionId = await readyRevision(app, projectId, 1, model());

    // One import and run first, unmeasured: the worker threads start and load their code once per server.
    const warm = await importThroughApi(coordinator, projectId, revisionId, file, 'bench warm-up');
    await runThroughApi(engineer, projectId, revisionId, warm.id);
    const uploads: number[] = [];
    const imports: number[] = [];
    const checks: number[] = [];
    for (let run = 0; run < runs; run++) {
      const imported = await importThroughApi(coordinator, projectId, revisionId, file, `bench ${run}`);
      uploads.push(imported.uploadMs);
      imports.push(imported.importMs);
      checks.push((await runThroughApi(engineer, projectId, revisionId, imported.id)).ms);
    }
    const rows = MEMBERS * COMBINATIONS;
    console.log(`\nthrough the server (real SQLite, worker threads, file storage), median of ${runs} after a warm-up; load average ${os.loadavg()[0].toFixed(1)} on ${os.availableParallelism()} cores`);
    console.log(`upload (stream to disk, preview, store)                 ${(median(uploads) / 1000).toFixed(2).padStart(6)} s`);
    console.log(
      `import + match incl. storing (result set, keys, file)   ${(median(imports) / 1000).toFixed(2).padStart(6)} s  ${((rows / median(imports)) * 1000 / 1e6).toFixed(2)} M rows/s` +
        `  ratio ${(bareMs / median(imports)).toFixed(2)} of bare csv-parse (target ≥ 0.5)`,
    );
    console.log(`check run, POST to done incl. storing ${MEMBERS.toLocaleString('en')} member rows  ${(median(checks) / 1000).toFixed(2).padStart(6)} s (target < 5 s)`);

    // The results table at 50,000 members, 2 combinations each.
    const big = model(TABLE_MEMBERS);
    const bigRevision = await readyRevision(app, projectId, 2, big);
    const bigFile = path.join(path.dirname(file), `results-${TABLE_MEMBERS}x2.csv`);
    if (!fs.existsSync(bigFile)) {
      const lines = ['member,combination,shear'];
      big.forEach((member, m) => lines.push(`${member.tag},ULS-1,${((m * 7919) % 9000) / 10 - 200}`, `${member.tag},ULS-2,${((m * 104729) % 7000) / 10 - 350}`));
      fs.writeFileSync(bigFile, lines.join('\n') + '\n');
    }
    const bigSet = await importThroughApi(coordinator, projectId, bigRevision, bigFile, 'bench table');
    const bigRun = await runThroughApi(engineer, projectId, bigRevision, bigSet.id);
    const url = `/api/projects/${projectId}/checks/${bigRun.id}/members`;
    await engineer.get(url).expect(200); // facets computed once per run
    const latencies: number[] = [];
    for (let i = 0; i < TABLE_REQUESTS; i++) latencies.push((await timed(() => engineer.get(url).query(tableQuery(i)).expect(200))).ms);
    const colours = await timed(() => engineer.get(`/api/projects/${projectId}/checks/${bigRun.id}/colours`).expect(200));
    console.log(
      `results table API, ${TABLE_MEMBERS.toLocaleString('en')} members, ${TABLE_REQUESTS} sort + filter + page requests over HTTP: ` +
        `p50 ${percentile(latencies, 50).toFixed(1)} ms, p95 ${percentile(latencies, 95).toFixed(1)} ms (target p95 < 50 ms), max ${Math.max(...latencies).toFixed(1)} ms`,
    );
    console.log(`  (check run of the ${TABLE_MEMBERS.toLocaleString('en')}-member model ${(bigRun.ms / 1000).toFixed(2)} s; colours of all members ${colours.ms.toFixed(0)} ms the first time)`);
  } finally {
    await app.close();
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exitCode = 1;
});
