// The passenger's record of their choice and the care given, mailed when the desk asks: a denied passenger gets the
// written statement again, now with "Your choice" and "Care given"; a volunteer, who has no statement, a short summary.
// Both in the booking's language, checked like every statement before anything is queued.
import { createHash } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import type { PassengerCompensation } from '@shared/schemas/denials';
import type { SessionUser } from '@shared/schemas/auth';
import { BookingEntity, CompensationEntity, DenialEntity, FlightEntity, PassengerEntity, RebookingEntity, StationEntity } from '../../db/entities';
import { badRequest, conflict, notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { careSummaryNotice } from '../../notices/care-summary';
import { flightChanged, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { priorityRulesFor } from '../denials/priority-rules.service';
import { statementFor, statementMail } from '../denials/statement';
import { enqueueMessage } from '../outbox/outbox.service';
import { choiceAndCareForStatement } from './for-statement';

/**
 * The statement's snapshot is the amount when the passenger was rebooked; a later choice can lift an Art. 7(2)
 * reduction (the row is raised then), so an updated statement states what is owed now.
 */
export function withCurrentAmount(snapshot: PassengerCompensation, row: CompensationEntity | null): PassengerCompensation {
  if (!row) return snapshot;
  return { ...snapshot, amountMinor: row.amountMinor, ruleRef: row.ruleRef, explanation: row.explanation, band: row.band || snapshot.band };
}

export interface QueuedCareMail {
  messageId: string;
  /** False when the same text was already queued: a second click mails nothing. */
  created: boolean;
  kind: 'written-statement' | 'care-summary';
  flightId: number;
  stationId: number;
}

const contentKey = (compensationId: number, text: string) =>
  `care-mail:${compensationId}:${createHash('sha256').update(text).digest('hex').slice(0, 24)}`;

export async function queueCareMail(db: DataSource, user: SessionUser, compensationId: number): Promise<QueuedCareMail> {
  return db.transaction(async (em) => {
    const comp = await em.findOne(CompensationEntity, { where: { id: compensationId }, lock: { mode: 'pessimistic_read' } });
    if (!comp || !canSeeStation(user, comp.stationId)) throw notFound('Compensation');
    const [station, flight, booking, passenger] = await Promise.all([
      em.findOneByOrFail(StationEntity, { id: comp.stationId }),
      em.findOneByOrFail(FlightEntity, { id: comp.flightId }),
      em.findOneByOrFail(BookingEntity, { id: comp.bookingId }),
      em.findOneByOrFail(PassengerEntity, { id: comp.passengerId }),
    ]);
    if (!booking.contactEmail) {
      throw badRequest('to: the booking has no e-mail address; print the statement for the passenger instead', [{ field: 'to', rule: 'the booking must have a contact e-mail address' }]);
    }
    const language = booking.language ?? 'en';
    const choiceAndCare = await choiceAndCareForStatement(em, { compensationId }, language);
    if (!choiceAndCare.choice && choiceAndCare.care.length === 0) {
      throw conflict('nothing_recorded', 'Nothing to send yet: record the passenger’s choice or the care given first.');
    }
    const mail = comp.sourceKind === 'denial'
      ? await denialStatement(em, comp, { station, flight, booking, passenger, choiceAndCare })
      : careSummaryNotice({
          station, pnr: booking.pnr, passengerName: `${passenger.firstName} ${passenger.lastName}`, language,
          flight, choice: choiceAndCare.choice, care: choiceAndCare.care,
        });
    const kind = comp.sourceKind === 'denial' ? 'written-statement' : 'care-summary';
    const queued = await enqueueMessage(em, {
      stationId: comp.stationId, flightId: comp.flightId, passengerIds: [comp.passengerId], kind, to: booking.contactEmail, ...mail,
      dedupeKey: contentKey(compensationId, mail.text),
    });
    if (queued.created) {
      recordEffect(em, flightChanged(comp.flightId, comp.stationId, ['care']));
      await audit(em, {
        actor: user, action: 'care.mail_queued', entityType: 'compensation', entityId: compensationId, stationId: comp.stationId,
        after: { kind, messageId: queued.id, to: booking.contactEmail, language, choice: choiceAndCare.choice?.kind ?? null, careItems: choiceAndCare.care.length },
      });
    }
    return { messageId: queued.id, created: queued.created, kind, flightId: comp.flightId, stationId: comp.stationId };
  });
}

async function denialStatement(
  em: EntityManager, comp: CompensationEntity,
  facts: Pick<Parameters<typeof statementFor>[0], 'station' | 'flight' | 'passenger' | 'choiceAndCare'> & { booking: BookingEntity },
) {
  const denial = await em.findOneBy(DenialEntity, { id: comp.sourceId });
  const snapshot = denial?.compensation?.passengers.find((c) => c.passengerId === comp.passengerId);
  if (!denial?.compensation || !snapshot) throw conflict('not_rebooked', 'The statement is written once the passenger is rebooked (or it is recorded that no alternate was offered).');
  const [rebooking, { rules }] = await Promise.all([em.findOneBy(RebookingEntity, { denialId: denial.id }), priorityRulesFor(em, comp.stationId)]);
  try {
    return statementMail(statementFor({
      ...facts, pnr: facts.booking.pnr, compensation: withCurrentAmount(snapshot, comp), rebooking,
      rules: denial.compensation.priorityRules ?? rules, language: facts.booking.language,
    }));
  } catch (err) {
    if (!(err instanceof RangeError)) throw err;
    // A statement that cannot be complete is not sent: the field or section it lacks is named for the desk.
    const field = err.message.split(':')[0];
    throw badRequest(`The statement cannot be sent: ${err.message}`, [{ field, rule: err.message.slice(field.length + 1).trim() }]);
  }
}
