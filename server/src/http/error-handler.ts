import type { ErrorRequestHandler } from 'express';
import { isDatabaseUnavailable } from '../db/unavailable';
import { DomainError } from '../domain/errors';
import { errorResponse } from './error-status';

interface Known {
  error: string;
  message: string;
  field?: string;
  rule?: string;
}

// Failures raised by middleware we do not own (body-parser, its decompression, csrf-sync) answered in our own words:
// their text names library internals and goes to the log only.
const BY_TYPE: Record<string, Known> = {
  'entity.parse.failed': { error: 'malformed_json', message: 'The request body is not valid JSON.', field: 'body', rule: 'must be valid JSON' },
  'entity.too.large': { error: 'body_too_large', message: 'The request body is larger than this route accepts.', field: 'body', rule: 'must not exceed the size limit' },
  'encoding.unsupported': { error: 'unsupported_encoding', message: 'The request body is compressed in a way this server does not accept.', field: 'Content-Encoding', rule: 'must be identity, gzip or deflate' },
  'charset.unsupported': { error: 'unsupported_charset', message: 'The request body is in a character set this server does not accept.', field: 'Content-Type', rule: 'charset must be utf-8' },
  'request.aborted': { error: 'request_aborted', message: 'The request ended before its body was complete.', field: 'body', rule: 'must arrive complete' },
  'request.size.invalid': { error: 'body_length_mismatch', message: 'The request body is not as long as its Content-Length says.', field: 'Content-Length', rule: 'must match the body' },
  'parameters.too.many': { error: 'too_many_parameters', message: 'The request body has too many parameters.', field: 'body', rule: 'must not exceed the parameter limit' },
};
const CORRUPT_BODY: Known = { error: 'malformed_body', message: 'The request body could not be read (a damaged compressed stream, for example).', field: 'body', rule: 'must be readable as sent' };
const GENERIC_4XX: Known = { error: 'invalid_request', message: 'The request could not be accepted as sent.' };

function known(err: { type?: unknown; code?: unknown; errno?: unknown }): Known {
  if (typeof err.type === 'string' && BY_TYPE[err.type]) return BY_TYPE[err.type];
  // zlib's failures (Z_DATA_ERROR, Z_BUF_ERROR …) while inflating a body that claimed to be compressed.
  if (typeof err.code === 'string' && err.code.startsWith('Z_')) return CORRUPT_BODY;
  return GENERIC_4XX;
}

/** Registered last: the only place a failure becomes a response. Every body is ours; never a stack or a library's text. */
export function errorHandler(log: (msg: string) => void = console.error): ErrorRequestHandler {
  return (err, req, res, _next) => {
    if (err instanceof DomainError) {
      const answer = errorResponse(err);
      if (err.cause !== undefined) log(`[server] ${req.method} ${req.path} ${answer.status} ${err.code}: ${String((err.cause as Error)?.message ?? err.cause)}`);
      res.set(answer.headers).status(answer.status).json(answer.body);
      return;
    }
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
      const k = known(err ?? {});
      if (k === GENERIC_4XX || k === CORRUPT_BODY) log(`[server] ${req.method} ${req.path} ${status} ${k.error}: ${String(err?.message ?? err)}`);
      res.status(status).json({ error: k.error, message: k.message, ...(k.field ? { details: [{ field: k.field, rule: k.rule }] } : {}) });
      return;
    }
    if (isDatabaseUnavailable(err)) {
      log(`[server] ${req.method} ${req.path} 503 database_unavailable: ${String(err?.message ?? err)}`);
      res.set('Retry-After', '5');
      res.status(503).json({ error: 'database_unavailable', message: 'The station database is not answering. Check the screen for what was saved, then try again in a few seconds.' });
      return;
    }
    log(`[server] unexpected error: ${err?.stack ?? err}`);
    res.status(500).json({ error: 'internal_error', message: 'Something went wrong on our side. The action was not completed; try again.' });
  };
}
