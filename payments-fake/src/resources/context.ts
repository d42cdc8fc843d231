import type { FakeStore } from '../store/store.js';
import type { EventLog } from './eventLog.js';
import type { OperationInput } from '../http/types.js';
import type { EventOrigin } from './eventLog.js';

/** What resource endpoints share: state, the event log and the clock. */
export interface ResourceDeps {
  store: FakeStore;
  events: EventLog;
  now: () => number;
}

export function nowSeconds(deps: ResourceDeps): number {
  return Math.floor(deps.now() / 1000);
}

export function originOf(input: OperationInput): EventOrigin {
  return { requestId: input.requestId, idempotencyKey: input.idempotencyKey, apiVersion: input.apiVersion };
}
