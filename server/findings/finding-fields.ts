/**
 * The findings vocabulary of the API (wave-2 contract): statuses, kinds and priorities as the client and the
 * database spell them, and the limits of the free-text fields.
 */

export const FINDING_STATUSES = ['open', 'in-progress', 'resolved', 'ready-to-verify', 'verified', 'accepted'] as const;
export type FindingStatus = (typeof FINDING_STATUSES)[number];

/**
 * Why a finding exists: the member's web fails; it passes at or above the run's warning ratio; the check flagged
 * something about its data or code limits that an engineer should look at; or someone raised it by hand.
 */
export const FINDING_KINDS = ['web-shear-fail', 'web-shear-warning', 'flag', 'manual'] as const;
export type FindingKind = (typeof FINDING_KINDS)[number];
export type GeneratedKind = Exclude<FindingKind, 'manual'>;

export const FINDING_PRIORITIES = ['low', 'normal', 'high', 'critical'] as const;
export type FindingPriority = (typeof FINDING_PRIORITIES)[number];

/** Who made a change: a person in Taulens, the system after a check run, or a person through a BCF import. */
export const CHANGE_SOURCES = ['user', 'system', 'bcf-import'] as const;
export type ChangeSource = (typeof CHANGE_SOURCES)[number];

export const FINDING_LIMITS = {
  title: 200,
  description: 4000,
  comment: 4000,
  justification: 4000,
  label: 60,
  labels: 20,
  members: 500,
  /** Decoded PNG; the JSON body limit (1 MB) bounds the base64 text anyway. */
  snapshotBytes: 700 * 1024,
} as const;

/** "F-0042": how people quote a finding in mail, exports and meetings. */
export function findingReference(number: number): string {
  return `F-${String(number).padStart(4, '0')}`;
}
