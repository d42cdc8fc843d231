// Watches each owed compensation against the deadline its rule set (due_by): an alert when it is due soon, another
// once it is overdue, one of each per compensation and deadline (the dedupe key), through the alerts table the station
// and finance already watch. Paying the passenger resolves them. The clock is injected, so tests move time by hand.
import type { DataSource } from 'typeorm';
import { DUE_SOON_MINUTES, formatMoney } from '@shared/compensation';
import { ALERT_TOPIC } from '@shared/events';
import { announceCommitted, stationChanged } from '../../events';

/** States in which the passenger still waits for the money. */
export const OWED_STATES = ['due', 'issuing', 'failed', 'voided', 'canceled'] as const;

interface Owed {
  id: number;
  station_id: number;
  flight_id: number;
  due_by: Date;
  amount_minor: number;
  currency: string;
  carrier_code: string;
  flight_number: string;
  first_name: string | null;
  last_name: string | null;
  due_rule_ref: string | null;
}

function message(row: Owed, overdue: boolean): string {
  const who = [row.first_name, row.last_name].filter(Boolean).join(' ') || 'a passenger';
  const when = new Date(row.due_by).toISOString().replace('.000Z', 'Z');
  const rule = row.due_rule_ref ? ` (${row.due_rule_ref})` : '';
  const head = `${row.carrier_code} ${row.flight_number}: ${formatMoney(row.amount_minor, row.currency)} to ${who}`;
  return (overdue ? `${head} was due by ${when} UTC and is not paid${rule}. Pay it now.` : `${head} is due by ${when} UTC${rule}. Pay it before then.`).slice(0, 400);
}

/**
 * One pass at `now`: raises what is due soon or overdue; returns how many alerts were new. The stations with a new
 * alert are told once each, after the rows are written (each insert commits on its own).
 */
export async function sweepPaymentDeadlines(db: DataSource, now: Date): Promise<number> {
  const stations = new Set<number>();
  const horizon = new Date(now.getTime() + DUE_SOON_MINUTES * 60_000);
  const rows: Owed[] = await db.query(
    `SELECT c.id, c.station_id, c.flight_id, c.due_by, c.amount_minor, c.currency, c.due_rule_ref, f.carrier_code, f.flight_number, p.first_name, p.last_name
       FROM compensations c JOIN flights f ON f.id = c.flight_id LEFT JOIN passengers p ON p.id = c.passenger_id
      WHERE c.state IN (?) AND c.due_by IS NOT NULL AND c.due_by <= ? AND c.amount_minor > 0`,
    [OWED_STATES, horizon],
  );
  let raised = 0;
  for (const row of rows) {
    const overdue = new Date(row.due_by).getTime() < now.getTime();
    const kind = overdue ? 'payment-overdue' : 'payment-due-soon';
    const key = `${kind}:${row.id}:${new Date(row.due_by).getTime()}`;
    const result = await db.query(
      'INSERT IGNORE INTO alerts (station_id, flight_id, compensation_id, kind, message, dedupe_key, created_at) VALUES (?, ?, ?, ?, ?, ?, ?)',
      [row.station_id, row.flight_id, row.id, kind, message(row, overdue), key, now],
    );
    const added = (result as { affectedRows: number }).affectedRows;
    if (added) stations.add(row.station_id);
    raised += added;
  }
  announceCommitted(db, ...[...stations].map((id) => stationChanged(id, [ALERT_TOPIC])));
  return raised;
}

/** Sweeps every minute; returns the stop function. */
export function watchPaymentDeadlines(db: DataSource, now: () => Date = () => new Date(), intervalMs = 60_000): () => void {
  const timer = setInterval(() => void sweepPaymentDeadlines(db, now()).catch(() => undefined), intervalMs);
  timer.unref();
  return () => clearInterval(timer);
}
