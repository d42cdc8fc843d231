import type { ErrorRequestHandler } from 'express';
import { HttpError } from './errors';

/** Registered last: the only place a failure becomes a response. Never leaks a stack trace. */
export function errorHandler(log: (msg: string) => void = console.error): ErrorRequestHandler {
  return (err, _req, res, _next) => {
    if (err instanceof HttpError) {
      res.status(err.status).json({ error: err.code, message: err.message, ...(err.details ? { details: err.details } : {}) });
      return;
    }
    // Failures raised by middleware we do not own (body parser, csrf-sync, multer) carry a status of their own.
    const status = typeof err?.status === 'number' ? err.status : typeof err?.statusCode === 'number' ? err.statusCode : 500;
    if (status === 403 && err?.code === 'EBADCSRFTOKEN') {
      res.status(403).json({ error: 'csrf_token_invalid', message: 'The form was stale or not from this app. Reload the page and try again.' });
      return;
    }
    if (err instanceof URIError) {
      // The router could not percent-decode a path parameter; its sentence quotes the raw input, so ours replaces it.
      res.status(400).json({ error: 'malformed_url', message: 'A part of the address is not validly percent-encoded.', details: [{ field: 'path', rule: 'must be validly percent-encoded' }] });
      return;
    }
    if (status >= 400 && status < 500) {
      // Body-parser failures name the body as the field, like every other 400, so clients read one shape.
      if (err?.type === 'entity.parse.failed') {
        res.status(status).json({ error: 'malformed_json', message: 'The request body is not valid JSON.', details: [{ field: 'body', rule: 'must be valid JSON' }] });
        return;
      }
      if (err?.type === 'entity.too.large') {
        res.status(status).json({ error: 'body_too_large', message: 'The request body is larger than this route accepts.', details: [{ field: 'body', rule: 'must not exceed the size limit' }] });
        return;
      }
      res.status(status).json({ error: 'invalid_request', message: String(err?.message ?? 'Bad request') });
      return;
    }
    log(`[server] unexpected error: ${err?.stack ?? err}`);
    res.status(500).json({ error: 'internal_error', message: 'Something went wrong on our side. The action was not completed; try again.' });
  };
}
