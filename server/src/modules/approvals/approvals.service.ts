// A supervisor's queue of amounts above someone's limit, one station at a time, and the decision on each: who may
// decide (a supervisor of that station, never the one who asked, within their own limit), what an approval sets
// in motion, and the audit row, all in one transaction.
import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { PendingApproval } from '@shared/schemas/approvals';
import { OfferApprovalEntity, VolunteerRoundEntity } from '../../db/entities';
import { conflict, forbidden, notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { raiseApprovalDecided } from '../alerts/work-alerts';
import { flightMoved, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { assertNotDeparted } from '../flights/departure-guard';
import { acceptApproved } from '../volunteers/accept.service';
import { policyFor } from '../volunteers/policy.service';
import { applyApprovedOffer } from '../volunteers/rounds.service';
import { limitFor, withinLimit } from './approval-gate';

interface Row {
  id: number; kind: PendingApproval['kind']; round_id: number | null; flight_id: number | null; subject_id: number | null; offer_minor: number;
  currency: string | null; limit_minor: number | null; requested_by_label: string; requested_at: Date; carrier_code: string | null; flight_number: string | null;
  pnr: string | null; names: string | null;
}

/** What waits at one station, oldest first; another station's queue is "not found", as for any other object. */
export async function pendingApprovals(db: DataSource, user: SessionUser, stationId: number): Promise<PendingApproval[]> {
  if (!canSeeStation(user, stationId)) throw notFound('Station');
  const rows: Row[] = await db.query(
    `SELECT a.id, a.kind, a.round_id, a.flight_id, a.subject_id, a.offer_minor, a.currency, a.limit_minor, a.requested_by_label, a.requested_at,
            f.carrier_code, f.flight_number, b.pnr,
            (SELECT GROUP_CONCAT(CONCAT(p.first_name, ' ', p.last_name) ORDER BY p.pnr_sequence SEPARATOR ', ') FROM passengers p
              WHERE (a.kind = 'sealed-accept' AND JSON_CONTAINS(v.passenger_ids, CAST(p.id AS CHAR))) OR (a.kind = 'issue' AND p.id = c.passenger_id)) AS names
       FROM offer_approvals a
       LEFT JOIN flights f ON f.id = a.flight_id
       LEFT JOIN volunteers v ON a.kind = 'sealed-accept' AND v.id = a.subject_id
       LEFT JOIN compensations c ON a.kind = 'issue' AND c.id = a.subject_id
       LEFT JOIN bookings b ON b.id = COALESCE(v.booking_id, c.booking_id)
      WHERE a.station_id = ? AND a.status = 'pending' ORDER BY a.requested_at, a.id`,
    [stationId],
  );
  return rows.map((a) => ({
    id: a.id, kind: a.kind, roundId: a.round_id, flightId: a.flight_id, flight: a.carrier_code ? `${a.carrier_code} ${a.flight_number}` : '',
    subject: a.pnr ? `${a.names ?? ''} (booking ${a.pnr})`.trim() : null,
    offerMinor: a.offer_minor, currency: a.currency ?? '', limitMinor: a.limit_minor, requestedBy: a.requested_by_label, requestedAt: new Date(a.requested_at).toISOString(),
  }));
}

/**
 * Locks are taken round first, then the approval, the same order as raising, accepting and closing a round, so a
 * decision and a close at the same moment wait for each other instead of deadlocking. READ COMMITTED, as for an
 * accept: an approved sealed bid counts the seats other accepts committed just before.
 */
export async function decideApproval(db: DataSource, user: SessionUser, approvalId: number, approve: boolean, reason: string) {
  return db.transaction('READ COMMITTED', async (em) => {
    const found = await em.findOneBy(OfferApprovalEntity, { id: approvalId });
    if (!found || !canSeeStation(user, found.stationId)) throw notFound('Approval');
    const round = found.roundId ? await em.findOneOrFail(VolunteerRoundEntity, { where: { id: found.roundId }, lock: { mode: 'pessimistic_write' } }) : null;
    const approval = await em.findOneOrFail(OfferApprovalEntity, { where: { id: approvalId }, lock: { mode: 'pessimistic_write' } });
    if (approval.status !== 'pending') throw conflict('approval_decided', 'This approval was already decided.');
    // Four eyes (common practice): whoever asked for the amount cannot approve it, nor decline it for themselves.
    if (approval.requestedByUserId === user.id) throw forbidden('You asked for this amount; another supervisor must decide it.');
    if (approve) {
      const limit = limitFor(user, await policyFor(em, approval.stationId));
      if (!withinLimit(limit, approval.offerMinor)) throw forbidden(`This amount is above your own limit of ${limit} minor units; a supervisor with a higher limit must decide it.`);
      if (approval.flightId && approval.kind !== 'issue' && approval.kind !== 'denial-override') await assertNotDeparted(em, approval.flightId, 'approving a new amount');
    }
    Object.assign(approval, { status: approve ? 'approved' : 'rejected', decidedByUserId: user.id, decidedAt: new Date(), reason });
    await em.save(approval);
    await raiseApprovalDecided(em, approval, user);
    // A decided amount may move the round's offer, accept a volunteer (the forecast loses a show) or clear a payment.
    if (approval.flightId) recordEffect(em, ...flightMoved(approval.flightId, approval.stationId, ['rounds', 'approvals', 'compensations', 'forecast']));
    if (approve && round && (approval.kind === 'opening-offer' || approval.kind === 'raise')) await applyApprovedOffer(em, user, round, approval);
    if (approve && round && approval.kind === 'sealed-accept') await acceptApproved(em, user, round, approval);
    await audit(em, {
      actor: user, action: approve ? 'approval.approved' : 'approval.rejected', entityType: 'offer_approval', entityId: approval.id, stationId: approval.stationId,
      after: { kind: approval.kind, amountMinor: approval.offerMinor, currency: approval.currency, requestedBy: approval.requestedByLabel, roundId: approval.roundId, subjectId: approval.subjectId, reason },
    });
    return { approval, round };
  });
}
