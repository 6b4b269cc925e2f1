/**
 * The one table of status transitions and the permission each needs. Engineers work on and resolve findings,
 * reviewers verify, send back or accept them (accepting needs a written justification), coordinators only assign.
 * "Ready to verify" is never chosen by a person: a check run of a newer revision in which the member passes moves
 * a finding there (finding-sync-plan.ts). Resolving a finding whose member fails needs a note of what was done: a
 * failure closed without one cannot be verified. Every change of status, by a person, a BCF import or the system,
 * is checked here.
 */
import { ConflictError, ForbiddenError, ValidationError } from '../http/errors';
import type { Action } from '../auth/permissions';
import { FINDING_STATUSES, type FindingStatus } from './finding-fields';

export const FINDING_TRANSITIONS: Readonly<Record<FindingStatus, Readonly<Partial<Record<FindingStatus, Action>>>>> = {
  open: { 'in-progress': 'finding.resolve', resolved: 'finding.resolve', accepted: 'finding.accept' },
  'in-progress': { open: 'finding.resolve', resolved: 'finding.resolve', accepted: 'finding.accept' },
  resolved: { 'in-progress': 'finding.resolve', verified: 'finding.verify', open: 'finding.verify', accepted: 'finding.accept' },
  'ready-to-verify': { verified: 'finding.verify', open: 'finding.verify', accepted: 'finding.accept' },
  verified: { open: 'finding.verify' },
  accepted: { open: 'finding.accept' },
};

/** The statuses a caller who may do `grants` can move a finding to from `from`, in workflow order. */
export function allowedTransitions(from: FindingStatus, grants: (action: Action) => boolean): FindingStatus[] {
  const edges = FINDING_TRANSITIONS[from];
  return FINDING_STATUSES.filter((to) => {
    const action = edges[to];
    return action !== undefined && grants(action);
  });
}

export interface TransitionRequest {
  from: FindingStatus;
  to: FindingStatus;
  justification?: string | null;
  /** What was done; required to resolve a failing finding. */
  note?: string | null;
  /** Whether the finding is about a member that fails its check. */
  failing?: boolean;
}

/**
 * Throws unless the caller may make this change: 409 `invalid_transition` when the workflow has no such step,
 * 403 `transition_not_allowed` when it has but the role lacks the permission (both list the allowed statuses),
 * 400 `justification_required` when accepting without a justification, 400 `resolution_note_required` when resolving
 * a failing finding without a note. Returns the trimmed justification.
 */
export function checkTransition(request: TransitionRequest, grants: (action: Action) => boolean): string | null {
  const { from, to } = request;
  const allowed = allowedTransitions(from, grants);
  const details = { from, to, allowed };
  const action = FINDING_TRANSITIONS[from][to];
  if (action === undefined) {
    const options = allowed.length > 0 ? ` You can move it to: ${allowed.join(', ')}.` : '';
    throw new ConflictError(`A finding cannot go from ${from} to ${to}.${options}`, { code: 'invalid_transition', details });
  }
  if (!grants(action)) {
    throw new ForbiddenError(`Your role does not allow moving a finding from ${from} to ${to} (${action}).`, {
      code: 'transition_not_allowed',
      details,
    });
  }
  if (to === 'resolved' && request.failing && (request.note?.trim() ?? '') === '') {
    throw new ValidationError('Resolving a finding whose member fails needs a note of what was done.', {
      code: 'resolution_note_required',
      details: [{ location: 'body', field: 'note', message: 'is required to resolve a failing finding' }],
    });
  }
  if (to !== 'accepted') return null;
  const justification = request.justification?.trim() ?? '';
  if (justification === '') {
    throw new ValidationError('Accepting a finding needs a written justification.', {
      code: 'justification_required',
      details: [{ location: 'body', field: 'justification', message: 'is required to accept a finding' }],
    });
  }
  return justification;
}
