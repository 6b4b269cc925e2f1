/**
 * Findings as CSV for spreadsheets: one row per finding, RFC 4180 quoting, CRLF line ends, a UTF-8 byte order mark
 * (so spreadsheet programs detect the encoding) and the cautions as a closing note.
 */
import { stringify } from 'csv-stringify/sync';
import { REPORT_CAUTIONS_TEXT } from '../../reports/report-cautions';
import { percentRoundedUp } from '../../reports/report-format';
import {
  FINDING_KIND_LABELS,
  FINDING_PRIORITY_LABELS,
  FINDING_STATUS_LABELS,
  type FindingExport,
  distinctValues,
} from './finding-export';

export interface FindingsCsvOptions {
  /** Close with the cautions after an empty row (default). Off for files read by programs only. */
  cautions?: boolean;
}

export const FINDINGS_CSV_COLUMNS = [
  'Reference',
  'Title',
  'Kind',
  'Status',
  'Priority',
  'Assignee',
  'Due date',
  'Labels',
  'Member',
  'GlobalIds',
  'Utilisation (%)',
  'Created (UTC)',
  'Created by',
  'Modified (UTC)',
  'Modified by',
  'Accepted because',
  'Accepted by',
  'Accepted (UTC)',
  'Comments',
  'Last comment',
  'Description',
  'BCF topic GUID',
] as const;

/** "2026-02-03 14:00:00": the form spreadsheets read as a date-time; ISO input, UTC output. */
function spreadsheetDateTime(iso: string | undefined): string {
  if (iso === undefined) return '';
  const time = Date.parse(iso);
  return Number.isFinite(time) ? new Date(time).toISOString().slice(0, 19).replace('T', ' ') : iso;
}

function spreadsheetDate(iso: string | undefined): string {
  return spreadsheetDateTime(iso).slice(0, 10);
}

function findingRow(finding: FindingExport): (string | number)[] {
  const lastComment = finding.comments.reduce<FindingExport['comments'][number] | undefined>(
    (latest, comment) => (latest === undefined || Date.parse(comment.date) >= Date.parse(latest.date) ? comment : latest),
    undefined,
  );
  return [
    finding.id,
    finding.title,
    FINDING_KIND_LABELS[finding.kind],
    FINDING_STATUS_LABELS[finding.status],
    FINDING_PRIORITY_LABELS[finding.priority],
    finding.assigneeEmail ?? '',
    spreadsheetDate(finding.dueDate),
    distinctValues(finding.labels).join('; '),
    finding.memberLabel ?? '',
    finding.memberGlobalIds.join(' '),
    finding.utilisation === undefined ? '' : percentRoundedUp(finding.utilisation),
    spreadsheetDateTime(finding.createdAt),
    finding.createdBy,
    spreadsheetDateTime(finding.modifiedAt),
    finding.modifiedBy ?? '',
    finding.acceptance?.justification ?? '',
    finding.acceptance?.author ?? '',
    spreadsheetDateTime(finding.acceptance?.date),
    finding.comments.length,
    lastComment ? `${lastComment.author}: ${lastComment.text}` : '',
    finding.description ?? '',
    finding.guid.toLowerCase(),
  ];
}

/**
 * The CSV text. Cells starting with = + - @, tab or carriage return get a leading apostrophe (csv-stringify's
 * escape_formulas), so a title such as "=HYPERLINK(…)" is shown as text and never run as a formula: the usual
 * defence against CSV injection (common practice, no source).
 */
export function findingsCsv(findings: readonly FindingExport[], options: FindingsCsvOptions = {}): string {
  const rows: (string | number)[][] = findings.map(findingRow);
  if (options.cautions !== false) rows.push([], ['Cautions', REPORT_CAUTIONS_TEXT]);
  return stringify(rows, {
    bom: true,
    header: true,
    columns: [...FINDINGS_CSV_COLUMNS],
    record_delimiter: 'windows',
    escape_formulas: true,
  });
}
