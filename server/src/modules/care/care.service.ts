// The desk's care-and-choice records for denied passengers (volunteers and involuntary alike), each in one transaction
// with its audit row. The choice sets what follows: a refund owed, and no Art. 7(2) reduction unless re-routed.
import type { DataSource, EntityManager } from 'typeorm';
import { choiceOffer, type ChoiceKind, type ChoiceOffer } from '@shared/compensation';
import type { SessionUser } from '@shared/schemas/auth';
import type { FlightCareResponse, PassengerCare, RecordCareBody, RecordChoiceBody } from '@shared/schemas/care';
import { CareGivenEntity, CompensationEntity, PassengerChoiceEntity, StationEntity, TicketRefundEntity, type FlightEntity } from '../../db/entities';
import { badRequest, conflict, notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { flightChanged, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { passengerCompensation } from '../denials/compensation';
import { careSetupOf } from './care-setup.service';
import { loadCases, offersOf, proposalFor, regimeOf, type CareCase } from './care-case';
import { presentGiven, suggestedMinor } from './care.presenter';

async function lockedCase(em: EntityManager, user: SessionUser, compensationId: number): Promise<CareCase> {
  const row = await em.findOne(CompensationEntity, { where: { id: compensationId }, lock: { mode: 'pessimistic_write' } });
  if (!row || !canSeeStation(user, row.stationId)) throw notFound('Compensation');
  return (await loadCases(em, [row]))[0];
}

function offerOrBadRequest(c: CareCase, kind: ChoiceKind): ChoiceOffer {
  try {
    return choiceOffer(regimeOf(c), kind);
  } catch (err) {
    if (!(err instanceof RangeError)) throw err;
    throw badRequest(err.message, [{ field: 'kind', rule: err.message.slice('kind: '.length) }]);
  }
}

/**
 * A passenger who is not re-routed cannot have the Art. 7(2) reduction: the amount goes back to the full Art. 7(1)
 * figure while nothing is paid yet. Once a payment started, the choice is refused instead, so nothing is paid twice
 * and nothing owed is lost silently: finance voids or settles first.
 */
async function withdrawReduction(em: EntityManager, user: SessionUser, c: CareCase): Promise<void> {
  const comp = c.compensation;
  if (comp.voluntary || !comp.ruleRef.includes('Art. 7(2)')) return;
  if (comp.state !== 'due') {
    throw conflict('compensation_in_payment', `The reduced compensation is already ${comp.state}; a passenger who is not re-routed is owed the full amount. Settle the payment first, then record the choice.`);
  }
  const full = passengerCompensation({
    station: c.station, flight: c.flight, booking: c.booking, deniedOn: c.flight.serviceDate,
    plannedArrivalDelayMinutes: c.rebooking?.plannedArrivalDelayMinutes ?? null, applyReroutingReduction: false,
  }, c.passenger);
  if (full.problem) throw conflict('not_computed', `The full amount could not be computed: ${full.problem}`);
  const before = { amountMinor: comp.amountMinor, ruleRef: comp.ruleRef };
  Object.assign(comp, { amountMinor: full.amountMinor, ruleRef: full.ruleRef, explanation: full.explanation, band: full.band });
  await em.save(comp);
  await audit(em, { actor: user, action: 'compensation.reduction_withdrawn', entityType: 'compensation', entityId: comp.id, stationId: comp.stationId, before, after: { amountMinor: comp.amountMinor, ruleRef: comp.ruleRef, reason: 'the passenger was not re-routed' } });
}

export async function recordChoice(db: DataSource, user: SessionUser, compensationId: number, body: RecordChoiceBody) {
  return db.transaction(async (em) => {
    const c = await lockedCase(em, user, compensationId);
    const offer = offerOrBadRequest(c, body.kind);
    const existing = await em.findOneBy(PassengerChoiceEntity, { compensationId });
    // A double submit of the same choice changes nothing; a different one needs the first undone by a person, not a click.
    if (existing?.kind === body.kind) return { choice: existing, flightId: c.compensation.flightId, stationId: c.compensation.stationId };
    if (existing) throw conflict('already_recorded', `This passenger’s choice is already recorded (${existing.kind}).`);
    const choice = await em.save(em.create(PassengerChoiceEntity, {
      compensationId, stationId: c.compensation.stationId, flightId: c.compensation.flightId, passengerId: c.compensation.passengerId,
      kind: body.kind, note: body.note, recordedByUserId: user.id, recordedByLabel: user.email,
    }));
    await audit(em, { actor: user, action: 'passenger_choice.recorded', entityType: 'compensation', entityId: compensationId, stationId: c.compensation.stationId, after: { kind: body.kind, note: body.note, source: offer.source, effects: offer.effects } });
    if (!offer.effects.reductionAllowed) await withdrawReduction(em, user, c);
    if (offer.effects.refundOwed) {
      const refund = await em.save(em.create(TicketRefundEntity, {
        compensationId, stationId: c.compensation.stationId, flightId: c.compensation.flightId, passengerId: c.passenger.id,
        amountMinor: c.passenger.fareMinor, currency: c.passenger.fareCurrency, returnFlightOwed: offer.effects.returnFlightOwed, state: 'owed', ruleRef: offer.source,
      }));
      await audit(em, { actor: user, action: 'ticket_refund.owed', entityType: 'ticket_refund', entityId: refund.id, stationId: refund.stationId, after: { compensationId, amountMinor: refund.amountMinor, currency: refund.currency, returnFlightOwed: refund.returnFlightOwed, ruleRef: refund.ruleRef } });
    }
    // A choice may withdraw a reduction or owe a refund: the compensations move with the care.
    recordEffect(em, flightChanged(c.compensation.flightId, c.compensation.stationId, ['care', 'compensations']));
    return { choice, flightId: c.compensation.flightId, stationId: c.compensation.stationId };
  });
}

export async function recordCare(db: DataSource, user: SessionUser, compensationId: number, body: RecordCareBody) {
  return db.transaction(async (em) => {
    const c = await lockedCase(em, user, compensationId);
    let hotelName: string | null = null;
    if (body.hotelId !== undefined) {
      if (body.kind !== 'hotel') throw badRequest('hotelId: only a hotel night names a hotel', [{ field: 'hotelId', rule: 'only with kind hotel' }]);
      const hotel = (await careSetupOf(em, c.station)).hotels.find((h) => h.id === body.hotelId);
      if (!hotel) throw badRequest(`hotelId: ${body.hotelId} is not one of this station’s partner hotels`, [{ field: 'hotelId', rule: 'must be the id of one of the station’s partner hotels' }]);
      hotelName = hotel.name;
    }
    const given = await em.save(em.create(CareGivenEntity, {
      compensationId, stationId: c.compensation.stationId, flightId: c.compensation.flightId, passengerId: c.passenger.id, kind: body.kind, description: body.description,
      amountMinor: body.amountMinor ?? null, currency: body.amountMinor !== undefined ? c.station.currency : null, hotelId: body.hotelId ?? null, hotelName,
      providedBy: body.providedBy, recordedByUserId: user.id, recordedByLabel: user.email,
    }));
    await audit(em, { actor: user, action: 'care.given', entityType: 'care_given', entityId: given.id, stationId: given.stationId, after: { compensationId, kind: given.kind, description: given.description, amountMinor: given.amountMinor, currency: given.currency, hotelName, providedBy: given.providedBy } });
    recordEffect(em, flightChanged(c.compensation.flightId, c.compensation.stationId, ['care']));
    return { given: presentGiven(given), flightId: c.compensation.flightId, stationId: c.compensation.stationId };
  });
}

/** Every denied passenger of the flight with a compensation row: what they may choose, chose, are due and were given. */
export async function flightCare(db: DataSource, flight: FlightEntity): Promise<FlightCareResponse> {
  const station = await db.getRepository(StationEntity).findOneByOrFail({ id: flight.stationId });
  const setup = await careSetupOf(db, station);
  const rows = await db.getRepository(CompensationEntity).find({ where: { flightId: flight.id }, order: { id: 'ASC' } });
  const cases = await loadCases(db, rows);
  const ids = rows.map((r) => r.id);
  const [choices, refunds, given] = ids.length
    ? await Promise.all([
        db.getRepository(PassengerChoiceEntity).createQueryBuilder('c').where('c.compensationId IN (:...ids)', { ids }).getMany(),
        db.getRepository(TicketRefundEntity).createQueryBuilder('r').where('r.compensationId IN (:...ids)', { ids }).getMany(),
        db.getRepository(CareGivenEntity).createQueryBuilder('g').where('g.compensationId IN (:...ids)', { ids }).orderBy('g.id').getMany(),
      ])
    : [[], [], []];
  const passengers: PassengerCare[] = cases.map((c) => {
    const id = c.compensation.id;
    const choice = choices.find((x) => x.compensationId === id) ?? null;
    const offers = offersOf(c);
    const offer = choice ? offers.find((o) => o.kind === choice.kind) : undefined;
    const refund = refunds.find((r) => r.compensationId === id);
    const proposal = proposalFor(c, choice?.kind ?? null);
    return {
      compensationId: id, passengerId: c.passenger.id, passengerName: `${c.passenger.firstName} ${c.passenger.lastName}`, voluntary: c.compensation.voluntary, regime: c.compensation.regime,
      alternate: c.rebooking ? { label: c.rebooking.label, departure: c.rebooking.departure.toISOString() } : null,
      offers: offers.map((o) => ({ kind: o.kind, label: o.label, detail: o.detail, source: o.source, basis: o.basis })),
      choice: choice && offer ? { kind: choice.kind, label: offer.label, detail: offer.detail, note: choice.note, recordedBy: choice.recordedByLabel, recordedAt: choice.recordedAt.toISOString() } : null,
      refundOwed: refund ? { amountMinor: refund.amountMinor, currency: refund.currency, state: refund.state } : null,
      proposal: { ...proposal, items: proposal.items.map((i) => ({ ...i, suggestedMinor: suggestedMinor(i, setup) })) },
      given: given.filter((g) => g.compensationId === id).map(presentGiven),
    };
  });
  return { timeZone: station.timeZone, currency: station.currency, hotels: setup.hotels, allowancesConfigured: setup.configured, passengers };
}
