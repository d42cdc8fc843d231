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
  ) {
    super(message);
  }
}

export const badRequest = (message: string, details?: FieldProblem[]) => new HttpError(400, 'invalid_request', message, details);
export const unauthenticated = () => new HttpError(401, 'not_signed_in', 'Sign in to continue.');
export const forbidden = (message = 'Your role may not do this.') => new HttpError(403, 'forbidden', message);
export const notFound = (what: string) => new HttpError(404, 'not_found', `${what} was not found.`);
export const conflict = (code: string, message: string) => new HttpError(409, code, message);
export const tooManyRequests = (message: string) => new HttpError(429, 'too_many_attempts', message);
