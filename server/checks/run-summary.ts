/** What a finished check run records about its outcome, and the counts its API shows. */
import type { CheckRunSummary } from './check-run-compute';

export interface RunSummary extends CheckRunSummary {
  /** Result keys that matched no member, or several, when the run started. */
  unmatchedResults: number;
  ambiguousResults: number;
}

/** Status counts as the results table filters them: a passing member at or above the warning ratio is a warning. */
export interface RunSummaryView {
  members: number;
  pass: number;
  warning: number;
  fail: number;
  notChecked: number;
  notApplicable: number;
  maxUtilisation: number | null;
  maxUtilisationGlobalId: string | null;
  unmatchedResults: number;
  ambiguousResults: number;
}

export function toSummaryView(summary: RunSummary): RunSummaryView {
  return {
    members: summary.members,
    pass: summary.pass - summary.warnings,
    warning: summary.warnings,
    fail: summary.fail,
    notChecked: summary.notChecked,
    notApplicable: summary.notApplicable,
    maxUtilisation: summary.maxUtilisation,
    maxUtilisationGlobalId: summary.maxUtilisationGlobalId,
    unmatchedResults: summary.unmatchedResults,
    ambiguousResults: summary.ambiguousResults,
  };
}
