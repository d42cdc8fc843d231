// An in-process nudge: whoever changes the outbox after a commit can wake the workers instead of waiting a poll.
type Listener = () => void;

const listeners = new Set<Listener>();

/** Returns the unsubscribe function. */
export function onOutboxWork(listener: Listener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Call after the transaction that wrote outbox rows has committed; before that the rows are invisible. */
export function notifyOutbox(): void {
  for (const listener of listeners) listener();
}
