// Alerts for the station and finance. A lost payment (voided, canceled at the provider, refused) puts the passenger
// back to "owed": the alert is written in the same transaction as that change, once per payment attempt, and is
// resolved in the transaction that pays the passenger again. An alert about waiting work (work-alerts.ts) is open
// while its subject still waits: the list reads that from the subject itself.
import type { DataSource, EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { INFORMATIONAL_ALERT_KINDS, isPaymentAlert, PAYMENT_ALERT_KINDS, type AlertKind, type AlertQuery, type AlertView } from '@shared/schemas/alerts';
import { AlertEntity, type CompensationEntity } from '../../db/entities';
import { notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { recordEffect, stationChanged } from '../../events';
import { ALERT_TOPIC } from '@shared/events';
import { audit } from '../audit/audit.service';
import { compensationRow, passengerNameOf } from '../payments/compensation-view';
import { moneyText } from '../finance/scope';

type PaymentAlertKind = (typeof PAYMENT_ALERT_KINDS)[number];

const WHAT: Record<PaymentAlertKind, string> = {
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
export async function raisePaymentLost(em: EntityManager, row: CompensationEntity, kind: PaymentAlertKind, detail: string | null): Promise<void> {
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

/**
 * A work alert is resolved once its subject no longer waits: the volunteer's offer was answered, the amount decided
 * (or dropped with its round), the proposal authorized or withdrawn. A decided amount's own alert is not waiting
 * work: it stays until dismissed.
 */
const RESOLVED_AT = `CASE
    WHEN a.resolved_at IS NOT NULL THEN a.resolved_at
    WHEN a.volunteer_id IS NOT NULL AND v.status <> 'offered' THEN COALESCE(v.accepted_at, a.created_at)
    WHEN a.kind = 'approval-waiting' AND oa.status <> 'pending' THEN COALESCE(oa.decided_at, a.created_at)
    WHEN a.denial_proposal_id IS NOT NULL AND dp.status NOT IN ('proposed', 'changed') THEN COALESCE(dp.decided_at, a.created_at)
  END`;
const RESOLUTION = `CASE
    WHEN a.resolved_at IS NOT NULL THEN a.resolution
    WHEN a.volunteer_id IS NOT NULL AND v.status <> 'offered' THEN CONCAT('the offer was ', v.status)
    WHEN a.kind = 'approval-waiting' AND oa.status <> 'pending' THEN CONCAT('the amount was ', IF(oa.status = 'approved', 'approved', 'declined'))
    WHEN a.denial_proposal_id IS NOT NULL AND dp.status NOT IN ('proposed', 'changed') THEN CONCAT('the proposal was ', dp.status)
  END`;

const SELECT = `
  SELECT * FROM (
  SELECT a.id, a.station_id, s.iata AS station_iata, a.flight_id, f.carrier_code, f.flight_number,
         DATE_FORMAT(f.service_date, '%Y-%m-%d') AS service_date, a.compensation_id, p.first_name, p.last_name,
         a.kind, a.message, a.created_at, ${RESOLVED_AT} AS resolved_at, ${RESOLUTION} AS resolution, a.acknowledged_at, u.email AS acknowledged_by
    FROM alerts a
    JOIN stations s ON s.id = a.station_id
    LEFT JOIN flights f ON f.id = a.flight_id
    LEFT JOIN compensations c ON c.id = a.compensation_id
    LEFT JOIN passengers p ON p.id = c.passenger_id
    LEFT JOIN volunteers v ON v.id = a.volunteer_id
    LEFT JOIN offer_approvals oa ON oa.id = a.approval_id
    LEFT JOIN denial_proposals dp ON dp.id = a.denial_proposal_id
    LEFT JOIN users u ON u.id = a.acknowledged_by_user_id`;

/** The user's stations only (another station's id is "not found"); open alerts first, newest first. */
export async function listAlerts(db: DataSource, user: SessionUser, query: AlertQuery): Promise<AlertView[]> {
  if (query.stationId !== undefined && !canSeeStation(user, query.stationId)) throw notFound('Station');
  const stations = query.stationId !== undefined ? [query.stationId] : user.stations.map((s) => s.id);
  if (!stations.length) return [];
  const kinds = user.role === 'finance' ? 'AND a.kind IN (?)' : '';
  const open = query.status === 'open' ? 'WHERE x.resolved_at IS NULL' : '';
  const rows: AlertRow[] = await db.query(
    `${SELECT} WHERE a.station_id IN (?) ${kinds}) x ${open} ORDER BY x.resolved_at IS NULL DESC, x.created_at DESC, x.id DESC LIMIT 200`,
    user.role === 'finance' ? [stations, PAYMENT_ALERT_KINDS] : [stations],
  );
  return rows.map(present);
}

/**
 * Someone has seen it and is on it: it leaves the count, and stays listed until the passenger is paid or the work is
 * decided. An alert that only informs is closed by it (dismissed). Audited.
 */
export async function acknowledgeAlert(db: DataSource, user: SessionUser, id: number): Promise<AlertView> {
  await db.transaction(async (em) => {
    const alert = await em.findOne(AlertEntity, { where: { id }, lock: { mode: 'pessimistic_write' } });
    if (!alert || !canSeeStation(user, alert.stationId) || (user.role === 'finance' && !isPaymentAlert(alert.kind as AlertKind))) throw notFound('Alert');
    if (alert.acknowledgedAt) return;
    const dismissed = INFORMATIONAL_ALERT_KINDS.includes(alert.kind as AlertKind);
    const now = new Date();
    await em.update(AlertEntity, { id }, { acknowledgedAt: now, acknowledgedByUserId: user.id, ...(dismissed ? { resolvedAt: now, resolution: `dismissed by ${user.email}`.slice(0, 200) } : {}) });
    await audit(em, { actor: user, action: 'alert.acknowledged', entityType: 'alert', entityId: id, stationId: alert.stationId, before: { acknowledgedAt: null }, after: { acknowledged: true, dismissed } });
    // Colleagues' consoles drop it from their count too.
    recordEffect(em, stationChanged(alert.stationId, [ALERT_TOPIC]));
  });
  const [row]: AlertRow[] = await db.query(`${SELECT} WHERE a.id = ?) x`, [id]);
  return present(row);
}
