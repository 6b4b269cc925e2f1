/** Uploads and result sets as the API shows them. */
import type { ColumnMapping, MappingGuess } from './column-mapping';
import type { MatchingSummary } from './matching-summary';
import type { GeometryMatchOptions } from './member-matching';
import type { ResultSet } from './result-set.entity';
import type { ResultsFileKind } from './results-table';

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
  /** The first rows as text. */
  rows: string[][];
  guessedMapping: MappingGuess['mapping'];
  /** Required mapping fields the header did not reveal. */
  missingMapping: MappingGuess['missing'];
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

/** `resultSet.createdBy` must be loaded. */
export function toResultSetView(resultSet: ResultSet): ResultSetView {
  const creator = resultSet.createdBy;
  return {
    id: resultSet.id,
    name: resultSet.name,
    fileName: resultSet.fileName,
    format: resultSet.format,
    sheet: resultSet.sheet,
    sha256: resultSet.sha256,
    rowCount: resultSet.rowCount,
    memberKeys: resultSet.memberKeyCount,
    combinations: resultSet.combinations,
    forceUnit: resultSet.forceUnit,
    mapping: resultSet.mapping,
    geometry: resultSet.geometry,
    createdBy: creator ? { id: creator.id, name: creator.name } : null,
    createdAt: resultSet.createdAt.toISOString(),
    modelRevisionId: resultSet.modelRevisionId,
    matching: resultSet.matching,
  };
}
