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
import { type AxisCapacity, FamilyCapacityCache, familyUtilisation } from '../../server/engine/family-capacity';
import type { ISectionInput } from '../../server/engine/section';
import type { SectionDimensions } from '../../server/engine/section-family';
import { FAMILY_SECTIONS } from '../../server/engine/test-family-sections';
import { findCatalogueEntry } from '../../server/catalogue/catalogue-lookup';

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

/**
 * Every family, both axes, shear with bending: per member × combination the larger of the two axes' utilisations
 * (each the larger of |V|/VRd and the EN §6.2.8 / EN 1993-1-5 §7.1 value), through familyUtilisation(), beside a
 * bare loop doing the same arithmetic over the same constants unpacked into typed arrays. Per axis and force the bare
 * loop does what the engine does, no less, no more: |V|/VRd (one division); with a moment by §6.2.8 |V|/Vpl,Rd, ρ
 * (held at 0 and 1), MV,Rd = Mc,Rd·min(1 − ρ·share, (1 − ρ)·ratio) and |M|/MV,Rd; by §7.1 η̄1 = |M|/Mpl,Rd,
 * η̄3 = |V|/Vbw,Rd and the criterion with Mf,Rd/Mpl,Rd prepared once; then the larger value. It tests the kind of each
 * axis on every call, as the engine tests for a missing rule and for bending. Both paths must give the same
 * utilisations bit for bit, or the bench stops.
 */
