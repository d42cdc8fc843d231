// Effects recorded inside a transaction wait on that transaction's connection until it ends: dispatched when the
// outermost COMMIT has succeeded, dropped on ROLLBACK. A savepoint (a nested transaction) that rolls back drops only
// its own effects; one that is released hands them to the level around it. This hangs off TypeORM's transaction
// events, so every `db.transaction(...)` and every `em` passed down from one works, with no wrapper to forget.
import type { DataSource, EntityManager, EntitySubscriberInterface, QueryRunner } from 'typeorm';
import { coalesce, type DomainEvent } from './domain-events';
import { createEventDispatcher, type EventDispatcher } from './dispatcher';

/** Recorded effects per open transaction, one list per nesting level (index 0 = the outermost). */
const pending = new WeakMap<QueryRunner, DomainEvent[][]>();
const dispatchers = new WeakMap<DataSource, EventDispatcher>();
const installed = new WeakSet<DataSource>();

/** TypeORM keeps the nesting level protected; it is what tells a savepoint's end from the transaction's. */
const depthOf = (qr: QueryRunner) => (qr as unknown as { transactionDepth: number }).transactionDepth;

/** Closes the levels deeper than the one the connection is back at; returns what they held. */
function closeLevels(qr: QueryRunner): DomainEvent[] | null {
  const levels = pending.get(qr);
  if (!levels) return null;
  const depth = depthOf(qr);
  const closed = levels.splice(depth).flat();
  if (depth === 0) pending.delete(qr);
  return closed;
}

const transactionEffects: EntitySubscriberInterface = {
  afterTransactionCommit({ queryRunner }) {
    const closed = closeLevels(queryRunner);
    if (!closed?.length) return;
    const depth = depthOf(queryRunner);
    if (depth > 0) levelAt(queryRunner, depth).push(...closed);
    else domainEventsOf(queryRunner.dataSource).dispatch(coalesce(closed));
  },
  afterTransactionRollback({ queryRunner }) {
    closeLevels(queryRunner);
  },
};

function levelAt(qr: QueryRunner, depth: number): DomainEvent[] {
  let levels = pending.get(qr);
  if (!levels) pending.set(qr, (levels = []));
  while (levels.length < depth) levels.push([]);
  return levels[depth - 1];
}

/**
 * The data source's dispatcher: one per app (each test app has its own data source). Installing it also makes the
 * data source report its commits and rollbacks here; call it once the data source is initialized.
 */
export function domainEventsOf(db: DataSource): EventDispatcher {
  let dispatcher = dispatchers.get(db);
  if (!dispatcher) dispatchers.set(db, (dispatcher = createEventDispatcher()));
  if (!installed.has(db) && db.isInitialized) {
    // Initialization replaces the subscriber list, so this waits for it.
    db.subscribers.push(transactionEffects);
    installed.add(db);
  }
  return dispatcher;
}

/**
 * Records effects of the change `em` is making. Inside a transaction they wait for its commit; on an entity manager
 * outside any transaction the write has committed already, so they go at once.
 */
export function recordEffect(em: EntityManager, ...events: DomainEvent[]): void {
  const qr = em.queryRunner;
  const dispatcher = domainEventsOf(em.dataSource);
  if (!qr || !qr.isTransactionActive) {
    dispatcher.dispatch(events);
    return;
  }
  levelAt(qr, depthOf(qr)).push(...events);
}

/** For a change committed already (a recompute stored, a clock's finding): dispatched now, through the same subscribers. */
export function announceCommitted(db: DataSource, ...events: DomainEvent[]): void {
  domainEventsOf(db).dispatch(events);
}
