import { type DomainError, PayloadTooLargeError, ValidationError } from '../http/errors';
import { IfcReadError, type IfcReadErrorCode } from '../ifc/ifc-read-error';

/** API codes of the reader's problems; the upload contract names not_ifc and unknown_schema. */
const API_CODE: Readonly<Record<IfcReadErrorCode, string>> = {
  'empty-file': 'not_ifc',
  'not-step': 'not_ifc',
  truncated: 'not_ifc',
  'no-ifc-in-archive': 'not_ifc',
  'bad-archive': 'not_ifc',
  'unknown-schema': 'unknown_schema',
  'archive-too-large': 'archive_too_large',
  'no-length-unit': 'no_length_unit',
  unreadable: 'unreadable_ifc',
};

/** The domain error for a file the IFC reader refused, naming the upload's `file` field. */
export function domainErrorOf(error: IfcReadError): DomainError {
  const code = API_CODE[error.code];
  if (error.code === 'archive-too-large') return new PayloadTooLargeError(error.message, { code });
  return new ValidationError(error.message, { code, details: [{ location: 'body', field: 'file', message: error.message }] });
}

/** Runs work of the IFC reader, turning its IfcReadError into the domain error. */
export async function readingIfc<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (error) {
    throw error instanceof IfcReadError ? domainErrorOf(error) : error;
  }
}
