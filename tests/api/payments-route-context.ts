// What the route × role matrix needs for the payments and finance routes: compensations in the state each call
// expects (one call per route succeeds, so one object each is enough), a reconciliation run with a difference, and
// the same for another station. A payments stand-in runs in-process for the routes that reach the provider, so the
// matrix never leaves the loopback interface.
import type { DataSource } from 'typeorm';
import { addSingles } from './denials-fixtures';
import { ReconciliationDifferenceEntity, ReconciliationRunEntity, StationEntity, type FlightEntity } from '../../server/src/db/entities';
import { insertCompensations, removeFlights, seedFlight, startFake, type RunningFake } from './payments-harness';
import { removeCompensations } from '../cleanup/compensations';

export interface PaymentsRouteContext {
  /** Already issued: asking again answers 200 without calling the provider. */
  issuedId: number;
  /** Due, open for a voucher offer (repeat offers are allowed). */
  dueId: number;
  /** Due, with a voucher offer made; the counter payment settles it (repeats answer the same). */
  offeredId: number;
  offeredAmountMinor: number;
  voidableId: number;
  /** Failed ones, one for each re-issue call (an agent's and finance's both succeed). */
  failedIds: number[];
  /** A flight with J and Y cabins whose J passengers can each be moved to Y once. */
  cabinFlightId: number;
  cabinPassengerIds: number[];
  /** An open alert of the own station, and one of the other station. */
  alertId: number;
  runId: number;
  differenceId: number;
  other: { compensationId: number; runId: number; differenceId: number; alertId: number };
}

let made: { flightIds: number[]; runIds: number[]; compensationIds: number[]; stationId: number; since: Date } = { flightIds: [], runIds: [], compensationIds: [], stationId: 0, since: new Date() };
let standIn: RunningFake | null = null;

/** Call before the app is built: the app reads STRIPE_API_URL from the environment. */
export async function startMatrixPaymentsStandIn(): Promise<void> {
  standIn = await startFake();
  process.env.STRIPE_API_URL = standIn.url;
}

async function runWithDifference(db: DataSource, stationId: number, compensationId: number) {
  const run = await db.getRepository(ReconciliationRunEntity).save({ status: 'completed', stationIds: [stationId], startedByUserId: null, startedByLabel: 'route matrix', finishedAt: new Date(), differencesFound: 1, error: null });
  const diff = await db.getRepository(ReconciliationDifferenceEntity).save({ runId: run.id, kind: 'amount-differs', compensationId, cardId: null, ledgerValue: 'USD 1.00', providerValue: 'USD 2.00' });
  made.runIds.push(run.id);
  return { runId: run.id, differenceId: diff.id };
}

export async function paymentsRouteContext(db: DataSource, opts: { ownStationId: number; otherFlight: FlightEntity }): Promise<PaymentsRouteContext> {
  made = { flightIds: [], runIds: [], compensationIds: [], stationId: opts.ownStationId, since: new Date() };
  const bos = await db.getRepository(StationEntity).findOneByOrFail({ id: opts.ownStationId });
  const { flight, passengers } = await seedFlight(db, bos, { passengers: 12, serviceDate: '2026-12-01' });
  made.flightIds.push(flight.id);
  const states = ['issued', 'due', 'due', 'due', ...Array<'failed'>(8).fill('failed')] as const;
  const rows = await insertCompensations(db, flight, passengers, (i) => ({
    state: states[i],
    idempotencyKey: states[i] === 'due' ? null : `comp-matrix-${flight.id}-${i}`,
    providerCardId: states[i] === 'issued' ? `ic_matrix_${flight.id}` : null,
    lastError: states[i] === 'failed' ? 'route matrix: refused' : null,
  }));
  await db.query(
    `INSERT INTO voucher_offers (compensation_id, cash_amount_minor, currency, restrictions, text, sent_to, offered_by_user_id, offered_at)
     VALUES (?, ?, ?, ?, ?, NULL, (SELECT id FROM users WHERE email = 'agent@bumpboard.test'), NOW(3))`,
    [rows[2].id, rows[2].amountMinor, rows[2].currency, '[]', 'Route matrix offer'],
  );
  // A real passenger on the other station's flight: the keys refuse a compensation for nobody.
  const [otherParty] = await addSingles(db, opts.otherFlight, 1);
  const [other] = await insertCompensations(db, opts.otherFlight, otherParty.passengers, () => ({ stationId: opts.otherFlight.stationId, currency: 'NOK', regime: 'eu-261' }));
  made.compensationIds.push(other.id);
  const own = await runWithDifference(db, bos.id, rows[0].id);
  const otherRun = await runWithDifference(db, opts.otherFlight.stationId, other.id);
  const alert = async (stationId: number, compensationId: number) =>
    (await db.query("INSERT INTO alerts (station_id, compensation_id, kind, message, dedupe_key) VALUES (?, ?, 'payment-failed', 'Route matrix alert', ?)", [stationId, compensationId, `matrix:${compensationId}:${Date.now()}`])).insertId as number;
  const cabin = await seedFlight(db, bos, { passengers: 8, serviceDate: '2026-12-02' });
  made.flightIds.push(cabin.flight.id);
  await db.query(`UPDATE flights SET seats_by_cabin = '{"J": 16, "Y": 150}' WHERE id = ?`, [cabin.flight.id]);
  await db.query(`UPDATE passengers SET cabin = 'J' WHERE flight_id = ?`, [cabin.flight.id]);
  return {
    cabinFlightId: cabin.flight.id, cabinPassengerIds: cabin.passengers.map((p) => p.id),
    issuedId: rows[0].id, dueId: rows[1].id, offeredId: rows[2].id, offeredAmountMinor: rows[2].amountMinor, voidableId: rows[3].id, failedIds: rows.slice(4).map((r) => r.id),
    alertId: await alert(bos.id, rows[4].id),
    runId: own.runId, differenceId: own.differenceId,
    other: { compensationId: other.id, runId: otherRun.runId, differenceId: otherRun.differenceId, alertId: await alert(opts.otherFlight.stationId, other.id) },
  };
}

export async function removePaymentsRouteFixtures(db: DataSource): Promise<void> {
  await db.query("DELETE FROM alerts WHERE message = 'Route matrix alert' OR compensation_id IN (SELECT id FROM compensations WHERE flight_id IN (?))", [made.flightIds.length ? made.flightIds : [0]]);
  await db.query('DELETE FROM cabin_changes WHERE flight_id IN (?)', [made.flightIds.length ? made.flightIds : [0]]);
  await removeFlights(db, made.flightIds);
  await removeCompensations((sql, params) => db.query(sql, params), made.compensationIds);
  // The runs made here, and the one the matrix itself started at the own station.
  await db.query(
    "DELETE FROM reconciliation_runs WHERE id IN (?) OR (started_by_label = 'finance@bumpboard.test' AND started_at >= ? AND JSON_CONTAINS(station_ids, ?))",
    [made.runIds.length ? made.runIds : [0], made.since, String(made.stationId)],
  );
  await standIn?.stop();
  standIn = null;
}
