import { HttpContextToken, HttpErrorResponse } from '@angular/common/http';

/** Set to false where a 401 is an expected answer (sign-in, "who am I") rather than a lost session. */
export const REDIRECT_ON_UNAUTHORISED = new HttpContextToken<boolean>(() => true);

/** An API failure as the server describes it: `{error: {code, message, details}}`. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

interface ErrorBody {
  error: { code: string; message: string; details?: unknown };
}

function isErrorBody(body: unknown): body is ErrorBody {
  const error = (body as ErrorBody | null)?.error;
  return typeof error?.code === 'string' && typeof error.message === 'string';
}

// Used when the response carries no error body of ours (proxy pages, network failures).
function fallbackMessage(status: number): string {
  if (status === 0) return 'Cannot reach the Taulens server. Check your connection and try again.';
  if (status === 404) return 'Not found.';
  if (status === 413) return 'The upload is too large.';
  if (status === 429) return 'Too many attempts. Wait a moment and try again.';
  if (status >= 500) return 'The server could not complete the request. Try again later.';
  return `The request failed (HTTP ${status}).`;
}

export function toApiError(response: HttpErrorResponse): ApiError {
  if (isErrorBody(response.error)) {
    const { code, message, details } = response.error.error;
    return new ApiError(response.status, code, message, details);
  }
  return new ApiError(response.status, response.status === 0 ? 'network' : 'http_error', fallbackMessage(response.status));
}

/** The sentence to show a user for any failure a request or a form can produce. */
export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  return 'Something went wrong. Try again.';
}
