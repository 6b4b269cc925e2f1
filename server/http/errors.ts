/**
 * Domain errors thrown by services. They carry a machine-readable code, a message fit for the
 * user and optional details, but no HTTP status: error-middleware.ts alone maps them to HTTP.
 */

export interface DomainErrorOptions {
  /** Stable machine-readable code the client may branch on; each class has a default. */
  code?: string;
  details?: unknown;
  cause?: unknown;
}

export abstract class DomainError extends Error {
  readonly code: string;
  readonly details?: unknown;

  protected constructor(message: string, defaultCode: string, options: DomainErrorOptions = {}) {
    super(message, { cause: options.cause });
    this.name = new.target.name;
    this.code = options.code ?? defaultCode;
    this.details = options.details;
  }
}

export class NotFoundError extends DomainError {
  constructor(message = 'Not found.', options?: DomainErrorOptions) {
    super(message, 'not_found', options);
  }
}

/** One field or parameter that failed validation. */
export interface FieldIssue {
  location: 'params' | 'query' | 'body';
  /** Dotted path inside the location, '' for the whole value. */
  field: string;
  message: string;
}

export class ValidationError extends DomainError {
  constructor(message: string, options?: DomainErrorOptions & { details?: FieldIssue[] }) {
    super(message, 'validation_failed', options);
  }
}

/**
 * A well-formed request whose content cannot be used as it stands: rows of an uploaded file that fail validation, or
 * a check that needs the user's confirmation first.
 */
export class UnprocessableError extends DomainError {
  constructor(message: string, options?: DomainErrorOptions) {
    super(message, 'unprocessable', options);
  }
}

export class ConflictError extends DomainError {
  constructor(message: string, options?: DomainErrorOptions) {
    super(message, 'conflict', options);
  }
}

export class ForbiddenError extends DomainError {
  constructor(message = 'You do not have permission to do this.', options?: DomainErrorOptions) {
    super(message, 'forbidden', options);
  }
}

export class UnauthenticatedError extends DomainError {
  constructor(message = 'Please sign in.', options?: DomainErrorOptions) {
    super(message, 'unauthenticated', options);
  }
}

/** An expired or already used token link. */
export class GoneError extends DomainError {
  constructor(message: string, options?: DomainErrorOptions) {
    super(message, 'gone', options);
  }
}

export class PayloadTooLargeError extends DomainError {
  constructor(message = 'The request is too large.', options?: DomainErrorOptions) {
    super(message, 'payload_too_large', options);
  }
}

export class UnsupportedMediaError extends DomainError {
  constructor(message = 'Send the request body as JSON.', options?: DomainErrorOptions) {
    super(message, 'unsupported_media_type', options);
  }
}

export class RateLimitedError extends DomainError {
  constructor(message = 'Too many attempts. Wait a few minutes and try again.', options?: DomainErrorOptions) {
    super(message, 'rate_limited', options);
  }
}

/** A service this one depends on (the SMTP server) failed; nothing was changed. */
export class DependencyFailedError extends DomainError {
  constructor(message: string, options?: DomainErrorOptions) {
    super(message, 'dependency_failed', options);
  }
}
