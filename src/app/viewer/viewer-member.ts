/** Outcome of a member's web shear check, as the 3D view colours it. */
export type MemberCheckStatus = 'pass' | 'warning' | 'fail' | 'not-checked' | 'not-applicable';

/** What the 3D view knows about a member besides its geometry: the results of the selected check run. */
export interface ViewerMember {
  /** IFC GlobalId (22-character form); the same string names the member's node in the revision's .glb. */
  globalId: string;
  /** The member's tag or mark in the model, when it has one. */
  tag: string | null;
  /** Section designation as read from the model (e.g. "IPE 300"). */
  section: string | null;
  storey: string | null;
  /** Demand / capacity of the governing check; 1 means 100 %. Null when the member was not checked. */
  utilisationRatio: number | null;
  status: MemberCheckStatus;
}

/** Utilisation above this ratio fails the check. */
export const FAILING_UTILISATION_RATIO = 1;

/** True when the member's governing utilisation exceeds 100 % or its check failed. */
export function isFailing(member: ViewerMember): boolean {
  if (member.status === 'fail') return true;
  return member.utilisationRatio !== null && member.utilisationRatio > FAILING_UTILISATION_RATIO;
}
