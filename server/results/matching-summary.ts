/** The counts a person reads about a matching, and the loud warning when the results seem to be for another model. */
import type { MatchMethod, MatchReport } from './member-matching';

export interface MatchingSummary {
  /** Distinct member keys in the results. */
  keys: number;
  matched: number;
  ambiguous: number;
  unmatchedResults: number;
  /** Members expected to take results (all but not-applicable ones) that no key reached. */
  membersWithoutResults: number;
  byMethod: Record<MatchMethod, number>;
  likelyOtherModel: boolean;
  warning: string | null;
}

export function summariseMatching(report: MatchReport, revisionLabel: string): MatchingSummary {
  const { counts } = report;
  return {
    keys: counts.keys,
    matched: counts.matched,
    ambiguous: counts.ambiguous,
    unmatchedResults: counts.unmatched,
    membersWithoutResults: report.membersWithoutResults.length,
    byMethod: counts.byMethod,
    likelyOtherModel: report.likelyOtherModel,
    warning: report.likelyOtherModel ? otherModelWarning(counts.matched, counts.keys, revisionLabel) : null,
  };
}

function otherModelWarning(matched: number, keys: number, revisionLabel: string): string {
  const share = keys === 0 ? 0 : Math.round((100 * matched) / keys);
  return (
    `Only ${matched} of ${keys} result keys (${share} %) match a member of ${revisionLabel}. ` +
    'These results are probably for another model: check the file and the model before running a check.'
  );
}
