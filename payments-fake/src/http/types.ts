import type { FormObject } from './formParser.js';

/** What an endpoint produced: the HTTP status and the JSON body, before any injected fault alters delivery. */
export interface ApiResult {
  status: number;
  body: unknown;
}

/** Everything an endpoint needs from the request, already decoded. */
export interface OperationInput {
  params: FormObject;
  pathParams: Record<string, string>;
  requestId: string;
  idempotencyKey: string | null;
  apiVersion: string;
  /** Set when the request authenticated with an ephemeral key (`ek_test_…`) instead of a secret key. */
  ephemeralKey: string | null;
}

export type Operation = (input: OperationInput) => ApiResult;