function mixedFamilies(): void {
  const next = random(20261205);
  const catalogue = ['CHS 168.3x6.3 EN 10210', 'SHS 100x100x6.3 EN 10210', 'UPE 200', 'UPN 200', 'C12X20.7', 'HSS6X4X3/8'].map((n) => findCatalogueEntry(n)!.entry.dimensions);
  const sections: SectionDimensions[] = [...FAMILY_SECTIONS.filter((d) => d.family !== 'plate' && d.family !== 'angle'), ...catalogue];
  const standards: Standard[] = ['en1993-1-1', 'aisc360-22-lrfd'];
  const cache = new FamilyCapacityCache();
  // An axis without a code rule (a tee's flange by EN) is skipped, as a run reports it not applicable.
  const axes: (AxisCapacity | null)[] = [];
  for (let m = 0; m < MEMBERS; m++) {
    const d = sections[Math.floor(next() * sections.length)];
    const standard = standards[m % 2];
    const prepared = cache.get(d, { grade: standard === 'en1993-1-1' ? 'S355' : 'A992' }, standard, { momentBasis: 'plastic' });
    for (const axis of [prepared.major, prepared.minor]) axes.push(axis.applicable ? axis : null);
  }
  const forces = new Float64Array(MEMBERS * COMBINATIONS * 4); // Vmajor, Mmajor, Vminor, Mminor
  for (let i = 0; i < forces.length; i += 4) {
    forces[i] = (next() * 2 - 1) * 400e3;
    forces[i + 1] = (next() * 2 - 1) * 150e6;
    forces[i + 2] = (next() * 2 - 1) * 150e3;
    forces[i + 3] = (next() * 2 - 1) * 30e6;
  }
  const out = new Float64Array(MEMBERS * COMBINATIONS);
  const outBare = new Float64Array(MEMBERS * COMBINATIONS);
  const engineRun = (): number => {
    let failures = 0;
    for (let m = 0; m < MEMBERS; m++) {
      const major = axes[2 * m];
      const minor = axes[2 * m + 1];
      for (let c = 0; c < COMBINATIONS; c++) {
        const i = (m * COMBINATIONS + c) * 4;
        const a = major === null ? 0 : familyUtilisation(major, forces[i], forces[i + 1]);
        const b = minor === null ? 0 : familyUtilisation(minor, forces[i + 2], forces[i + 3]);
        const u = a > b ? a : b;
        out[m * COMBINATIONS + c] = u;
        if (u > 1) failures++;
      }
    }
    return failures;
  };
  // Bare: the same constants per axis in typed arrays; kind 0 shear only, 1 §6.2.8, 2 §7.1, 3 no rule.
  const n = axes.length;
  const vRd = new Float64Array(n);
  const kind = new Uint8Array(n);
  const vpl = new Float64Array(n);
  const mc = new Float64Array(n);
  const share = new Float64Array(n);
  const ratio = new Float64Array(n);
  const mpl = new Float64Array(n);
  const vbw = new Float64Array(n);
  const flanges = new Float64Array(n);
  axes.forEach((a, k) => {
    if (a === null) {
      kind[k] = 3;
      return;
    }
    vRd[k] = a.VRd_N;
    const b = a.bending;
    if (b === null) return;
    kind[k] = b.buckling === null ? 1 : 2;
    vpl[k] = b.vplRd_N;
    mc[k] = b.mcRd_Nmm;
    share[k] = b.plasticShare;
    ratio[k] = b.elasticRatio;
    mpl[k] = b.mplRd_Nmm;
    vbw[k] = b.buckling?.vbwRd_N ?? 0;
    flanges[k] = b.buckling ? b.buckling.mfRd_Nmm / b.mplRd_Nmm : 0;
  });
  const bareAxis = (k: number, shear: number, moment: number): number => {
    if (kind[k] === 3) return 0;
    const v = Math.abs(shear);
    const u = v / vRd[k];
    if (kind[k] === 0 || moment === 0) return u;
    const mm = Math.abs(moment);
    let w: number;
    if (kind[k] === 2) {
      const e1 = mm / mpl[k];
      const e3 = v / vbw[k];
      w = e3 > 0.5 && e1 >= flanges[k] ? e1 + (1 - flanges[k]) * (2 * e3 - 1) ** 2 : e1;
    } else {
      const r = v / vpl[k];
      const rho = r <= 0.5 ? 0 : r >= 1 ? 1 : (2 * r - 1) ** 2;
      const mv = mc[k] * Math.min(1 - rho * share[k], (1 - rho) * ratio[k]);
      w = mv > 0 ? mm / mv : mm > 0 ? Infinity : 0;
    }
    return w > u ? w : u;
  };
  const bareRun = (): number => {
    let failures = 0;
    for (let m = 0; m < MEMBERS; m++) {
      for (let c = 0; c < COMBINATIONS; c++) {
        const i = (m * COMBINATIONS + c) * 4;
        const a = bareAxis(2 * m, forces[i], forces[i + 1]);
        const b = bareAxis(2 * m + 1, forces[i + 2], forces[i + 3]);
        const u = a > b ? a : b;
        outBare[m * COMBINATIONS + c] = u;
        if (u > 1) failures++;
      }
    }
    return failures;
  };
  // One untimed run of each (both get compiled the same way), and the proof that they compute the same numbers.
  const failures = new Set<number>([engineRun(), bareRun()]);
  for (let k = 0; k < out.length; k++) {
    if (!Object.is(out[k], outBare[k])) throw new Error(`the mixed-family paths differ at evaluation ${k}: ${out[k]} vs ${outBare[k]}`);
  }
  const timings = { engine: [] as number[], bare: [] as number[] };
  for (let r = 0; r < RUNS; r++) {
    for (const [name, run] of [['engine', engineRun], ['bare', bareRun]] as const) {
      const t = seconds(run);
      timings[name].push(t.elapsed_s);
      failures.add(t.failures);
    }
  }
  if (failures.size !== 1) throw new Error(`the mixed-family paths disagree on the failing evaluations: ${[...failures].join(', ')}`);
  const evaluations = MEMBERS * COMBINATIONS;
  const engine = evaluations / median(timings.engine);
  const bare = evaluations / median(timings.bare);
  const rows: [string, string][] = [
    ['mixed families, both axes, shear with bending', `${MEMBERS} members × ${COMBINATIONS} combinations × 2 axes, ${cache.size} distinct capacities`],
    [`engine, familyUtilisation (median of ${RUNS})`, `${(engine / 1e6).toFixed(1)} million member-combinations/s, ${(engine / bare).toFixed(2)} × bare`],
    [`bare loop, same arithmetic (median of ${RUNS})`, `${(bare / 1e6).toFixed(1)} million member-combinations/s`],
    ['target ≥ 0.9 × bare', engine / bare >= 0.9 ? 'met' : 'NOT met'],
    ['failing member-combinations (both paths)', String([...failures][0])],
  ];
  for (const [k, v] of rows) console.log(`${k.padEnd(52)} ${v}`);
}

main();
mixedFamilies();
