// Reconciliation runs: each medium is compared with its own record. Cards (prepaid cards and the restricted cards of
// travel credits) with the provider's cards and their transactions; bank transfers with the provider's outbound
// payments; cash and cheques with the counter's drawer and cheque register. The provider's lists are read page by
// page (limit / starting_after / has_more, as Stripe's list API pages). A travel credit's unspent value is shown as
// outstanding. A run works in the background and reports its progress; runs and their differences are kept, and
// each difference is resolved with a note.
import type { DataSource } from 'typeorm';
import { MEDIA, type Medium } from '@shared/compensation/media';
import type { SessionUser } from '@shared/schemas/auth';
import type { ReconciliationDifference, ReconciliationRun } from '@shared/schemas/finance';
import { ReconciliationDifferenceEntity, ReconciliationRunEntity, StationEntity } from '../../db/entities';
import { conflict, notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { readFailureReason, type CardSnapshot, type Page, type PaymentsReader } from '../payments/reader';
import { audit } from '../audit/audit.service';
import { compareCounter, type CounterLedgerEntry, type CounterRecord } from './reconcile-counter';
import { summariseByMedium } from './reconcile-summary';
import { compareTransfers, transfersInScope, type TransferLedgerEntry } from './reconcile-transfers';
import { compareLedgerWithProvider, type Difference, type LedgerEntry } from './reconciliation-compare';

const PAGE_SIZE = 100;
/** A bound on any run: a million cards, far beyond one carrier's compensations (common practice: loops that end). */
const MAX_PAGES = 10_000;
/** A run whose heartbeat is older belongs to a process that stopped. */
export const STALE_RUN_MS = 5 * 60_000;

export interface ReconciliationDeps {
  db: DataSource;
  reader: PaymentsReader;
  log: (line: string) => void;
}

export interface ReconciliationRunner {
  start(user: SessionUser, stationIds: number[]): Promise<ReconciliationRunEntity>;
  /** Runs still working in this process. */
  idle(): Promise<void>;
}

async function readAll<T>(fetchPage: (after: string | null) => Promise<Page<T>>, onPage: (count: number) => Promise<void>): Promise<T[]> {
  const items: T[] = [];
  let after: string | null = null;
  for (let page = 0; page < MAX_PAGES; page += 1) {
    const result = await fetchPage(after);
    items.push(...result.items);
    await onPage(result.items.length);
    if (!result.hasMore || !result.lastId) return items;
    after = result.lastId;
  }
  throw new Error(`stopped after ${MAX_PAGES} pages; the provider kept answering has_more`);
}

const CARD_MEDIA: readonly Medium[] = ['prepaid-card', 'travel-credit'];
const COUNTER_MEDIA: readonly Medium[] = ['cash', 'cheque'];

interface LedgerRow { id: number; station_id: number; state: string; medium: Medium; amount_minor: number; credit_value_minor: number | null; currency: string; provider_card_id: string | null; provider_payment_id: string | null }

async function ledgerOf(db: DataSource, stationIds: number[]): Promise<LedgerRow[]> {
  // The current attempt's payout names the transfer the ledger expects (an earlier attempt's may have failed).
  return db.query(
    `SELECT c.id, c.station_id, c.state, c.medium, c.amount_minor, c.credit_value_minor, c.currency, c.provider_card_id, p.provider_payment_id
       FROM compensations c LEFT JOIN payouts p ON p.compensation_id = c.id AND p.attempt_key = c.idempotency_key
      WHERE c.station_id IN (?)`,
    [stationIds],
  );
}

async function counterRecordsOf(db: DataSource, stationIds: number[]): Promise<CounterRecord[]> {
  const rows: { compensation_id: number; medium: 'cash' | 'cheque'; drawer_id: string | null; cheque_number: string | null; amount_minor: number; currency: string }[] = await db.query(
    'SELECT compensation_id, medium, drawer_id, cheque_number, amount_minor, currency FROM counter_payments WHERE station_id IN (?)',
    [stationIds],
  );
  return rows.map((r) => ({ compensationId: r.compensation_id, medium: r.medium, drawerId: r.drawer_id, chequeNumber: r.cheque_number, amountMinor: r.amount_minor, currency: r.currency }));
}

/** Compensation ids the provider's records name that exist, but at other stations: not this run's business. */
async function existingElsewhere(db: DataSource, named: number[]): Promise<Set<number>> {
  if (!named.length) return new Set();
  return new Set((await db.query('SELECT id FROM compensations WHERE id IN (?)', [named])).map((r: { id: number }) => r.id));
}

export function createReconciliationRunner(deps: ReconciliationDeps): ReconciliationRunner {
  const running = new Set<Promise<void>>();

  async function execute(run: ReconciliationRunEntity): Promise<void> {
    const repo = deps.db.getRepository(ReconciliationRunEntity);
    let pages = 0;
    let cardsSeen = 0;
    // Each page moves the run's progress (and its heartbeat), so a long run shows how far it got.
    const pageRead = (newCards: number) => {
      pages += 1;
      cardsSeen += newCards;
      return repo.update({ id: run.id }, { pagesRead: pages, cardsSeen }).then(() => undefined);
    };
    const cards = await readAll<CardSnapshot>((after) => deps.reader.listCards(after, PAGE_SIZE), (n) => pageRead(n));
    const transactions = await readAll((after) => deps.reader.listCardTransactions(after, PAGE_SIZE), () => pageRead(0));
    const payments = await readAll((after) => deps.reader.listTransfers(after, PAGE_SIZE), () => pageRead(0));
    const spentByCard = new Map<string, number>();
    for (const t of transactions) spentByCard.set(t.cardId, (spentByCard.get(t.cardId) ?? 0) + t.spentMinor);

    const rows = await ledgerOf(deps.db, run.stationIds);
    const stationIds = new Set(run.stationIds);
    const rowIds = new Set(rows.map((r) => r.id));
    const named = [...cards.map((c) => c.compensationId), ...payments.map((p) => p.compensationId)].filter((id): id is number => id !== null && !rowIds.has(id));
    const elsewhere = await existingElsewhere(deps.db, [...new Set(named)]);

    const cardLedger: LedgerEntry[] = rows.filter((r) => CARD_MEDIA.includes(r.medium)).map((r) => ({
      id: r.id, stationId: r.station_id, state: r.state, medium: r.medium, currency: r.currency, providerCardId: r.provider_card_id,
      // A travel credit's card holds the credit's value, which may be more than the money given up.
      amountMinor: r.medium === 'travel-credit' ? (r.credit_value_minor ?? r.amount_minor) : r.amount_minor,
    }));
    const transferLedger: TransferLedgerEntry[] = rows.filter((r) => r.medium === 'bank-transfer').map((r) => ({
      id: r.id, stationId: r.station_id, state: r.state, amountMinor: r.amount_minor, currency: r.currency, providerPaymentId: r.provider_payment_id,
    }));
    const counterLedger: CounterLedgerEntry[] = rows.filter((r) => COUNTER_MEDIA.includes(r.medium)).map((r) => ({ id: r.id, state: r.state, medium: r.medium, amountMinor: r.amount_minor, currency: r.currency }));
    const records = await counterRecordsOf(deps.db, run.stationIds);
    const counterIds = new Set(counterLedger.map((l) => l.id));
    const others = new Map(rows.filter((r) => !counterIds.has(r.id) && records.some((c) => c.compensationId === r.id)).map((r) => [r.id, { id: r.id, state: r.state, medium: r.medium, amountMinor: r.amount_minor, currency: r.currency }]));

    const cardInput = { ledger: cardLedger, cards, spentByCard, stationIds, elsewhere };
    const transferInput = { ledger: transferLedger, payments, stationIds, elsewhere };
    const differences: Difference[] = [
      ...compareLedgerWithProvider(cardInput),
      ...compareTransfers(transferInput),
      ...compareCounter({ ledger: counterLedger, records, others }),
    ];
    const byMedium = summariseByMedium({ rows, cardInput, transfers: transfersInScope(transferInput), records, differences });

    await deps.db.transaction(async (em) => {
      for (let i = 0; i < differences.length; i += 500) {
        await em.insert(ReconciliationDifferenceEntity, differences.slice(i, i + 500).map((d) => ({ ...d, runId: run.id })));
      }
      await em.update(ReconciliationRunEntity, { id: run.id }, { status: 'completed', finishedAt: new Date(), ledgerRows: rows.length, differencesFound: differences.length, cardsSeen, byMedium });
    });
  }

  return {
    async start(user, stationIds) {
      const run = await deps.db.transaction(async (em) => {
        // Serialises starts: two finance users pressing the button at once get one run.
        await em.query('SELECT id FROM stations WHERE id IN (?) FOR UPDATE', [stationIds]);
        const open = await em.getRepository(ReconciliationRunEntity).find({ where: { status: 'running' } });
        const clash = open.find((r) => Date.now() - r.heartbeatAt.getTime() < STALE_RUN_MS && r.stationIds.some((id) => stationIds.includes(id)));
        if (clash) throw conflict('reconciliation_running', `Reconciliation run ${clash.id} is still comparing these stations; wait for it to finish.`);
        const saved = await em.save(em.create(ReconciliationRunEntity, { status: 'running', stationIds, startedByUserId: user.id, startedByLabel: user.email, finishedAt: null, error: null }));
        await audit(em, { actor: user, action: 'reconciliation.started', entityType: 'reconciliation_run', entityId: saved.id, after: { stationIds } });
        return saved;
      });
      const work = execute(run)
        .catch(async (error: unknown) => {
          const reason = readFailureReason(error, 'reading the provider');
          deps.log(`[finance] reconciliation ${run.id} failed: ${reason}`);
          await deps.db.getRepository(ReconciliationRunEntity).update({ id: run.id }, { status: 'failed', error: reason.slice(0, 500), finishedAt: new Date() }).catch(() => undefined);
        })
        .finally(() => running.delete(work));
      running.add(work);
      return run;
    },
    async idle() {
      await Promise.allSettled([...running]);
    },
  };
}

/** At start-up: runs left 'running' by a process that is gone are marked interrupted, never left hanging. */
export async function markInterruptedRuns(db: DataSource): Promise<void> {
  await db.query(
    `UPDATE reconciliation_runs SET status = 'interrupted', finished_at = CURRENT_TIMESTAMP(3), error = 'The server stopped during the run; start a new one.'
      WHERE status = 'running' AND heartbeat_at < CURRENT_TIMESTAMP(3) - INTERVAL ? MICROSECOND`,
    [STALE_RUN_MS * 1000],
  );
}

function visible(user: SessionUser, run: ReconciliationRunEntity): boolean {
  return run.stationIds.every((id) => canSeeStation(user, id));
}

export async function presentRuns(db: DataSource, runs: ReconciliationRunEntity[]): Promise<ReconciliationRun[]> {
  const stations = await db.getRepository(StationEntity).find();
  const iata = new Map(stations.map((s) => [s.id, s.iata]));
  const unresolved: { run_id: number; n: string | number }[] = runs.length
    ? await db.query('SELECT run_id, COUNT(*) AS n FROM reconciliation_differences WHERE run_id IN (?) AND resolved_at IS NULL GROUP BY run_id', [runs.map((r) => r.id)])
    : [];
  const open = new Map(unresolved.map((u) => [u.run_id, Number(u.n)]));
  return runs.map((r) => ({
    id: r.id, status: r.status, stationIds: r.stationIds, stations: r.stationIds.map((id) => iata.get(id) ?? String(id)), startedBy: r.startedByLabel,
    startedAt: r.startedAt.toISOString(), finishedAt: r.finishedAt?.toISOString() ?? null, pagesRead: r.pagesRead, cardsSeen: r.cardsSeen,
    ledgerRows: r.ledgerRows, differences: r.differencesFound, unresolved: open.get(r.id) ?? 0, error: r.error,
    byMedium: [...(r.byMedium ?? [])].sort((a, b) => MEDIA.indexOf(a.medium) - MEDIA.indexOf(b.medium)),
  }));
}

export async function listRuns(db: DataSource, user: SessionUser): Promise<ReconciliationRun[]> {
  const runs = await db.getRepository(ReconciliationRunEntity).find({ order: { id: 'DESC' }, take: 200 });
  return presentRuns(db, runs.filter((r) => visible(user, r)).slice(0, 50));
}

export async function runForUser(db: DataSource, user: SessionUser, id: number): Promise<ReconciliationRunEntity> {
  const run = await db.getRepository(ReconciliationRunEntity).findOneBy({ id });
  if (!run || !visible(user, run)) throw notFound('Reconciliation run');
  return run;
}

function presentDifference(d: ReconciliationDifferenceEntity): ReconciliationDifference {
  return {
    id: d.id, kind: d.kind as ReconciliationDifference['kind'], medium: d.medium, compensationId: d.compensationId, cardId: d.cardId, ledgerValue: d.ledgerValue,
    providerValue: d.providerValue, resolvedAt: d.resolvedAt?.toISOString() ?? null, resolvedBy: d.resolvedByLabel, note: d.note,
  };
}

export async function runDetail(db: DataSource, user: SessionUser, id: number) {
  const run = await runForUser(db, user, id);
  const differences = await db.getRepository(ReconciliationDifferenceEntity).find({ where: { runId: run.id }, order: { id: 'ASC' }, take: 5_000 });
  const [present] = await presentRuns(db, [run]);
  return { run: present, differences: differences.map(presentDifference) };
}

export async function resolveDifference(db: DataSource, user: SessionUser, runId: number, differenceId: number, note: string): Promise<ReconciliationDifference> {
  const run = await runForUser(db, user, runId);
  return db.transaction(async (em) => {
    const diff = await em.findOne(ReconciliationDifferenceEntity, { where: { id: differenceId, runId: run.id }, lock: { mode: 'pessimistic_write' } });
    if (!diff) throw notFound('Difference');
    if (diff.resolvedAt) throw conflict('already_resolved', `Already resolved by ${diff.resolvedByLabel ?? 'someone'}: ${diff.note ?? ''}`);
    Object.assign(diff, { resolvedAt: new Date(), resolvedByUserId: user.id, resolvedByLabel: user.email, note });
    await em.save(diff);
    await audit(em, { actor: user, action: 'reconciliation.difference_resolved', entityType: 'reconciliation_difference', entityId: diff.id, after: { runId: run.id, kind: diff.kind, compensationId: diff.compensationId, note } });
    return presentDifference(diff);
  });
}
