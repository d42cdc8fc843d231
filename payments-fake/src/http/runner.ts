import type { Request, RequestHandler, Response } from 'express';
import type { FakeStore } from '../store/store.js';
import type { Holds } from '../faults/holds.js';
import { canonicalJson, parseForm, type FormObject } from './formParser.js';
import { internalError, StripeApiError } from './errors.js';
import type { IdempotencyLayer } from './idempotency.js';
import { fullPath, locals, sendError, sendJson } from './pipeline.js';
import type { ApiResult, Operation, OperationInput } from './types.js';

export interface RunnerDeps {
  store: FakeStore;
  idempotency: IdempotencyLayer;
  holds: Holds;
}

interface Outcome {
  status: number;
  bodyText: string;
  /** Stripe saves a key's result once the endpoint has started executing; validation failures are not saved. */
  saveable: boolean;
}

function execute(operation: Operation, input: OperationInput): Outcome {
  try {
    const result: ApiResult = operation(input);
    return { status: result.status, bodyText: JSON.stringify(result.body, null, 2), saveable: true };
  } catch (error) {
    if (error instanceof StripeApiError) {
      const saveable = error.type !== 'invalid_request_error';
      return { status: error.status, bodyText: JSON.stringify(error.toBody(), null, 2), saveable };
    }
    console.error('payments-fake: endpoint failed', error);
    return { status: 500, bodyText: JSON.stringify(internalError().toBody(), null, 2), saveable: true };
  }
}

function readParams(req: Request): FormObject {
  if (req.method === 'POST') return parseForm(typeof req.body === 'string' ? req.body : '');
  const queryStart = req.originalUrl.indexOf('?');
  return parseForm(queryStart === -1 ? '' : req.originalUrl.slice(queryStart + 1));
}

/** Applies an `after` fault (the endpoint already ran) or sends the response normally. */
async function deliver(req: Request, res: Response, outcome: Outcome, holds: Holds): Promise<void> {
  const fault = locals(res).fault;
  if (fault?.kind === 'drop') {
    req.socket.destroy();
    return;
  }
  if (fault?.kind === 'error500') {
    sendError(res, internalError());
    return;
  }
  if (fault?.kind === 'timeout' && !(await holds.wait(fault.holdMs))) return;
  sendJson(res, outcome.status, outcome.bodyText);
}

/**
 * Wraps an endpoint with Stripe's request handling: parameter decoding, idempotency for POSTs
 * (replay with `Idempotent-Replayed: true`), one persisted store change per request, then fault injection.
 */
export function endpoint(operation: Operation, deps: RunnerDeps): RequestHandler {
  return async (req, res) => {
    const context = locals(res);
    const path = fullPath(req);
    let params: FormObject;
    try {
      params = readParams(req);
    } catch (error) {
      if (error instanceof StripeApiError) return sendError(res, error);
      throw error;
    }
    const key = req.method === 'POST' ? (req.get('idempotency-key') ?? null) : null;
    const input: OperationInput = {
      params,
      pathParams: req.params as Record<string, string>,
      requestId: context.requestId,
      idempotencyKey: key,
      apiVersion: context.apiVersion,
      ephemeralKey: context.ephemeralKey,
    };

    if (req.method !== 'POST') {
      return deliver(req, res, execute(operation, input), deps.holds);
    }
    if (key === null) {
      return deliver(req, res, deps.store.mutate(() => execute(operation, input)), deps.holds);
    }

    res.set('Idempotency-Key', key);
    const decision = deps.idempotency.begin(key, req.method, path, canonicalJson(params));
    if (decision.kind === 'rejected') return sendError(res, decision.error);
    if (decision.kind === 'replay') {
      // Header names as Stripe sends them on a replay (from memory): Idempotent-Replayed and Original-Request.
      res.set('Idempotent-Replayed', 'true');
      res.set('Original-Request', decision.record.requestId);
      const { status, body } = decision.record;
      return deliver(req, res, { status, bodyText: body, saveable: false }, deps.holds);
    }
    const outcome = deps.store.mutate(() => {
      const result = execute(operation, input);
      if (result.saveable) {
        deps.idempotency.save({
          key,
          method: req.method,
          path,
          fingerprint: canonicalJson(params),
          status: result.status,
          body: result.bodyText,
          requestId: context.requestId,
        });
      }
      return result;
    });
    return deliver(req, res, outcome, deps.holds);
  };
}
