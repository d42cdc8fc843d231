// Failures the server's rules raise, named by what went wrong (their kind) and a snake_case code the client can
// branch on, never by how a transport says so: the HTTP edge turns a kind into a status (http/error-status.ts), and a
// batch, a worker or a test reads the same error without knowing about HTTP.
export interface FieldProblem {
  field: string;
  rule: string;
}

export type FailureKind =
  /** The input breaks a rule; `details` names each field and the rule it breaks. */
  | 'invalid'
  /** Nobody is signed in, or the credential sent (a key, a passenger token, a password) is not accepted. */
  | 'unauthenticated'
  /** The caller is known and may not do this. */
  | 'not_allowed'
  | 'not_found'
  /** The record's current state does not allow the action (already decided, departed, a race lost). */
  | 'conflict'
  /** It existed and may no longer be used (a link used or expired). */
  | 'gone'
  /** Held shut after too many tries. */
  | 'locked'
  /** Well-formed, but its content cannot be applied (a feed event about a flight we do not have). */
  | 'unprocessable'
  /** Too many attempts; `retryAfterSeconds` when the wait is known. */
  | 'rate_limited'
  /** A provider we depend on (bank, card issuer) did not answer; nothing was changed. */
  | 'upstream_failed';

export class DomainError extends Error {
  constructor(
    readonly kind: FailureKind,
    readonly code: string,
    message: string,
    readonly details?: FieldProblem[],
    /** What a library said: for the server log, never for the person who asked. */
    cause?: unknown,
  ) {
    super(message, cause === undefined ? undefined : { cause });
    this.name = 'DomainError';
  }
}

export const badRequest = (message: string, details?: FieldProblem[], cause?: unknown) => new DomainError('invalid', 'invalid_request', message, details, cause);
export const unauthenticated = (code = 'not_signed_in', message = 'Sign in to continue.') => new DomainError('unauthenticated', code, message);
export const forbidden = (message = 'Your role may not do this.', code = 'forbidden') => new DomainError('not_allowed', code, message);
export const notFound = (what: string) => new DomainError('not_found', 'not_found', `${what} was not found.`);
export const conflict = (code: string, message: string) => new DomainError('conflict', code, message);
export const gone = (code: string, message: string) => new DomainError('gone', code, message);
export const locked = (code: string, message: string) => new DomainError('locked', code, message);
export const unprocessable = (code: string, message: string, details?: FieldProblem[]) => new DomainError('unprocessable', code, message, details);
export const upstreamFailed = (message: string, code = 'provider_unavailable') => new DomainError('upstream_failed', code, message);
export const tooManyRequests = (message: string) => new DomainError('rate_limited', 'too_many_attempts', message);

/** Too many failed sign-ins: says how long to wait, in words and (at the edge) in a Retry-After header. */
export class RetryLaterError extends DomainError {
  constructor(readonly retryAfterSeconds: number) {
    const wait = retryAfterSeconds < 120 ? `${retryAfterSeconds} second${retryAfterSeconds === 1 ? '' : 's'}` : `${Math.ceil(retryAfterSeconds / 60)} minutes`;
    super('rate_limited', 'too_many_attempts', `Too many failed sign-ins from here. Wait ${wait} and try again, or ask an admin to reset your password.`);
  }
}
export const retryLater = (seconds: number) => new RetryLaterError(Math.max(1, seconds));
