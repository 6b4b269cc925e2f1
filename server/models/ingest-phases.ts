/**
 * The phases of an ingest in order, with the share of the whole each usually takes, so the progress bar moves
 * steadily across phases instead of restarting at each one. Shares are rough timings of generated models.
 */
import type { ReadPhase } from '../ifc/read-model';

export type IngestPhase = ReadPhase | 'store';

const PHASES: readonly { phase: IngestPhase; share: number; doing: string }[] = [
  { phase: 'parse', share: 0.3, doing: 'opening the IFC file' },
  { phase: 'members', share: 0.15, doing: 'reading the members and their sections' },
  { phase: 'geometry', share: 0.35, doing: 'building the 3D geometry' },
  { phase: 'write', share: 0.05, doing: 'writing the 3D geometry' },
  { phase: 'store', share: 0.15, doing: 'saving the members' },
];

export const INGEST_PHASES: readonly IngestPhase[] = PHASES.map((p) => p.phase);

export function isIngestPhase(value: unknown): value is IngestPhase {
  return INGEST_PHASES.includes(value as IngestPhase);
}

/** Fraction of the whole ingest when `phase` is `fraction` done (both 0 to 1). */
export function overallFraction(phase: IngestPhase, fraction: number): number {
  let before = 0;
  for (const p of PHASES) {
    if (p.phase === phase) return Math.min(1, before + p.share * Math.min(1, Math.max(0, fraction)));
    before += p.share;
  }
  return before;
}

/** What the ingest was doing in that phase, for failure messages ("… while building the 3D geometry"). */
export function phaseActivity(phase: IngestPhase | null): string {
  return PHASES.find((p) => p.phase === phase)?.doing ?? 'starting to read the file';
}
