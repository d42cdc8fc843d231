import type { ErrorRequestHandler, NextFunction, Request, RequestHandler, Response } from 'express';
import { ID_PREFIX, newId } from '../ids.js';
import type { ApiFault, ApiFaults } from '../faults/apiFaults.js';
import type { Holds } from '../faults/holds.js';
import { internalError, StripeApiError } from './errors.js';

export interface RequestLocals {
  requestId: string;
  apiVersion: string;
  fault: ApiFault | null;
  /** The `ek_test_…` secret when an ephemeral key authenticated the request. */
  ephemeralKey: string | null;
}

export function locals(res: Response): RequestLocals {
  return res.locals as RequestLocals;
}

/** Full request path without a trailing slash, e.g. `/v1/issuing/cards`. */
export function fullPath(req: Request): string {
  const path = req.baseUrl + req.path;
  return path.length > 1 && path.endsWith('/') ? path.slice(0, -1) : path;
}

export function sendJson(res: Response, status: number, bodyText: string): void {
  // A client that gave up (timeout, dropped socket) has nobody left to answer.
  if (res.headersSent || res.writableEnded || res.destroyed || res.req.socket.destroyed) return;
  res.status(status).type('application/json').send(bodyText);
}

export function sendError(res: Response, error: StripeApiError): void {
  sendJson(res, error.status, JSON.stringify(error.toBody(), null, 2));
}

/** Every response carries a request id and the API version, like Stripe's `Request-Id` / `Stripe-Version` headers. */
export function requestContext(defaultApiVersion: string): RequestHandler {
  return (req, res, next) => {
    const context: RequestLocals = {
      requestId: newId(ID_PREFIX.request),
      apiVersion: req.get('stripe-version') ?? defaultApiVersion,
      fault: null,
      ephemeralKey: null,
    };
    Object.assign(res.locals, context);
    res.set('Request-Id', context.requestId);
    res.set('Stripe-Version', context.apiVersion);
    next();
  };
}

function extractKey(header: string | undefined): string | null {
  if (!header) return null;
  const [scheme, value] = header.split(/\s+/, 2);
  if (!value) return null;
  if (scheme.toLowerCase() === 'bearer') return value;
  if (scheme.toLowerCase() === 'basic') {
    // curl -u sk_test_…: sends the key as the user name with an empty password.
    return Buffer.from(value, 'base64').toString('utf8').split(':')[0] || null;
  }
  return null;
}

/** Accepts test-mode secret (or restricted) keys only: a live key reaching a local stand-in is a configuration mistake. */
export const authenticate: RequestHandler = (req, res, next) => {
  const key = extractKey(req.get('authorization'));
  if (!key) {
    sendError(
      res,
      new StripeApiError(
        401,
        'invalid_request_error',
        "You did not provide an API key. Send it in the Authorization header using Bearer auth (e.g. 'Authorization: Bearer sk_test_…').",
      ),
    );
    return;
  }
  if (/^(sk|rk)_live_/.test(key)) {
    sendError(res, new StripeApiError(401, 'invalid_request_error', 'This local payments stand-in only accepts test-mode keys (sk_test_…).', 'api_key_live_mode'));
    return;
  }
  if (/^ek_test_\S+$/.test(key)) {
    // An ephemeral key reads one Issuing card's details and nothing else (Stripe Issuing, "Display card details").
    const cardRead = req.method === 'GET' && /^\/v1\/issuing\/cards\/[^/]+$/.test(fullPath(req));
    if (!cardRead) {
      sendError(res, new StripeApiError(403, 'invalid_request_error', 'An ephemeral key can only retrieve the Issuing card it was created for.', 'ephemeral_key_scope'));
      return;
    }
    locals(res).ephemeralKey = key;
    return next();
  }
  if (!/^(sk|rk)_test_\S+$/.test(key)) {
    const masked = key.length > 8 ? `${key.slice(0, 8)}${'*'.repeat(Math.min(key.length - 8, 12))}` : '****';
    sendError(res, new StripeApiError(401, 'invalid_request_error', `Invalid API Key provided: ${masked}`, 'api_key_invalid'));
    return;
  }
  next();
};

/** Stripe's v1 API takes form bodies; a JSON body would silently lose every parameter, so it is refused. */
export const requireFormBody: RequestHandler = (req, res, next) => {
  if (req.method === 'POST' && req.is('application/json')) {
    sendError(
      res,
      new StripeApiError(400, 'invalid_request_error', 'Send parameters as application/x-www-form-urlencoded, as the Stripe v1 API expects.'),
    );
    return;
  }
  next();
};

/** Applies `before` faults here; `after` faults are remembered for the endpoint runner. */
export function faultsBefore(faults: ApiFaults, holds: Holds): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => {
    const fault = faults.take(req.method, fullPath(req));
    if (!fault) return next();
    if (fault.phase === 'after') {
      locals(res).fault = fault;
      return next();
    }
    if (fault.kind === 'drop') {
      req.socket.destroy();
      return;
    }
    if (fault.kind === 'error500') {
      sendError(res, internalError());
      return;
    }
    void holds.wait(fault.holdMs).then((elapsed) => {
      if (elapsed) next();
    });
  };
}

export const unknownRoute: RequestHandler = (req, res) => {
  sendError(
    res,
    new StripeApiError(404, 'invalid_request_error', `Unrecognized request URL (${req.method}: ${fullPath(req)}).`),
  );
};

/** Body-parser failures and anything unexpected still answer in Stripe's error shape. */
export const apiErrorHandler: ErrorRequestHandler = (error: unknown, _req, res, _next) => {
  void _next;
  if (error instanceof StripeApiError) return sendError(res, error);
  const status = (error as { status?: number }).status;
  if (status === 413) {
    return sendError(res, new StripeApiError(413, 'invalid_request_error', 'Request body too large.'));
  }
  if (status && status >= 400 && status < 500) {
    return sendError(res, new StripeApiError(400, 'invalid_request_error', `Could not read the request body: ${(error as Error).message}`));
  }
  console.error('payments-fake: unexpected error', error);
  sendError(res, internalError());
};
