// The one place a domain failure gets its HTTP status: the rules say what went wrong, the edge says how HTTP puts it.
import { DomainError, RetryLaterError, type FailureKind, type FieldProblem } from '../domain/errors';

export const STATUS_OF_KIND: Readonly<Record<FailureKind, number>> = {
  invalid: 400,
  unauthenticated: 401,
  not_allowed: 403,
  not_found: 404,
  conflict: 409,
  gone: 410,
  unprocessable: 422,
  locked: 423,
  rate_limited: 429,
  upstream_failed: 502,
};

export interface ErrorResponse {
  status: number;
  headers: Record<string, string>;
  body: { error: string; message: string; details?: FieldProblem[] };
}

/** The status, headers and body a domain failure is answered with: `{ error, message, details? }`. */
export function errorResponse(err: DomainError): ErrorResponse {
  return {
    status: STATUS_OF_KIND[err.kind],
    headers: err instanceof RetryLaterError ? { 'Retry-After': String(err.retryAfterSeconds) } : {},
    body: { error: err.code, message: err.message, ...(err.details ? { details: err.details } : {}) },
  };
}
