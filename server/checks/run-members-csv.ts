/**
 * A check run's results table as CSV for spreadsheets: the run's record first (what was checked, by which standard,
 * engine and files), one row per member, then the cautions. RFC 4180 quoting, CRLF line ends and a UTF-8 byte order
 * mark, as the findings export writes them.
 */
import { stringify } from 'csv-stringify/sync';
import { REPORT_CAUTIONS_TEXT } from '../reports/report-cautions';
import { STANDARD_LABELS } from '../reports/report-format';
import type { CheckRunView, RunMemberRow } from './checks-api-types';

export const RUN_MEMBERS_CSV_COLUMNS = [
  'GlobalId',
  'Tag',
  'Name',
  'Storey',
  'Profile',
  'Grade',
  'Status',
  'Governing combination',
  'Governing axis',
  'Governing check',
  'VEd (kN)',
  'VRd (kN)',
  'Utilisation',
  'Tau max (MPa)',
  'Tau avg web (MPa)',
  'Flags',
] as const;

/** Text that a spreadsheet would run as a formula (= + - @, tab, CR, or their full-width forms) gets a leading apostrophe: the usual CSV-injection defence (common practice, no source). Numbers stay numbers. */
export function formulaSafe(text: string | null): string {
  if (text === null) return '';
  return /^[=+\-@\t\r\uFF1D\uFF0B\uFF0D\uFF20]/.test(text) ? `'${text}` : text;
}

const number = (value: number | null): string => (value === null ? '' : String(value));

export function runMembersCsv(run: CheckRunView, rows: readonly RunMemberRow[]): string {
  const record = [
    ['Check run', run.id],
    ['Standard', STANDARD_LABELS[run.standard]],
    ['Model', formulaSafe(`revision ${run.modelRevision.number}, ${run.modelRevision.fileName}, sha256 ${run.modelRevision.sha256}`)],
    ['Shear results', formulaSafe(`${run.resultSet.name}, sha256 ${run.resultSet.sha256}`)],
    ['Engine', run.engineVersion],
    ['Run by', formulaSafe(`${run.createdBy.name}, ${run.createdAt}`)],
    [],
  ];
  const members = rows.map((row) => [
    formulaSafe(row.globalId),
    formulaSafe(row.tag),
    formulaSafe(row.name),
    formulaSafe(row.storey),
    formulaSafe(row.profileName),
    formulaSafe(row.grade),
    row.status,
    formulaSafe(row.governingCombination),
    row.governingAxis ?? '',
    row.governingCheck ?? '',
    number(row.VEd_kN),
    number(row.VRd_kN),
    number(row.utilisation),
    number(row.tauMax_MPa),
    number(row.tauAvgWeb_MPa),
    row.flags.join(' '),
  ]);
  return stringify([...record, [...RUN_MEMBERS_CSV_COLUMNS], ...members, [], ['Cautions', REPORT_CAUTIONS_TEXT]], {
    bom: true,
    record_delimiter: 'windows',
  });
}
