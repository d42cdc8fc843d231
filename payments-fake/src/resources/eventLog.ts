import { ID_PREFIX, newId } from '../ids.js';
import type { FakeStore } from '../store/store.js';
import type { EventObject } from '../store/types.js';
import type { WebhookDispatcher } from '../webhooks/dispatcher.js';

export interface EventOrigin {
  requestId: string | null;
  idempotencyKey: string | null;
  apiVersion: string | null;
}

/** Records Stripe events (with a snapshot of the object at that moment) and hands them to the webhook dispatcher. */
export class EventLog {
  constructor(
    private readonly store: FakeStore,
    private readonly dispatcher: WebhookDispatcher,
    private readonly now: () => number,
    private readonly defaultApiVersion: string,
  ) {}

  emit(type: string, object: unknown, origin: EventOrigin, previousAttributes?: Record<string, unknown>): EventObject {
    return this.store.mutate((state) => {
      const event: EventObject = {
        id: newId(ID_PREFIX.event),
        object: 'event',
        api_version: origin.apiVersion ?? this.defaultApiVersion,
        created: Math.floor(this.now() / 1000),
        data: previousAttributes
          ? { object: structuredClone(object), previous_attributes: structuredClone(previousAttributes) }
          : { object: structuredClone(object) },
        livemode: false,
        pending_webhooks: 0,
        request: { id: origin.requestId, idempotency_key: origin.idempotencyKey },
        type,
      };
      state.events.set(event.id, event);
      this.dispatcher.enqueue(event);
      return event;
    });
  }
}
