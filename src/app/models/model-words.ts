/** Our words for the states of revisions and members, and small formatting rules the Models pages share. */
import type { MemberFlag, MemberStatus, RevisionStatus, RevisionView } from './models-api';

export const REVISION_STATUS_LABELS: Readonly<Record<RevisionStatus, string>> = {
  queued: 'Waiting to be read',
  ingesting: 'Reading',
  ready: 'Ready',
  failed: 'Could not be read',
};

const PHASE_LABELS: Readonly<Record<string, string>> = {
  parse: 'Opening the file',
  members: 'Reading members and sections',
  geometry: 'Building the 3D geometry',
  write: 'Writing the 3D geometry',
  store: 'Saving the members',
};

export const MEMBER_STATUS_LABELS: Readonly<Record<MemberStatus, string>> = {
  ok: 'Section read',
  'not-applicable': 'No shear rule',
  flagged: 'Needs a look',
};

/** What the flags about reading a section mean, for the member panel; their short labels are in checks/flag-labels.ts. */
export const SECTION_FLAG_NOTES: Readonly<Partial<Record<MemberFlag, string>>> = {
  'name-and-geometry-differ': "The section's name and its measured geometry disagree; the geometry is used. Ask the modeller which one is meant.",
  'section-unrecognised': 'The outline or the cut through the body is not a shape Taulens recognises, so the member is not checked.',
  'geometry-unread': 'The body could not be cut to measure the section, so only a section name found in a catalogue can give its dimensions.',
  tapered: 'The section varies along the member: the end sections are kept and the checks use the smaller one, never the larger.',
};

export function isRunning(revision: Pick<RevisionView, 'status'>): boolean {
  return revision.status === 'queued' || revision.status === 'ingesting';
}

/** "Building the 3D geometry · 62 %" while a revision is read. */
export function progressText(revision: Pick<RevisionView, 'status' | 'progress'>): string {
  if (!revision.progress) return REVISION_STATUS_LABELS[revision.status];
  const phase = PHASE_LABELS[revision.progress.phase] ?? 'Reading';
  return `${phase} · ${Math.floor(revision.progress.fraction * 100)} %`;
}

/** 1 KB = 1024 bytes, one decimal above 1 MB: "812 KB", "14.6 MB". */
export function sizeText(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 ** 2) return `${Math.round(bytes / 1024)} KB`;
  if (bytes < 1024 ** 3) return `${(bytes / 1024 ** 2).toFixed(1)} MB`;
  return `${(bytes / 1024 ** 3).toFixed(2)} GB`;
}

/** Millimetres with at most one decimal, or a dash. */
export function mmText(value: number | null | undefined): string {
  return value === null || value === undefined ? '—' : value.toLocaleString('en', { maximumFractionDigits: 1 });
}

/** The label a revision goes by in lists and selectors. */
export function revisionLabel(revision: Pick<RevisionView, 'number' | 'fileName'>): string {
  return `Revision ${revision.number} · ${revision.fileName}`;
}
