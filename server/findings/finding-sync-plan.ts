/**
 * What a finished check run does to a project's findings, as a pure plan (finding-sync.ts applies it).
 *
 * One finding per member GlobalId and kind, carried across runs and revisions:
 * - The condition holds (the web fails; passes at or above the warning ratio; carries a flag to review) and no
 *   finding exists: a new one, Open.
 * - The condition holds and a finding exists: its run link and utilisation follow the run. A Verified or
 *   Ready-to-verify finding is reopened (it fails again); a Resolved one is reopened only when the run is of a
 *   newer revision than the one it was last seen in (a re-run of the same model cannot show a fix). Accepted
 *   findings stay accepted: the reviewer accepted the condition.
 * - The member passes for that kind in a run of a newer revision: Open, In progress and Resolved findings move to
 *   Ready to verify. A pass on the same revision (other parameters) changes numbers only.
 * - Members the run did not check (no results, not an I-section, gone from the model) leave their findings alone,
 *   and so does any run of a revision older than the one a finding was last seen in.
 * Changes made here are recorded in the history as made by the system.
 */
import { percentRoundedUp } from '../reports/report-format';
import type { FindingPriority, FindingStatus, GeneratedKind } from './finding-fields';

/** One member's row of a check run (server/checks/check-results.query.ts listRunMemberResults). */
export interface RunMemberResult {
  globalId: string;
  tag: string | null;
  name: string | null;
  storey: string | null;
  profileName: string | null;
  status: 'pass' | 'warning' | 'fail' | 'not-checked' | 'not-applicable';
  utilisation: number | null;
  VEd_kN: number | null;
  VRd_kN: number | null;
  governingCombination: string | null;
  flags: readonly string[];
}

export interface SyncRun {
  runId: string;
  revisionNumber: number;
}

/** The generated findings of the project as stored. */
export interface SyncedFinding {
  id: string;
  memberKey: string;
  kind: GeneratedKind;
  status: FindingStatus;
  revisionNumber: number | null;
  utilisation: number | null;
}

/**
 * Flags that put the check itself in doubt: a web beyond the code's proportion limit for unstiffened webs, or a
 * section the reader had to interpret (tapered, curved, several profiles, a top flange taken to equal the bottom).
 * Facts of where data came from (an assumed grade, a catalogue section) and the elastic check beside a passing
 * plastic one are shown on the member lists and calculation sheets instead: a finding for each would bury the few
 * that matter.
 */
export const FLAGS_TO_REVIEW: ReadonlySet<string> = new Set(['web-proportion-limit', 'tapered', 'top-flange-assumed', 'several-profiles', 'curved']);

const GENERATED_KINDS: readonly GeneratedKind[] = ['web-shear-fail', 'web-shear-warning', 'flag'];

function isChecked(result: RunMemberResult): boolean {
  return result.status === 'pass' || result.status === 'warning' || result.status === 'fail';
}

function flagsToReview(result: RunMemberResult): string[] {
  return result.flags.filter((flag) => FLAGS_TO_REVIEW.has(flag));
}

/** Whether the run shows the kind's condition for the member. */
export function conditionHolds(kind: GeneratedKind, result: RunMemberResult): boolean {
  if (kind === 'web-shear-fail') return result.status === 'fail';
  if (kind === 'web-shear-warning') return result.status === 'warning';
  return isChecked(result) && flagsToReview(result).length > 0;
}

/** Whether the run shows the member clear of the kind's condition (a warning finding is not cleared by a failure). */
export function conditionCleared(kind: GeneratedKind, result: RunMemberResult): boolean {
  if (kind === 'web-shear-fail') return result.status === 'pass' || result.status === 'warning';
  if (kind === 'web-shear-warning') return result.status === 'pass';
  return isChecked(result) && flagsToReview(result).length === 0;
}

export interface FindingDraft {
  kind: GeneratedKind;
  globalId: string;
  title: string;
  description: string;
  priority: FindingPriority;
  utilisation: number | null;
  memberTag: string;
  memberLabel: string;
}

export interface FindingUpdate {
  id: string;
  utilisation: number | null;
  revisionNumber: number;
  memberTag: string;
  memberLabel: string;
  /** Set when the status changes. */
  status?: { from: FindingStatus; to: FindingStatus };
}

