/**
 * The one error the IFC reader throws for a file it cannot read. `code` lets callers map it (an upload route answers
 * 422, the CLI exits 2); `message` is written for the person who chose the file: what is wrong and where.
 */
export type IfcReadErrorCode =
  | 'empty-file'
  | 'not-step'
  | 'truncated'
  | 'unknown-schema'
  | 'no-length-unit'
  | 'unreadable'
  | 'no-ifc-in-archive'
  | 'archive-too-large'
  | 'bad-archive';

export class IfcReadError extends Error {
  constructor(
    readonly code: IfcReadErrorCode,
    message: string,
  ) {
    super(message);
    this.name = 'IfcReadError';
  }
}
