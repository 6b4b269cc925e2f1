/**
 * The column-mapping form as plain data: what the form holds (every field a string, '' for "not mapped") and how it
 * turns into the mapping the server validates (server/results/column-mapping.ts). Pure, so the rules are tested
 * without a page.
 */
import type { ForceUnit, LengthUnit } from '../../../server/engine/units';
import type { MomentUnit } from '../../../server/results/unit-words';
import type { ColumnMapping, MemberKeyKind } from './results-api';

export const END_COLUMN_KEYS = ['x1', 'y1', 'z1', 'x2', 'y2', 'z2'] as const satisfies readonly (keyof NonNullable<ColumnMapping['endColumns']>)[];
export type EndColumnKey = (typeof END_COLUMN_KEYS)[number];

export interface MappingFields {
  memberColumn: string;
  memberKeyKind: MemberKeyKind;
  combinationColumn: string;
  stationColumn: string;
  shearColumn: string;
  /** Optional: shear across the flanges (Vy) and the moments about the major (My) and minor (Mz) axes. */
  minorShearColumn: string;
  majorMomentColumn: string;
  minorMomentColumn: string;
  forceUnit: ForceUnit | '';
  lengthUnit: LengthUnit | '';
  momentUnit: MomentUnit | '';
  useEnds: boolean;
  ends: Record<EndColumnKey, string>;
}

export const MEMBER_KEY_KIND_LABELS: Readonly<Record<MemberKeyKind, string>> = {
  auto: 'Try GlobalId, then Tag, then Name',
  globalId: 'IFC GlobalId',
  tag: 'Tag (mark)',
  name: 'Name',
};

const noEnds = (): Record<EndColumnKey, string> => ({ x1: '', y1: '', z1: '', x2: '', y2: '', z2: '' });

/**
 * Form values from a guessed or saved mapping; a column the file does not have is left empty, so the user sees what
 * still needs choosing instead of a name the import would refuse.
 */
export function mappingFieldsFrom(mapping: Partial<ColumnMapping>, headers: readonly string[]): MappingFields {
  const known = (column: string | undefined): string => (column !== undefined && headers.includes(column) ? column : '');
  const ends = noEnds();
  for (const key of END_COLUMN_KEYS) ends[key] = known(mapping.endColumns?.[key]);
  return {
    memberColumn: known(mapping.memberColumn),
    memberKeyKind: mapping.memberKeyKind ?? 'auto',
    combinationColumn: known(mapping.combinationColumn),
    stationColumn: known(mapping.stationColumn),
    shearColumn: known(mapping.shearColumn),
    minorShearColumn: known(mapping.minorShearColumn),
    majorMomentColumn: known(mapping.majorMomentColumn),
    minorMomentColumn: known(mapping.minorMomentColumn),
    forceUnit: mapping.forceUnit ?? '',
    lengthUnit: mapping.lengthUnit ?? '',
    momentUnit: mapping.momentUnit ?? '',
    useEnds: END_COLUMN_KEYS.every((key) => ends[key] !== ''),
    ends,
  };
}

/** What still stops the mapping from being sent, in the words the form shows; [] when it can be. */
export function mappingProblems(fields: MappingFields): string[] {
  const problems: string[] = [];
  if (!fields.memberColumn) problems.push('Choose the column that names the member.');
  if (!fields.combinationColumn) problems.push('Choose the load combination column.');
  if (!fields.shearColumn) problems.push('Choose the shear force column.');
  if (!fields.forceUnit) problems.push('Choose the force unit.');
  if (fields.useEnds && END_COLUMN_KEYS.some((key) => !fields.ends[key])) {
    problems.push('Choose all six end-coordinate columns, or turn matching by end points off.');
  }
  if ((fields.stationColumn || fields.useEnds) && !fields.lengthUnit) {
    problems.push('Choose the length unit of the station and coordinate columns.');
  }
  if (hasMoments(fields) && !fields.momentUnit) problems.push('Choose the unit of the moment columns.');
  const seen = new Set<string>();
  for (const column of usedColumns(fields)) {
    if (seen.has(column)) problems.push(`Column "${column}" is chosen twice.`);
    seen.add(column);
  }
  return problems;
}

function usedColumns(fields: MappingFields): string[] {
  const ends = fields.useEnds ? END_COLUMN_KEYS.map((key) => fields.ends[key]) : [];
  return [
    fields.memberColumn,
    fields.combinationColumn,
    fields.stationColumn,
    fields.shearColumn,
    fields.minorShearColumn,
    fields.majorMomentColumn,
    fields.minorMomentColumn,
    ...ends,
  ].filter(Boolean);
}

function hasMoments(fields: MappingFields): boolean {
  return fields.majorMomentColumn !== '' || fields.minorMomentColumn !== '';
}

/** The mapping to send; call only when `mappingProblems` is empty. Unmapped optional columns are left out. */
export function columnMappingOf(fields: MappingFields): ColumnMapping {
  const needsLength = fields.stationColumn !== '' || fields.useEnds;
  return {
    memberColumn: fields.memberColumn,
    memberKeyKind: fields.memberKeyKind,
    combinationColumn: fields.combinationColumn,
    shearColumn: fields.shearColumn,
    forceUnit: fields.forceUnit as ForceUnit,
    ...(fields.stationColumn && { stationColumn: fields.stationColumn }),
    ...(fields.minorShearColumn && { minorShearColumn: fields.minorShearColumn }),
    ...(fields.majorMomentColumn && { majorMomentColumn: fields.majorMomentColumn }),
    ...(fields.minorMomentColumn && { minorMomentColumn: fields.minorMomentColumn }),
    ...(hasMoments(fields) && fields.momentUnit && { momentUnit: fields.momentUnit }),
    ...(fields.useEnds && { endColumns: { ...fields.ends } }),
    ...(needsLength && fields.lengthUnit && { lengthUnit: fields.lengthUnit }),
  };
}

/** A default name for a result set: the file name without its extension. */
export function resultSetNameFor(fileName: string): string {
  return fileName.replace(/\.[^.]+$/, '').trim() || fileName;
}