export interface SyncPlan {
  create: FindingDraft[];
  update: FindingUpdate[];
}

export function memberTagOf(result: RunMemberResult): string {
  return result.tag?.trim() || result.name?.trim() || result.globalId;
}

export function memberLabelOf(result: RunMemberResult): string {
  return [memberTagOf(result), result.profileName, result.storey].filter((part) => part && part.trim() !== '').join(' · ');
}

function kN(value: number | null): string {
  return value === null ? '—' : `${Math.round(Math.abs(value) * 10) / 10} kN`;
}

function draftFor(kind: GeneratedKind, result: RunMemberResult, run: SyncRun): FindingDraft {
  const tag = memberTagOf(result);
  const utilisationText = result.utilisation === null ? 'Utilisation not known' : `${percentRoundedUp(result.utilisation)} % utilisation`;
  const forces = `under ${result.governingCombination ?? 'the governing combination'} (VEd ${kN(result.VEd_kN)}, VRd ${kN(result.VRd_kN)})`;
  const revision = `model revision ${run.revisionNumber}`;
  const texts: Record<GeneratedKind, { title: string; description: string }> = {
    'web-shear-fail': {
      title: `Web shear over capacity: ${tag}`,
      description: `${utilisationText} ${forces} in the check of ${revision}.`,
    },
    'web-shear-warning': {
      title: `Web shear close to capacity: ${tag}`,
      description: `${utilisationText} ${forces} in the check of ${revision}, at or above the run's warning ratio.`,
    },
    flag: {
      title: `Check flags to review: ${tag}`,
      description: `The check of ${revision} flagged: ${flagsToReview(result).join(', ')}.`,
    },
  };
  return {
    kind,
    globalId: result.globalId,
    ...texts[kind],
    priority: kind === 'web-shear-fail' ? 'high' : 'normal',
    utilisation: result.utilisation,
    memberTag: tag,
    memberLabel: memberLabelOf(result),
  };
}

function nextStatus(finding: SyncedFinding, result: RunMemberResult, newerRevision: boolean): FindingStatus {
  const { kind, status } = finding;
  if (conditionHolds(kind, result)) {
    if (status === 'verified' || status === 'ready-to-verify') return 'open';
    if (status === 'resolved' && newerRevision) return 'open';
    return status;
  }
  if (newerRevision && conditionCleared(kind, result) && (status === 'open' || status === 'in-progress' || status === 'resolved')) {
    return 'ready-to-verify';
  }
  return status;
}

function updateFor(finding: SyncedFinding, result: RunMemberResult, run: SyncRun): FindingUpdate | null {
  const lastSeen = finding.revisionNumber ?? Number.NEGATIVE_INFINITY;
  if (run.revisionNumber < lastSeen) return null;
  const holds = conditionHolds(finding.kind, result);
  if (!holds && !conditionCleared(finding.kind, result)) return null;
  const status = nextStatus(finding, result, run.revisionNumber > lastSeen);
  return {
    id: finding.id,
    utilisation: result.utilisation,
    // The revision in which the condition was last seen; a pass does not move it.
    revisionNumber: holds ? run.revisionNumber : (finding.revisionNumber ?? run.revisionNumber),
    memberTag: memberTagOf(result),
    memberLabel: memberLabelOf(result),
    ...(status !== finding.status && { status: { from: finding.status, to: status } }),
  };
}

export function planRunSync(run: SyncRun, results: readonly RunMemberResult[], existing: readonly SyncedFinding[]): SyncPlan {
  const byKey = new Map(existing.map((finding) => [`${finding.kind}\u0000${finding.memberKey}`, finding]));
  const plan: SyncPlan = { create: [], update: [] };
  for (const result of results) {
    for (const kind of GENERATED_KINDS) {
      const finding = byKey.get(`${kind}\u0000${result.globalId}`);
      if (finding) {
        const update = updateFor(finding, result, run);
        if (update) plan.update.push(update);
      } else if (conditionHolds(kind, result)) {
        plan.create.push(draftFor(kind, result, run));
      }
    }
  }
  return plan;
}
