// The one check every path that fixes a compensation amount goes through: an opening offer, a raise, a sealed-bid
// accept, issuing a compensation and a denial override. Within the user's limit the path goes on; above it the
// amount waits for a supervisor of the station (never the one who asked), and the path stops there.
import { In, type EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { limitForRole, withinLimit, type ApprovalKind } from '@shared/schemas/approvals';
import type { VolunteerPolicy } from '@shared/schemas/volunteers';
import { OfferApprovalEntity, type CompensationEntity } from '../../db/entities';
import { conflict } from '../../domain/errors';
import { raiseApprovalWaiting } from '../alerts/work-alerts';
import { flightChanged, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { policyFor } from '../volunteers/policy.service';

/** The user's own limit at the station, from the station's policy. */
export const limitFor = (user: Pick<SessionUser, 'role'>, policy: VolunteerPolicy) => limitForRole(user.role, policy);

export { withinLimit };

export interface AmountRequest {
  kind: ApprovalKind;
  stationId: number;
  flightId: number | null;
  roundId?: number | null;
  /** The volunteer, compensation or denial the amount belongs to. */
  subjectId?: number | null;
  amountMinor: number;
  currency: string;
}

export type GateAnswer = { approved: true; approval: OfferApprovalEntity | null } | { approved: false; approval: OfferApprovalEntity };

/**
 * Decides whether the caller may go on with the amount. An earlier approval of exactly this amount on the same
 * subject lets it through (the approval was for that amount, nothing more). Otherwise, above the limit, it records
 * the request (audited, in the caller's transaction) and answers "not approved"; a second request while one waits
 * is refused, so a supervisor never sees two competing amounts for the same thing.
 */
export async function gateAmount(em: EntityManager, user: SessionUser, req: AmountRequest): Promise<GateAnswer> {
  const policy = await policyFor(em, req.stationId);
  const limit = limitFor(user, policy);
  if (withinLimit(limit, req.amountMinor)) return { approved: true, approval: null };
  const subject = req.subjectId != null ? { kind: req.kind, subjectId: req.subjectId } : { kind: req.kind, roundId: req.roundId ?? undefined };
  const granted = await em.findOneBy(OfferApprovalEntity, { ...subject, status: 'approved', offerMinor: req.amountMinor });
  if (granted) return { approved: true, approval: granted };
  // A round's offer is one amount, whichever path asked for it: an opening offer and a raise never wait side by side.
  const waitingOn = req.kind === 'raise' || req.kind === 'opening-offer' ? { ...subject, kind: In(['raise', 'opening-offer']) } : subject;
  const pending = await em.findOne(OfferApprovalEntity, { where: { ...waitingOn, status: 'pending' }, lock: { mode: 'pessimistic_write' } });
  if (pending) throw conflict('approval_pending', 'An amount already waits for a supervisor here; it must be decided first.');
  const approval = await em.save(em.create(OfferApprovalEntity, {
    kind: req.kind, roundId: req.roundId ?? null, stationId: req.stationId, flightId: req.flightId, subjectId: req.subjectId ?? null,
    offerMinor: req.amountMinor, currency: req.currency, limitMinor: limit, status: 'pending',
    requestedByUserId: user.id, requestedByLabel: user.email, decidedByUserId: null, decidedAt: null, reason: '',
  }));
  await audit(em, {
    actor: user, action: 'approval.requested', entityType: 'offer_approval', entityId: approval.id, stationId: req.stationId,
    after: { kind: req.kind, amountMinor: req.amountMinor, currency: req.currency, limitMinor: limit, roundId: approval.roundId, subjectId: approval.subjectId, flightId: req.flightId },
  });
  await raiseApprovalWaiting(em, approval);
  if (req.flightId !== null) recordEffect(em, flightChanged(req.flightId, req.stationId, ['approvals']));
  return { approved: false, approval };
}

/**
 * The issue path's check: an amount cleared when it was fixed (the rule's, a gated offer, an approval) is issued by
 * any agent; one that was never cleared (recorded before the gate, or typed by hand) is gated like any other amount.
 */
export async function gateIssue(em: EntityManager, user: SessionUser, row: Pick<CompensationEntity, 'id' | 'stationId' | 'flightId' | 'amountMinor' | 'currency' | 'amountClearedBy'>): Promise<GateAnswer> {
  if (row.amountClearedBy) return { approved: true, approval: null };
  return gateAmount(em, user, { kind: 'issue', stationId: row.stationId, flightId: row.flightId, subjectId: row.id, amountMinor: row.amountMinor, currency: row.currency });
}
