// The one way after-commit effects leave a change: subscribers register per event type; dispatch hands each event,
// in the order recorded, to every subscriber of its type. A subscriber that throws (or rejects) is logged and skipped:
// the change has committed already, and the other subscribers and the request must not pay for one that failed.
import type { DomainEvent, DomainEventType, EventOfType } from './domain-events';

export type Subscriber<T extends DomainEventType> = (event: EventOfType<T>) => void | Promise<void>;

export interface EventDispatcher {
  /** Returns the unsubscribe function. */
  subscribe<T extends DomainEventType>(type: T, subscriber: Subscriber<T>): () => void;
  /** Only for changes that have committed (or that never were in a transaction). Never throws. */
  dispatch(events: readonly DomainEvent[]): void;
}

export function createEventDispatcher(log: (line: string) => void = (line) => console.error(line)): EventDispatcher {
  type AnySubscriber = (event: DomainEvent) => void | Promise<void>;
  const subscribers = new Map<DomainEventType, Set<AnySubscriber>>();
  const failed = (event: DomainEvent, err: unknown) => log(`[events] a subscriber of ${event.type} failed: ${err instanceof Error ? err.message : String(err)}`);

  return {
    subscribe(type, subscriber) {
      let set = subscribers.get(type);
      if (!set) subscribers.set(type, (set = new Set()));
      // Filed under its own type, so it is only ever handed events of that type.
      const entry = subscriber as unknown as AnySubscriber;
      set.add(entry);
      return () => void set.delete(entry);
    },
    dispatch(events) {
      for (const event of events) {
        for (const subscriber of [...(subscribers.get(event.type) ?? [])]) {
          try {
            const result = subscriber(event);
            if (result instanceof Promise) result.catch((err: unknown) => failed(event, err));
          } catch (err) {
            failed(event, err);
          }
        }
      }
    },
  };
}
