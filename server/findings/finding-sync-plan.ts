/**
 * What a finished check run does to a project's findings, as a pure plan (finding-sync.ts applies it).
 *
 * One living finding per member GlobalId and check: the web shear check (a failure, or a pass at or above the
 * warning ratio, share one finding) and the flags to review. It is carried across runs, revisions and standards:
 * - The condition holds (the web fails; passes at or above the warning ratio; carries a flag to review) and no
 *   finding exists: a new one, Open.
 * - The condition holds and a finding exists: its run link, utilisation and description follow the run. A Verified
 *   or Ready-to-verify finding is reopened (it fails again); a Resolved one is reopened only when the run is of a
 *   newer revision than the one it was last seen in (a re-run of the same model cannot show a fix).
 * - A web close to capacity that now fails is the same finding grown worse: it becomes a failure (title, priority)
 *   and is reopened from any closed or resolved status, accepted included: what was accepted was the lesser
 *   condition. A failure that drops to a warning stays a failure finding whose condition has cleared.
 * - Accepted findings otherwise keep the run they were accepted on (numbers, description), whatever later runs show,
 *   until a person reopens them: the reviewer accepted that condition, and the record must not drift from it.
 * - The member is clear of the condition in a run of a newer revision: Open, In progress and Resolved findings move
 *   to Ready to verify. A pass on the same revision (other parameters or standard) changes numbers only.
 * - Members the run did not check (no results, not an I-section, gone from the model) leave their findings alone,
 *   and so does any run of a revision older than the one a finding was last seen in.
 * Changes made here are recorded in the history as made by the system.
 */
import { governingCheckText } from '../checks/governing-check-text';
import type { FamilyCheckName, ShearAxis } from '../engine/shear-axis';
import { percentRoundedUp } from '../reports/report-format';
import { FINDING_PRIORITIES, type FindingPriority, type FindingStatus, type GeneratedKind } from './finding-fields';

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
  /** The axis and check that govern (absent in runs made before both axes were checked; the CLI gives the check's text). */
  governingAxis?: ShearAxis | null;
  governingCheck?: string | null;
  flags: readonly string[];
}

export interface SyncRun {
  runId: string;
  revisionNumber: number;
  /** How the run's standard is named in descriptions, e.g. "EN 1993-1-1 §6.2.6 with EN 1993-1-5 §5". */
  standardLabel?: string;
}

