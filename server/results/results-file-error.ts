import { type FieldIssue, UnprocessableError, ValidationError } from '../http/errors';

/**
 * The one error the results import throws for a file or mapping it cannot use. Like the IFC reader's error it is not an
 * HTTP error: the results service maps it (an upload answers 400, or 422 for bad rows, with `code` and `details`; the
 * CLI exits 2).
 * `message` is written for the person who chose the file: what is wrong, where, and what to do.
 */
export type ResultsFileErrorCode =
  | 'empty_file'
  | 'no_rows'
  | 'unsupported_format'
  | 'unsupported_encoding'
  | 'unreadable_csv'
  | 'unreadable_xlsx'
  | 'sheet_required'
  | 'sheet_not_found'
  | 'column_missing'
  | 'column_ambiguous'
  | 'invalid_mapping'
  | 'rows_invalid';

export type RowIssueCode =
  | 'member_missing'
  | 'combination_missing'
  | 'shear_missing'
  | 'not_numeric'
  | 'coordinates_incomplete'
  | 'coordinates_inconsistent'
  | 'duplicate_row';

/** One bad row: `row` is what a spreadsheet shows (header row included, 1-based), `column` the file's header. */
export interface RowIssue {
  row: number;
  /** The worksheet, when several are read. */
  sheet?: string;
  column?: string;
  code: RowIssueCode;
  message: string;
}

export interface ResultsFileErrorDetails {
  sheets?: string[];
  columns?: string[];
  /** Row-level problems, in file order, at most the reader's error limit. */
  issues?: RowIssue[];
  /** True when reading stopped at the error limit, so more rows may be wrong. */
  stoppedEarly?: boolean;
  /** Row (CSV record or sheet row, 1-based, header included) where reading stopped. */
  lastRow?: number;
}

export class ResultsFileError extends Error {
  constructor(
    readonly code: ResultsFileErrorCode,
    message: string,
    readonly details: ResultsFileErrorDetails = {},
  ) {
    super(message);
    this.name = 'ResultsFileError';
  }
}

/**
 * The error as the API and the job runner carry it (a domain error keeps its code and details across the worker
 * boundary). A file that cannot be read is a ValidationError; bad rows in a readable file become the
 * UnprocessableError `invalid_rows` with `details.errors:[{row, column, message}]`. Nothing is stored either way.
 */
export function asDomainError(error: ResultsFileError): ValidationError | UnprocessableError {
  if (error.code !== 'rows_invalid') return fileValidationError(error.message, error.code, error.details);
  const { issues = [], stoppedEarly = false, lastRow } = error.details;
  const errors = issues.map((issue) => ({ row: issue.row, column: issue.column ?? null, code: issue.code, message: issue.message }));
  return new UnprocessableError(error.message, { code: 'invalid_rows', details: { errors, stoppedEarly, lastRow } });
}

function fileValidationError(message: string, code: string, details: unknown): ValidationError {
  // ValidationError's details are typed for request fields; a file's problems carry their own shape.
  return new ValidationError(message, { code, details: details as FieldIssue[] });
}
