// Alerts for the station and finance. A lost payment (voided, canceled at the provider, refused) puts the passenger
// back to "owed": the alert is written in the same transaction as that change, once per payment attempt, and is
// resolved in the transaction that pays the passenger again.
import type { DataSource, EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { AlertKind, AlertQuery, AlertView } from '@shared/schemas/alerts';
import { AlertEntity, type CompensationEntity } from '../../db/entities';
import { notFound } from '../../http/errors';
import { canSeeStation } from '../../http/require-role';
import { audit } from '../audit/audit.service';
import { compensationRow, passengerNameOf } from '../payments/compensation-view';
import { moneyText } from '../finance/scope';

const WHAT: Record<AlertKind, string> = {
  'payment-voided': 'was voided by finance',
  'payment-canceled': 'was canceled by the payment provider',
  'payment-failed': 'was refused by the payment provider',
  'payment-due-soon': 'is due soon under the rule',
  'payment-overdue': 'is overdue under the rule',
};

/**
 * Raises the alert for a lost payment attempt of a compensation, inside the caller's transaction. The attempt is
 * named by the idempotency key it ran under, so the same loss seen twice (a webhook and finance's void of the same
 * card) raises one alert.
 */
export async function raisePaymentLost(em: EntityManager, row: CompensationEntity, kind: AlertKind, detail: string | null): Promise<void> {
  const view = await compensationRow(em, row.id);
  const attempt = row.idempotencyKey ?? 'never-issued';
  const message = `${view.carrier_code} ${view.flight_number} on ${view.service_date}: the payment of ${moneyText(row.amountMinor, row.currency)} to ${passengerNameOf(view)} ${WHAT[kind]}${detail ? ` (${detail})` : ''}. The passenger is owed it again; finance can re-issue it.`;
  // Finance's void cancels the card first, so the provider's webhook may record the same loss a moment earlier: the
  // void's words (with its reason) then replace the provider's, since finance, not the provider, ended the payment.
  await em.query(
    `INSERT INTO alerts (station_id, flight_id, compensation_id, kind, message, dedupe_key) VALUES (?, ?, ?, ?, ?, ?)
     ON DUPLICATE KEY UPDATE message = IF(VALUES(kind) = 'payment-voided', VALUES(message), message),
       kind = IF(VALUES(kind) = 'payment-voided', VALUES(kind), kind)`,
    [row.stationId, row.flightId, row.id, kind, message.slice(0, 400), `payment-lost:${row.id}:${attempt}`.slice(0, 160)],
  );
}

/** The passenger was paid again: every open alert of the compensation is resolved, in the caller's transaction. */
export async function resolvePaymentAlerts(em: EntityManager, compensationId: number, resolution: string): Promise<void> {
  await em.query('UPDATE alerts SET resolved_at = CURRENT_TIMESTAMP(3), resolution = ? WHERE compensation_id = ? AND resolved_at IS NULL', [resolution.slice(0, 200), compensationId]);
}

interface AlertRow {
  id: number;
  station_id: number;
  station_iata: string;
  flight_id: number | null;
  carrier_code: string | null;
  flight_number: string | null;
  service_date: string | null;
  compensation_id: number | null;
  first_name: string | null;
  last_name: string | null;
  kind: AlertKind;
  message: string;
  created_at: Date;
  resolved_at: Date | null;
  resolution: string | null;
  acknowledged_at: Date | null;
  acknowledged_by: string | null;
}

const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);

function present(r: AlertRow): AlertView {
  return {
    id: r.id, stationId: r.station_id, stationIata: r.station_iata, flightId: r.flight_id,
    flight: r.carrier_code ? `${r.carrier_code} ${r.flight_number}` : null, serviceDate: r.service_date,
    compensationId: r.compensation_id, passengerName: r.compensation_id ? passengerNameOf(r) : null,
    kind: r.kind, message: r.message, createdAt: iso(r.created_at)!, resolvedAt: iso(r.resolved_at), resolution: r.resolution,
    acknowledgedAt: iso(r.acknowledged_at), acknowledgedBy: r.acknowledged_by,
  };
}

const SELECT = `
  SELECT a.id, a.station_id, s.iata AS station_iata, a.flight_id, f.carrier_code, f.flight_number,
         DATE_FORMAT(f.service_date, '%Y-%m-%d') AS service_date, a.compensation_id, p.first_name, p.last_name,
         a.kind, a.message, a.created_at, a.resolved_at, a.resolution, a.acknowledged_at, u.email AS acknowledged_by
    FROM alerts a
    JOIN stations s ON s.id = a.station_id
    LEFT JOIN flights f ON f.id = a.flight_id
    LEFT JOIN compensations c ON c.id = a.compensation_id
    LEFT JOIN passengers p ON p.id = c.passenger_id
    LEFT JOIN users u ON u.id = a.acknowledged_by_user_id`;

/** The user's stations only (another station's id is "not found"); open alerts first, newest first. */
export async function listAlerts(db: DataSource, user: SessionUser, query: AlertQuery): Promise<AlertView[]> {
  if (query.stationId !== undefined && !canSeeStation(user, query.stationId)) throw notFound('Station');
  const stations = query.stationId !== undefined ? [query.stationId] : user.stations.map((s) => s.id);
  if (!stations.length) return [];
  const open = query.status === 'open' ? 'AND a.resolved_at IS NULL' : '';
  const rows: AlertRow[] = await db.query(`${SELECT} WHERE a.station_id IN (?) ${open} ORDER BY a.resolved_at IS NULL DESC, a.created_at DESC, a.id DESC LIMIT 200`, [stations]);
  return rows.map(present);
}

/** Someone has seen it and is on it; it stays listed until the passenger is paid. Audited. */
export async function acknowledgeAlert(db: DataSource, user: SessionUser, id: number): Promise<AlertView> {
  await db.transaction(async (em) => {
    const alert = await em.findOne(AlertEntity, { where: { id }, lock: { mode: 'pessimistic_write' } });
    if (!alert || !canSeeStation(user, alert.stationId)) throw notFound('Alert');
    if (alert.acknowledgedAt) return;
    await em.update(AlertEntity, { id }, { acknowledgedAt: new Date(), acknowledgedByUserId: user.id });
    await audit(em, { actor: user, action: 'alert.acknowledged', entityType: 'alert', entityId: id, stationId: alert.stationId, before: { acknowledgedAt: null }, after: { acknowledged: true } });
  });
  const [row]: AlertRow[] = await db.query(`${SELECT} WHERE a.id = ?`, [id]);
  return present(row);
}
