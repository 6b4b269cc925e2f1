/**
 * The results API's answers as plain types (no entities, no TypeORM), so the client imports them instead of keeping
 * copies: uploads waiting for a mapping, result sets, the matching report and saved mappings.
 */
import type { ColumnMapping, MappingGuess } from './column-mapping';
import type { MatchingSummary } from './matching-summary';
import type { GeometryMatchOptions, MatchMethod } from './member-matching';

export const RESULTS_FILE_KINDS = ['csv', 'xlsx'] as const;
export type ResultsFileKind = (typeof RESULTS_FILE_KINDS)[number];

export interface ResultsUploadView {
  id: string;
  fileName: string;
  format: ResultsFileKind;
  sizeBytes: number;
  sha256: string;
  /** Worksheet names of a workbook; null for CSV. */
  sheets: string[] | null;
  /** The sheet previewed; null when a workbook has several and the user must choose. */
  sheet: string | null;
  /** CSV only. */
  delimiter: string | null;
  decimalSeparator: '.' | ',';
  /** Row of the header as a spreadsheet numbers it; null when the file has none (columns are 'Column 1', …). */
  headerRow: number | null;
  headers: string[];
  /** Row of a units row under the header, or null; its unit per column ('' where none). Always sent; optional
   * only so that the client's screens, which do not show them yet, need not mock them. */
  unitsRow?: number | null;
  units?: string[];
  /** The first rows as text. */
  rows: string[][];
  guessedMapping: MappingGuess['mapping'];
  /** Required mapping fields the header did not reveal. */
  missingMapping: MappingGuess['missing'];
  /** Choices the guess made on a hunch (two columns for one role, numbered axes, a wide layout): to be confirmed. */
  unsureMapping?: MappingGuess['unsure'];
}

export interface ResultSetView {
  id: string;
  name: string;
  fileName: string;
  format: ResultsFileKind;
  sheet: string | null;
  sha256: string;
  rowCount: number;
  /** Distinct member keys. */
  memberKeys: number;
  combinations: string[];
  forceUnit: string;
  mapping: ColumnMapping;
  geometry: GeometryMatchOptions | null;
  createdBy: { id: string; name: string } | null;
  createdAt: string;
  modelRevisionId: string;
  matching: MatchingSummary;
}

export const MATCHING_FILTERS = ['all', 'matched', 'ambiguous', 'unmatched', 'members-without-results'] as const;
export type MatchingFilter = (typeof MATCHING_FILTERS)[number];

export interface MemberCandidate {
  globalId: string;
  tag: string | null;
  name: string | null;
}

export interface MatchingItem {
  /** Null on a members-without-results row. */
  resultKey: string | null;
  globalId: string | null;
  tag: string | null;
  name: string | null;
  method: MatchMethod | null;
  candidates: MemberCandidate[];
}

export interface MatchingPage {
  summary: MatchingSummary;
  total: number;
  items: MatchingItem[];
}

export interface MappingTemplateView {
  id: string;
  name: string;
  mapping: ColumnMapping;
  createdAt: string;
}
