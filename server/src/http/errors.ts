// Typed failures thrown anywhere in the server and rendered by the one error handler as
// { error: 'snake_case_code', message, details? }.
export interface FieldProblem {
  field: string;
  rule: string;
}

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: FieldProblem[],
    /** What a library said: written to the server log, never sent to the client. */
    cause?: unknown,
  ) {
    super(message, cause === undefined ? undefined : { cause });
  }
}

export const badRequest = (message: string, details?: FieldProblem[], cause?: unknown) => new HttpError(400, 'invalid_request', message, details, cause);
export const unauthenticated = () => new HttpError(401, 'not_signed_in', 'Sign in to continue.');
export const forbidden = (message = 'Your role may not do this.') => new HttpError(403, 'forbidden', message);
export const notFound = (what: string) => new HttpError(404, 'not_found', `${what} was not found.`);
export const conflict = (code: string, message: string) => new HttpError(409, code, message);
export const tooManyRequests = (message: string) => new HttpError(429, 'too_many_attempts', message);

/** A 429 that says how long to wait, in words and in the Retry-After header the error handler sets. */
export class RetryLaterError extends HttpError {
  constructor(readonly retryAfterSeconds: number) {
    const wait = retryAfterSeconds < 120 ? `${retryAfterSeconds} second${retryAfterSeconds === 1 ? '' : 's'}` : `${Math.ceil(retryAfterSeconds / 60)} minutes`;
    super(429, 'too_many_attempts', `Too many failed sign-ins from here. Wait ${wait} and try again, or ask an admin to reset your password.`);
  }
}
export const retryLater = (seconds: number) => new RetryLaterError(Math.max(1, seconds));
