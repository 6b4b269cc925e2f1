/**
 * Check-engine throughput: member × load-combination evaluations per second with capacity prepared once per
 * profile (CapacityCache), printed beside a bare loop doing the same arithmetic (|V| / VRd and the pass/fail
 * comparison) over precomputed capacities: the ceiling. Two engine paths: looking each member's capacity up in the
 * cache on every run, and resolving capacities once per check run as a runner would. Medians of several runs in one
 * process; target ≥ 2 million/s on one core.
 *
 *   npm run bench:engine
 */
import { BUILT_IN_SECTIONS, toSectionInput } from '../../server/catalogue/catalogue';
import { CapacityCache } from '../../server/engine/capacity-cache';
import { type MaterialInput, type PreparedCapacity, prepareCapacity, type Standard, utilisationOf } from '../../server/engine/check';
import type { ISectionInput } from '../../server/engine/section';

const MEMBERS = 20_000;
const COMBINATIONS = 100;
const RUNS = 9;
const TARGET_PER_SECOND = 2_000_000;

interface Member {
  section: ISectionInput;
  material: MaterialInput;
  standard: Standard;
}

/** Deterministic pseudo-random numbers (mulberry32), so every run checks the same invented model. */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function inventModel(): { members: Member[]; shears_N: Float64Array } {
  const next = random(20261201);
  const profiles = BUILT_IN_SECTIONS.filter((_, i) => i % 6 === 0); // about 60 distinct profiles, EN and W
  const members: Member[] = [];
  for (let m = 0; m < MEMBERS; m++) {
    const s = profiles[Math.floor(next() * profiles.length)];
    const us = s.series.startsWith('W');
    members.push({
      section: toSectionInput(s),
      material: { grade: us ? 'A992' : 'S355' },
      standard: us ? (m % 2 === 0 ? 'aisc360-22-lrfd' : 'aisc360-22-asd') : 'en1993-1-1',
    });
  }
  const shears_N = new Float64Array(MEMBERS * COMBINATIONS);
  for (let i = 0; i < shears_N.length; i++) shears_N[i] = (next() * 2 - 1) * 600e3;
  return { members, shears_N };
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

function seconds(run: () => number): { elapsed_s: number; failures: number } {
  const start = process.hrtime.bigint();
  const failures = run();
  return { elapsed_s: Number(process.hrtime.bigint() - start) / 1e9, failures };
}

function main(): void {
  const { members, shears_N } = inventModel();
  const utilisations = new Float64Array(shears_N.length);

  /** Every combination of every member through utilisationOf(), the capacity of member m coming from capacityOf(m). */
  const streamThroughEngine = (capacityOf: (m: number) => PreparedCapacity): number => {
    let failures = 0;
    for (let m = 0; m < MEMBERS; m++) {
      const capacity = capacityOf(m);
      const base = m * COMBINATIONS;
      for (let c = 0; c < COMBINATIONS; c++) {
        const u = utilisationOf(capacity, shears_N[base + c]);
        utilisations[base + c] = u;
        if (u > 1) failures++;
      }
    }
    return failures;
  };

  // Engine path: each member's capacity looked up in the cache (by content) on every run.
  const cache = new CapacityCache();
  const engineRun = (): number => streamThroughEngine((m) => cache.get(members[m].section, members[m].material, members[m].standard));
  // Runner style: capacities resolved once per check run, then every combination streamed.
  const cold = seconds(engineRun); // the first run also prepares every distinct capacity
  const resolved = members.map((member) => cache.get(member.section, member.material, member.standard));
  const resolvedRun = (): number => streamThroughEngine((m) => resolved[m]);

  // Ceiling: the same arithmetic over capacities already sitting in a typed array.
  const vRd_N = new Float64Array(MEMBERS);
  for (let m = 0; m < MEMBERS; m++) vRd_N[m] = prepareCapacity(members[m].section, members[m].material, members[m].standard).VRd_N;
  const bareRun = (): number => {
    let failures = 0;
    for (let m = 0; m < MEMBERS; m++) {
      const capacity = vRd_N[m];
      const base = m * COMBINATIONS;
      for (let c = 0; c < COMBINATIONS; c++) {
        const u = Math.abs(shears_N[base + c]) / capacity;
        utilisations[base + c] = u;
        if (u > 1) failures++;
      }
    }
    return failures;
  };

  const timings = { lookup: [] as number[], resolved: [] as number[], bare: [] as number[] };
  const failures = new Set<number>([cold.failures]);
  for (let r = 0; r < RUNS; r++) {
    for (const [name, run] of [['lookup', engineRun], ['resolved', resolvedRun], ['bare', bareRun]] as const) {
      const t = seconds(run);
      timings[name].push(t.elapsed_s);
      failures.add(t.failures);
    }
  }
  if (failures.size !== 1) throw new Error(`the paths disagree on the failing evaluations: ${[...failures].join(', ')}`);

  const evaluations = MEMBERS * COMBINATIONS;
  const perSecond = (name: keyof typeof timings): number => evaluations / median(timings[name]);
  const millions = (x: number): string => `${(x / 1e6).toFixed(1)} million evaluations/s`;
  const lookup = perSecond('lookup');
  const resolvedOnce = perSecond('resolved');
  const bareLoop = perSecond('bare');
  const rows: [string, string][] = [
    ['model', `${MEMBERS} members × ${COMBINATIONS} combinations = ${evaluations} evaluations, ${cache.size} distinct capacities`],
    ['cold run (prepares every distinct capacity)', `${(cold.elapsed_s * 1000).toFixed(1)} ms`],
    [`engine, cache lookup per member (median of ${RUNS})`, `${millions(lookup)}, ${(lookup / bareLoop).toFixed(2)} × bare`],
    [`engine, capacities resolved once (median of ${RUNS})`, `${millions(resolvedOnce)}, ${(resolvedOnce / bareLoop).toFixed(2)} × bare`],
    [`bare loop, same arithmetic (median of ${RUNS})`, millions(bareLoop)],
    ['target ≥ 2 million/s on one core', Math.min(lookup, resolvedOnce) >= TARGET_PER_SECOND ? 'met by both engine paths' : 'NOT met'],
    ['failing evaluations (every path)', String(cold.failures)],
  ];
  for (const [k, v] of rows) console.log(`${k.padEnd(52)} ${v}`);
}

main();
