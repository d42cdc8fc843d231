// The transaction's life is driven by hand here, as TypeORM's query runner reports it (depth already moved when the
// after-commit and after-rollback events fire); tests/api/effects-after-commit.test.ts runs the same on MariaDB.
import { describe, expect, it } from 'vitest';
import type { DataSource, EntityManager, EntitySubscriberInterface, QueryRunner } from 'typeorm';
import { domainEventsOf, recordEffect } from './after-commit';
import { flightChanged, mailQueued, type DomainEvent } from './domain-events';

function fakeDataSource() {
  const db = { isInitialized: true, subscribers: [] as EntitySubscriberInterface[] } as unknown as DataSource;
  const qr = { dataSource: db, isTransactionActive: false, transactionDepth: 0 } as unknown as QueryRunner & { transactionDepth: number; isTransactionActive: boolean };
  const em = { dataSource: db, queryRunner: qr } as unknown as EntityManager;
  const seen: DomainEvent[] = [];
  const events = domainEventsOf(db);
  events.subscribe('flight-changed', (e) => void seen.push(e));
  events.subscribe('mail-queued', (e) => void seen.push(e));
  const subscriber = () => db.subscribers[0];
  const tx = {
    start() {
      qr.isTransactionActive = true;
      qr.transactionDepth++;
    },
    commit() {
      qr.transactionDepth--;
      if (qr.transactionDepth === 0) qr.isTransactionActive = false;
      void subscriber().afterTransactionCommit?.({ queryRunner: qr } as never);
    },
    rollback() {
      qr.transactionDepth--;
      if (qr.transactionDepth === 0) qr.isTransactionActive = false;
      void subscriber().afterTransactionRollback?.({ queryRunner: qr } as never);
    },
  };
  return { db, em, seen, tx };
}

describe('effects recorded in a transaction', () => {
  it('are dispatched after the commit, in the order recorded, and not before', () => {
    const { em, seen, tx } = fakeDataSource();
    tx.start();
    recordEffect(em, flightChanged(1, 9, ['rounds']));
    recordEffect(em, mailQueued(), flightChanged(2, 9, ['counts']));
    expect(seen).toEqual([]);
    tx.commit();
    expect(seen).toEqual([flightChanged(1, 9, ['rounds']), mailQueued(), flightChanged(2, 9, ['counts'])]);
  });

  it('are dropped on rollback, and the next transaction starts clean', () => {
    const { em, seen, tx } = fakeDataSource();
    tx.start();
    recordEffect(em, mailQueued());
    tx.rollback();
    expect(seen).toEqual([]);
    tx.start();
    recordEffect(em, flightChanged(3, 9, ['care']));
    tx.commit();
    expect(seen).toEqual([flightChanged(3, 9, ['care'])]);
  });

  it('of a savepoint that rolls back are dropped; of one released wait for the outer commit', () => {
    const { em, seen, tx } = fakeDataSource();
    tx.start();
    recordEffect(em, flightChanged(1, 9, ['a']));
    tx.start();
    recordEffect(em, flightChanged(2, 9, ['undone']));
    tx.rollback();
    tx.start();
    recordEffect(em, flightChanged(3, 9, ['kept']));
    tx.commit();
    expect(seen).toEqual([]);
    tx.commit();
    expect(seen.map((e) => (e.type === 'flight-changed' ? e.topics[0] : e.type))).toEqual(['a', 'kept']);
  });

  it('merge into one notice per flight and one wake-up per commit', () => {
    const { em, seen, tx } = fakeDataSource();
    tx.start();
    recordEffect(em, flightChanged(1, 9, ['rounds']), mailQueued(), flightChanged(2, 9, ['counts']));
    recordEffect(em, flightChanged(1, 9, ['approvals', 'rounds']), mailQueued());
    tx.commit();
    expect(seen).toEqual([flightChanged(1, 9, ['rounds', 'approvals']), mailQueued(), flightChanged(2, 9, ['counts'])]);
  });

  it('outside any transaction go at once, the write having committed already', () => {
    const { em, seen } = fakeDataSource();
    recordEffect(em, mailQueued());
    expect(seen).toEqual([mailQueued()]);
  });
});
