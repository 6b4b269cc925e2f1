import type { ErrorRequestHandler, RequestHandler } from 'express';
import { MulterError } from 'multer';
import {
  ConflictError,
  DependencyFailedError,
  DomainError,
  ForbiddenError,
  GoneError,
  NotFoundError,
  PayloadTooLargeError,
  RateLimitedError,
  UnauthenticatedError,
  UnprocessableError,
  UnsupportedMediaError,
  ValidationError,
} from './errors';

export interface ErrorBody {
  error: { code: string; message: string; details: unknown };
}

/** The one place a domain error becomes an HTTP status. */
export function httpStatusOf(error: DomainError): number {
  if (error instanceof ValidationError) return 400;
  if (error instanceof UnauthenticatedError) return 401;
  if (error instanceof ForbiddenError) return 403;
  if (error instanceof NotFoundError) return 404;
  if (error instanceof ConflictError) return 409;
  if (error instanceof GoneError) return 410;
  if (error instanceof PayloadTooLargeError) return 413;
  if (error instanceof UnsupportedMediaError) return 415;
  if (error instanceof UnprocessableError) return 422;
  if (error instanceof RateLimitedError) return 429;
  if (error instanceof DependencyFailedError) return 502;
  return 500;
}

/** Errors raised by the body parsers and multer, which are not ours but are the client's fault. */
function fromLibraryError(error: unknown): DomainError | undefined {
  if (error instanceof MulterError) {
    if (error.code === 'LIMIT_FILE_SIZE') return new PayloadTooLargeError('The file is larger than the upload limit.');
    return new ValidationError(`The upload was rejected: ${error.message}.`, { code: 'upload_rejected' });
  }
  const type = typeof error === 'object' && error !== null ? (error as { type?: unknown }).type : undefined;
  if (type === 'entity.parse.failed') {
    return new ValidationError('The request body is not valid JSON.', { code: 'malformed_json' });
  }
  if (type === 'entity.too.large') return new PayloadTooLargeError();
  if (type === 'encoding.unsupported' || type === 'charset.unsupported') {
    return new UnsupportedMediaError('Send the request body as UTF-8 JSON.');
  }
  if (type === 'request.aborted') return new ValidationError('The request was interrupted.', { code: 'request_aborted' });
  return undefined;
}

/**
 * Maps every error to `{error:{code,message,details}}`. Unknown errors become a 500 whose
 * message says nothing about the cause; the stack goes to the log only.
 */
export const errorMiddleware: ErrorRequestHandler = (error, req, res, next) => {
  if (res.headersSent) {
    next(error);
    return;
  }
  const known = error instanceof DomainError ? error : fromLibraryError(error);
  if (known) {
    req.log?.debug({ code: known.code }, known.message);
    res.status(httpStatusOf(known)).json(errorBody(known.code, known.message, known.details));
    return;
  }
  req.log?.error({ err: error }, 'unhandled error');
  res
    .status(500)
    .json(errorBody('internal', 'Something went wrong on the server. The error has been logged.', { requestId: req.id ?? null }));
};

/** Ends the /api tree: an unknown API route answers JSON, never the client app. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new NotFoundError(`There is no API route ${req.method} ${req.originalUrl.split('?')[0]}.`, { code: 'route_not_found' }));
};

function errorBody(code: string, message: string, details: unknown): ErrorBody {
  return { error: { code, message, details: details ?? null } };
}