/** The generated findings of the project as stored. */
export interface SyncedFinding {
  id: string;
  memberKey: string;
  kind: GeneratedKind;
  status: FindingStatus;
  priority: FindingPriority;
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

/** The checks a member has one living finding for; the web shear check's finding is a failure or a warning. */
type CheckFamily = 'web-shear' | 'flag';
const FAMILIES: readonly CheckFamily[] = ['web-shear', 'flag'];

function familyOf(kind: GeneratedKind): CheckFamily {
  return kind === 'flag' ? 'flag' : 'web-shear';
}

/** How bad each kind is within its check, so a grown condition can be told from a lesser one. */
const SEVERITY: Readonly<Record<GeneratedKind, number>> = { 'web-shear-fail': 2, 'web-shear-warning': 1, flag: 1 };

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

/** The kind of the check's condition the run shows for the member, or null when it shows none. */
function kindShown(family: CheckFamily, result: RunMemberResult): GeneratedKind | null {
  if (family === 'flag') return conditionHolds('flag', result) ? 'flag' : null;
  if (result.status === 'fail') return 'web-shear-fail';
  return result.status === 'warning' ? 'web-shear-warning' : null;
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
  description: string;
  memberTag: string;
  memberLabel: string;
  /** Set when the status changes. */
  status?: { from: FindingStatus; to: FindingStatus };
  /** Set when a warning has grown into a failure. */
  escalated?: { kind: GeneratedKind; title: string; priority: FindingPriority };
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

function checkOf(run: SyncRun): string {
  return `the ${run.standardLabel ? `${run.standardLabel} ` : ''}check of model revision ${run.revisionNumber}`;
}

const TITLES: Readonly<Record<GeneratedKind, string>> = {
  'web-shear-fail': 'Web shear over capacity',
  'web-shear-warning': 'Web shear close to capacity',
  flag: 'Check flags to review',
};

const PRIORITIES: Readonly<Record<GeneratedKind, FindingPriority>> = { 'web-shear-fail': 'high', 'web-shear-warning': 'normal', flag: 'normal' };

/** What the run shows for the member, in the words of a finding of this kind. */
function descriptionFor(kind: GeneratedKind, result: RunMemberResult, run: SyncRun): string {
  if (kind === 'flag') {
    const flags = flagsToReview(result);
    return flags.length > 0 ? `${checkOf(run)} flagged: ${flags.join(', ')}.` : `${checkOf(run)} flagged nothing to review.`;
  }
  const utilisationText = result.utilisation === null ? 'Utilisation not known' : `${percentRoundedUp(result.utilisation)} % utilisation`;
  // The plain web check keeps its short wording; another governing check (minor axis, shear with bending) is named.
  const check = result.governingCheck && result.governingCheck !== 'major-axis shear' ? ` (${governingCheckText(result.governingAxis, result.governingCheck as FamilyCheckName)})` : '';
  const forces = `under ${result.governingCombination ?? 'the governing combination'}${check} (VEd ${kN(result.VEd_kN)}, VRd ${kN(result.VRd_kN)})`;
  const warning = kind === 'web-shear-warning' && result.status === 'warning' ? ", at or above the run's warning ratio" : '';
  const cleared = conditionCleared(kind, result) ? ` ${kind === 'web-shear-fail' ? 'Within capacity' : 'Below the warning ratio'} in this run.` : '';
  return `${utilisationText} ${forces} in ${checkOf(run)}${warning}.${cleared}`;
}

function sentence(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

function draftFor(kind: GeneratedKind, result: RunMemberResult, run: SyncRun): FindingDraft {
  const tag = memberTagOf(result);
  return {
    kind,
    globalId: result.globalId,
    title: `${TITLES[kind]}: ${tag}`,
    description: sentence(descriptionFor(kind, result, run)),
    priority: PRIORITIES[kind],
    utilisation: result.utilisation,
    memberTag: tag,
    memberLabel: memberLabelOf(result),
  };
}

function nextStatus(finding: SyncedFinding, shown: GeneratedKind | null, newerRevision: boolean): FindingStatus {
  const { status } = finding;
  if (shown !== null && SEVERITY[shown] > SEVERITY[finding.kind]) {
    return status === 'in-progress' ? status : 'open';
  }
  if (shown === finding.kind) {
    if (status === 'verified' || status === 'ready-to-verify') return 'open';
    if (status === 'resolved' && newerRevision) return 'open';
    return status;
  }
  if (newerRevision && (status === 'open' || status === 'in-progress' || status === 'resolved')) return 'ready-to-verify';
  return status;
}

function updateFor(finding: SyncedFinding, result: RunMemberResult, run: SyncRun): FindingUpdate | null {
  const lastSeen = finding.revisionNumber ?? Number.NEGATIVE_INFINITY;
  if (run.revisionNumber < lastSeen || !isChecked(result)) return null;
  const shown = kindShown(familyOf(finding.kind), result);
  const grown = shown !== null && SEVERITY[shown] > SEVERITY[finding.kind];
  if (finding.status === 'accepted' && !grown) return null;
  const kind = grown ? shown : finding.kind;
  const holds = shown === kind;
  const status = nextStatus(finding, shown, run.revisionNumber > lastSeen);
  const tag = memberTagOf(result);
  const priority = grown && FINDING_PRIORITIES.indexOf(finding.priority) < FINDING_PRIORITIES.indexOf(PRIORITIES[kind]) ? PRIORITIES[kind] : finding.priority;
  return {
    id: finding.id,
    utilisation: result.utilisation,
    // The revision in which the condition was last seen; a pass does not move it.
    revisionNumber: holds ? run.revisionNumber : (finding.revisionNumber ?? run.revisionNumber),
    description: sentence(descriptionFor(kind, result, run)),
    memberTag: tag,
    memberLabel: memberLabelOf(result),
    ...(status !== finding.status && { status: { from: finding.status, to: status } }),
    ...(grown && { escalated: { kind, title: `${TITLES[kind]}: ${tag}`, priority } }),
  };
}

/** The living finding of each member and check; of two left by older versions, the more severe one. */
function livingFindings(existing: readonly SyncedFinding[]): Map<string, SyncedFinding> {
  const living = new Map<string, SyncedFinding>();
  for (const finding of existing) {
    const key = `${familyOf(finding.kind)}\u0000${finding.memberKey}`;
    const other = living.get(key);
    if (!other || SEVERITY[finding.kind] > SEVERITY[other.kind]) living.set(key, finding);
  }
  return living;
}

export function planRunSync(run: SyncRun, results: readonly RunMemberResult[], existing: readonly SyncedFinding[]): SyncPlan {
  const living = livingFindings(existing);
  const plan: SyncPlan = { create: [], update: [] };
  for (const result of results) {
    for (const family of FAMILIES) {
      const finding = living.get(`${family}\u0000${result.globalId}`);
      if (finding) {
        const update = updateFor(finding, result, run);
        if (update) plan.update.push(update);
        continue;
      }
      const shown = kindShown(family, result);
      if (shown) plan.create.push(draftFor(shown, result, run));
    }
  }
  return plan;
}
