// Proposing denials, changing the selection, withdrawing and authorizing: each in one transaction with its audit
// rows. The flight row is locked first, so two people working the same flight queue up instead of double-selecting.
import { In, type DataSource, type EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { ChangeDenialsBody, ProposeDenialsBody } from '@shared/schemas/denials';
import { DenialEntity, DenialProposalEntity, FlightEntity, PassengerEntity } from '../../db/entities';
import { badRequest, conflict, forbidden, notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { raiseDenialProposed } from '../alerts/work-alerts';
import { flightChanged, flightMoved, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { rankFlight } from './candidates.service';
import { assertNotDeparted } from '../flights/departure-guard';
import { assertStillNeeded, cabinForProposal, flightPresence } from './shortfall';

const WAITING = ['proposed', 'changed'] as const;

export async function proposalForUser(em: EntityManager, user: SessionUser, proposalId: number): Promise<DenialProposalEntity> {
  const proposal = await em.findOne(DenialProposalEntity, { where: { id: proposalId }, lock: { mode: 'pessimistic_write' } });
  if (!proposal || !canSeeStation(user, proposal.stationId)) throw notFound('Denial proposal');
  return proposal;
}

async function lockFlight(em: EntityManager, flightId: number): Promise<FlightEntity> {
  return em.findOneOrFail(FlightEntity, { where: { id: flightId }, lock: { mode: 'pessimistic_write' } });
}

const unitSummary = (d: DenialEntity) => ({ denialId: d.id, bookingId: d.bookingId, passengerIds: d.passengerIds, position: d.position });

export async function proposeDenials(db: DataSource, user: SessionUser, flightId: number, body: ProposeDenialsBody) {
  return db.transaction(async (em) => {
    const flight = await lockFlight(em, flightId);
    await assertNotDeparted(em, flight, 'proposing a new denial of boarding');
    const waiting = await em.findOneBy(DenialProposalEntity, { flightId, status: In([...WAITING]) });
    if (waiting) throw conflict('proposal_waiting', `Proposal ${waiting.id} on this flight still waits for a supervisor. Change or withdraw it instead of proposing again.`);
    const cabin = cabinForProposal(await flightPresence(em, flight), body.cabin, body.seatsNeeded);
    const ranking = await rankFlight(em, flight);
    const chosen: typeof ranking.candidates = [];
    let covered = 0;
    // Strictly in rank order within the short cabin: a party kept together may free more seats than asked, never fewer.
    for (const candidate of ranking.candidates) {
      if (covered >= body.seatsNeeded) break;
      if (candidate.selection || !candidate.cabins.includes(cabin.cabin)) continue;
      chosen.push(candidate);
      covered += candidate.passengerIds.filter((id) => ranking.passengersById.get(id)?.cabin === cabin.cabin).length;
    }
    if (chosen.length === 0) throw conflict('no_candidates', `Nobody in cabin ${cabin.cabin} can be selected: every passenger present is boarded, a volunteer or already selected.`);
    const proposal = await em.save(em.create(DenialProposalEntity, {
      flightId, stationId: flight.stationId, status: 'proposed', seatsNeeded: body.seatsNeeded, proposedByUserId: user.id,
      proposedByLabel: user.displayName, decidedByUserId: null, decidedAt: null, reason: body.reason,
    }));
    const denials = await em.save(chosen.map((c) => em.create(DenialEntity, {
      proposalId: proposal.id, flightId, stationId: flight.stationId, bookingId: c.bookingId, passengerIds: c.passengerIds, position: c.position,
      reasons: c.reasons, status: 'proposed', selectedByUserId: user.id, authorizedByUserId: null, authorizedAt: null, changeReason: null,
      category: null, compensation: null, statementMessageIds: null,
    })));
    await audit(em, {
      actor: user, action: 'denial_proposal.created', entityType: 'denial_proposal', entityId: proposal.id, stationId: flight.stationId,
      after: { flightId, cabin: cabin.cabin, shortfall: cabin, seatsNeeded: body.seatsNeeded, seatsSelected: covered, reason: body.reason, denials: denials.map(unitSummary) },
    });
    await raiseDenialProposed(em, proposal, covered);
    recordEffect(em, flightChanged(flight.id, flight.stationId, ['denials']));
    return { proposal, flight };
  });
}

function assertWaiting(proposal: DenialProposalEntity) {
  if (proposal.status === 'withdrawn') throw conflict('proposal_withdrawn', 'This proposal was withdrawn.');
  if (proposal.status === 'authorized') throw conflict('proposal_authorized', 'This proposal is already authorized; propose again for more seats.');
}

export async function changeDenials(db: DataSource, user: SessionUser, proposalId: number, body: ChangeDenialsBody & { remove: number[]; add: number[] }) {
  return db.transaction(async (em) => {
    const proposal = await proposalForUser(em, user, proposalId);
    assertWaiting(proposal);
    const flight = await lockFlight(em, proposal.flightId);
    const own = await em.findBy(DenialEntity, { proposalId });
    const removed = body.remove.map((denialId) => {
      const d = own.find((x) => x.id === denialId);
      if (!d || d.status !== 'proposed') {
        throw badRequest(`remove: denial ${denialId} is not a waiting denial of this proposal`, [{ field: 'remove', rule: 'must name waiting denials of this proposal' }]);
      }
      return d;
    });
    const ranking = await rankFlight(em, flight);
    const added = body.add.flatMap((bookingId) => {
      const units = ranking.candidates.filter((c) => c.bookingId === bookingId);
      const protectedMember = ranking.excluded.find((e) => e.bookingId === bookingId);
      if (units.length === 0 && protectedMember) {
        throw badRequest(`add: booking ${protectedMember.pnr} cannot be selected: ${protectedMember.reason}`, [{ field: 'add', rule: 'must name bookings that are not protected' }]);
      }
      if (units.length === 0) throw badRequest(`add: booking ${bookingId} has nobody on this flight who can be selected`, [{ field: 'add', rule: 'must name bookings on this flight' }]);
      const free = units.filter((u) => !u.selection || removed.some((r) => r.id === u.selection?.denialId));
      if (free.length === 0) throw badRequest(`add: booking ${units[0].pnr} is already selected`, [{ field: 'add', rule: 'must name bookings not yet selected' }]);
      return free;
    });
    for (const d of removed) {
      d.status = 'removed';
      d.changeReason = body.reason;
    }
    await em.save(removed);
    const created = await em.save(added.map((c) => em.create(DenialEntity, {
      proposalId, flightId: flight.id, stationId: flight.stationId, bookingId: c.bookingId, passengerIds: c.passengerIds, position: c.position,
      reasons: c.reasons, status: 'proposed', selectedByUserId: user.id, authorizedByUserId: null, authorizedAt: null, changeReason: body.reason,
      category: null, compensation: null, statementMessageIds: null,
    })));
    const before = { status: proposal.status, denials: own.filter((d) => d.status !== 'removed').map(unitSummary) };
    proposal.status = 'changed';
    await em.save(proposal);
    await audit(em, {
      actor: user, action: 'denial_proposal.changed', entityType: 'denial_proposal', entityId: proposal.id, stationId: proposal.stationId,
      before, after: { status: 'changed', reason: body.reason, removed: removed.map(unitSummary), added: created.map(unitSummary) },
    });
    recordEffect(em, flightChanged(proposal.flightId, proposal.stationId, ['denials']));
    return { proposal, flight };
  });
}

export async function withdrawProposal(db: DataSource, user: SessionUser, proposalId: number, reason: string) {
  return db.transaction(async (em) => {
    const proposal = await proposalForUser(em, user, proposalId);
    // A second withdraw (a double click, a retry) finds nothing left to do.
    if (proposal.status === 'withdrawn') return { proposal, changed: false };
    if (proposal.status === 'authorized') throw conflict('proposal_authorized', 'This proposal is already authorized and cannot be withdrawn.');
    await lockFlight(em, proposal.flightId);
    const own = await em.findBy(DenialEntity, { proposalId });
    const waiting = own.filter((d) => d.status === 'proposed');
    for (const d of waiting) {
      d.status = 'removed';
      d.changeReason = reason;
    }
    await em.save(waiting);
    const before = { status: proposal.status };
    // Denials a supervisor already authorized stand; only the rest of the selection goes.
    proposal.status = own.some((d) => d.status === 'authorized') ? 'authorized' : 'withdrawn';
    proposal.decidedByUserId = user.id;
    proposal.decidedAt = new Date();
    await em.save(proposal);
    await audit(em, {
      actor: user, action: 'denial_proposal.withdrawn', entityType: 'denial_proposal', entityId: proposal.id, stationId: proposal.stationId,
      before, after: { status: proposal.status, reason, removed: waiting.map(unitSummary) },
    });
    recordEffect(em, flightChanged(proposal.flightId, proposal.stationId, ['denials']));
    return { proposal, changed: true };
  });
}

export async function authorizeDenials(db: DataSource, user: SessionUser, proposalId: number, denialIds: number[] | undefined) {
  return db.transaction(async (em) => {
    const proposal = await proposalForUser(em, user, proposalId);
    if (user.role !== 'supervisor') {
      throw forbidden('Authorizing an involuntary denial of boarding is a supervisor\'s act: ask a supervisor of this station.');
    }
    if (proposal.proposedByUserId === user.id) {
      throw forbidden('You proposed these denials. Another supervisor must authorize them: nobody authorizes their own proposal.');
    }
    if (proposal.status === 'withdrawn') throw conflict('proposal_withdrawn', 'This proposal was withdrawn.');
    const flight = await lockFlight(em, proposal.flightId);
    const own = await em.findBy(DenialEntity, { proposalId });
    const targets = (denialIds ?? own.filter((d) => d.status === 'proposed').map((d) => d.id)).map((denialId) => {
      const d = own.find((x) => x.id === denialId);
      if (!d || d.status === 'removed') {
        throw badRequest(`denialIds: denial ${denialId} is not in this proposal's selection`, [{ field: 'denialIds', rule: 'must name denials of this proposal that were not removed' }]);
      }
      return d;
    });
    const toAuthorize = targets.filter((d) => d.status === 'proposed');
    const ownPicks = toAuthorize.filter((d) => d.selectedByUserId === user.id);
    if (ownPicks.length > 0) {
      throw forbidden(`You added ${ownPicks.length === 1 ? 'denial' : 'denials'} ${ownPicks.map((d) => d.id).join(', ')} to the selection. Another supervisor must authorize ${ownPicks.length === 1 ? 'it' : 'them'}.`);
    }
    // The same check as at proposal time: still present, still short. Passengers who left or a shortfall that
    // closed since then make the denial unnecessary, and an unnecessary denial is never authorized.
    assertStillNeeded(await flightPresence(em, flight), toAuthorize);
    const now = new Date();
    for (const d of toAuthorize) {
      Object.assign(d, { status: 'authorized', authorizedByUserId: user.id, authorizedAt: now });
      await em.save(d);
      // The passengers leave this flight: the counts and the forecast stop expecting them.
      await em.update(PassengerEntity, { id: In(d.passengerIds), flightId: proposal.flightId }, { status: 'offloaded', statusChangedAt: now });
      await audit(em, {
        actor: user, action: 'denial.authorized', entityType: 'denial', entityId: d.id, stationId: proposal.stationId,
        before: { status: 'proposed' }, after: { status: 'authorized', proposalId, bookingId: d.bookingId, passengerIds: d.passengerIds, position: d.position, reasons: d.reasons },
      });
    }
    const stillWaiting = own.some((d) => d.status === 'proposed');
    if (!stillWaiting && proposal.status !== 'authorized') {
      const before = { status: proposal.status };
      Object.assign(proposal, { status: 'authorized', decidedByUserId: user.id, decidedAt: now });
      await em.save(proposal);
      await audit(em, { actor: user, action: 'denial_proposal.authorized', entityType: 'denial_proposal', entityId: proposal.id, stationId: proposal.stationId, before, after: { status: 'authorized' } });
    }
    // Authorized passengers are offloaded: the counts and the forecast move with them.
    if (toAuthorize.length > 0) recordEffect(em, ...flightMoved(proposal.flightId, proposal.stationId, ['denials', 'counts', 'forecast']));
    return { proposal, authorized: toAuthorize.map((d) => d.id) };
  });
}
