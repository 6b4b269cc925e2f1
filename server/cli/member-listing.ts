/**
 * How `taulens members` presents the reader's records: the JSON shape for pipelines and a fixed-width table for people.
 *
 * Status is 'ok' or 'not-applicable'. A member the reader flagged (it looks like it should be checked but something
 * is missing or wrong: no representation, an invalid or unknown profile) is listed as 'not-applicable' with its
 * reason, and its flags start with 'needs-review'; its profile and section are given when they could be read.
 */
import type { MemberRecord, ModelInfo } from '../ifc/model-read-result';
import { overallDepth_mm, webThickness_mm } from '../engine/section-family';

export interface ListedMember {
  globalId: string;
  expressId: number;
  tag: string | null;
  name: string | null;
  ifcClass: string;
  objectType: string | null;
  predefinedType: string | null;
  storey: string | null;
  status: 'ok' | 'not-applicable';
  reason?: string;
  flags: string[];
  profile: MemberRecord['profile'];
  section: MemberRecord['section'];
  material: MemberRecord['material'];
  length_mm: number | null;
  axis: MemberRecord['axis'];
}

export const NEEDS_REVIEW = 'needs-review';

export function listedMember(record: MemberRecord): ListedMember {
  return {
    globalId: record.globalId,
    expressId: record.expressId,
    tag: record.tag,
    name: record.name,
    ifcClass: record.ifcClass,
    objectType: record.objectType,
    predefinedType: record.predefinedType,
    storey: record.storey,
    status: record.status === 'ok' ? 'ok' : 'not-applicable',
    ...(record.reason ? { reason: record.reason } : {}),
    flags: record.status === 'flagged' ? [NEEDS_REVIEW, ...record.flags] : [...record.flags],
    profile: record.profile,
    section: record.section,
    material: record.material,
    length_mm: record.length_mm,
    axis: record.axis,
  };
}

const COLUMNS: readonly { title: string; width: number; value: (m: ListedMember) => string }[] = [
  { title: 'GlobalId', width: 22, value: (m) => m.globalId },
  { title: 'Tag', width: 8, value: (m) => m.tag ?? '' },
  { title: 'Name', width: 16, value: (m) => m.name ?? '' },
  { title: 'Class', width: 20, value: (m) => m.ifcClass },
  { title: 'Storey', width: 12, value: (m) => m.storey ?? '' },
  { title: 'Status', width: 14, value: (m) => m.status },
  { title: 'Profile', width: 18, value: (m) => m.profile?.name ?? '' },
  { title: 'Family', width: 8, value: (m) => m.profile?.family ?? '' },
  { title: 'Found from', width: 17, value: (m) => m.profile?.source ?? '' },
  { title: 'Fab.', width: 6, value: (m) => m.profile?.fabrication ?? '' },
  {
    title: 'd × tw mm',
    width: 13,
    value: (m) => (m.profile ? `${round(overallDepth_mm(m.profile))} × ${round(webThickness_mm(m.profile) ?? 0)}` : ''),
  },
  { title: 'Grade', width: 8, value: (m) => (m.material ? `${m.material.grade}${m.material.assumed ? '*' : ''}` : '') },
  { title: 'fy MPa', width: 7, value: (m) => (m.material?.fy_MPa != null ? round(m.material.fy_MPa) : '') },
  { title: 'L m', width: 7, value: (m) => (m.length_mm != null ? (m.length_mm / 1000).toFixed(3) : '') },
];

function round(value: number): string {
  return String(Math.round(value * 10) / 10);
}

function cell(text: string, width: number): string {
  return text.length > width ? `${text.slice(0, width - 1)}…` : text.padEnd(width);
}

/** The readable listing: model line, one row per member, the reasons, the counts and the cautions. */
export function memberTable(model: ModelInfo, members: readonly ListedMember[], cautions: string): string {
  const lines = [
    `${model.fileName ?? 'model'}: ${model.fileSchema}${model.schemaReadAs ? ` (read as ${model.schema})` : ''}, length unit ${model.lengthUnit}${model.application ? `, from ${model.application}` : ''}`,
    '',
    COLUMNS.map((c) => cell(c.title, c.width)).join('  ').trimEnd(),
    COLUMNS.map((c) => '-'.repeat(c.width)).join('  '),
    ...members.map((m) => COLUMNS.map((c) => cell(c.value(m), c.width)).join('  ').trimEnd()),
  ];
  const explained = members.filter((m) => m.reason);
  if (explained.length > 0) {
    lines.push('', 'Not checked, and why:');
    for (const m of explained) lines.push(`  ${m.globalId} ${m.name ?? ''}: ${m.reason}${m.flags.includes(NEEDS_REVIEW) ? ' (needs review)' : ''}`);
  }
  const c = model.counts;
  lines.push(
    '',
    `${c.members} members: ${c.ok} ok, ${c.notApplicable} not applicable, ${c.flagged} need review. * grade assumed (material names no grade).`,
    '',
    cautions,
  );
  return lines.join('\n') + '\n';
}
