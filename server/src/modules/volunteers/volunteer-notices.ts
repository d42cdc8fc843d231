// Putting a volunteer's e-mails in the outbox inside the transaction of the accept or the rebooking: if that
// transaction rolls back, nothing is sent. The dedupe keys name the fact, so a retried request never mails twice.
import { In, type EntityManager } from 'typeorm';
import { BookingEntity, CompensationEntity, FlightEntity, PassengerEntity, StationEntity, VoucherOfferEntity, type VolunteerEntity, type VolunteerRoundEntity } from '../../db/entities';
import { outboxInputSchema } from '../outbox/outbox-input';
import { enqueueMessage } from '../outbox/outbox.service';
import { volunteerAgreementNotice, volunteerRebookingNotice, type VolunteerAgreement, type VolunteerNoticeInput } from './notices';

/** The outbox writer; tests hand in a wrapper to force a failure after the message is written. */
export type Enqueue = typeof enqueueMessage;

/** What happened to the notice, recorded in the audit row of the action. */
export type NoticeOutcome = 'queued' | 'already queued' | 'no contact address' | 'contact address not valid';

export const confirmationKey = (volunteerId: number, repricedTo?: number) => `volunteer-confirmation:${volunteerId}${repricedTo === undefined ? '' : `:price-${repricedTo}`}`;
export const rebookingKey = (volunteerId: number) => `rebooking-notice:volunteer:${volunteerId}`;

interface Loaded {
  to: string | null;
  outcome: NoticeOutcome | null;
  input: VolunteerNoticeInput;
  flight: FlightEntity;
}

/**
 * How the volunteer is paid, as recorded: the cash-equivalent card, or a voucher once they agreed to one (then with
 * the restrictions they were shown when it was offered).
 */
async function paymentOf(em: EntityManager, volunteerId: number): Promise<Pick<VolunteerAgreement, 'form' | 'voucherRestrictions'>> {
  const rows = await em.findBy(CompensationEntity, { sourceKind: 'volunteer', sourceId: volunteerId });
  if (!rows.length || rows.some((r) => r.form !== 'voucher')) return { form: 'prepaid-card', voucherRestrictions: [] };
  const offer = await em.findOneBy(VoucherOfferEntity, { compensationId: rows[0].id });
  return { form: 'voucher', voucherRestrictions: offer?.restrictions ?? [] };
}

async function load(em: EntityManager, round: VolunteerRoundEntity, v: VolunteerEntity): Promise<Loaded> {
  // One after another: a transaction has one connection, and its queries run in order anyway.
  const booking = await em.findOneByOrFail(BookingEntity, { id: v.bookingId });
  const flight = await em.findOneByOrFail(FlightEntity, { id: v.flightId });
  const station = await em.findOneByOrFail(StationEntity, { id: round.stationId });
  const passengers = await em.findBy(PassengerEntity, { id: In(v.passengerIds) });
  const payment = await paymentOf(em, v.id);
  const byId = new Map(passengers.map((p) => [p.id, `${p.firstName} ${p.lastName}`]));
  const address = booking.contactEmail?.trim() || null;
  const usable = address !== null && outboxInputSchema.shape.to.safeParse(address).success;
  return {
    to: usable ? address : null,
    // A manifest without an address, or with one no mail server would take: the agent hands the passenger a copy.
    outcome: address === null ? 'no contact address' : usable ? null : 'contact address not valid',
    flight,
    input: {
      station: { iata: station.iata, name: station.name, timeZone: station.timeZone },
      flight,
      pnr: booking.pnr,
      passengerNames: v.passengerIds.map((id) => byId.get(id) ?? `Passenger ${id}`),
      agreement: { perPassenger: { amountMinor: v.agreedMinor ?? 0, currency: round.currency }, extras: round.extras, ...payment },
      language: booking.language ?? undefined,
    },
  };
}

async function put(em: EntityManager, enqueue: Enqueue, l: Loaded, round: VolunteerRoundEntity, v: VolunteerEntity, kind: string, dedupeKey: string, notice: { subject: string; text: string; html: string }): Promise<NoticeOutcome> {
  if (!l.to) return l.outcome!;
  const r = await enqueue(em, { stationId: round.stationId, flightId: v.flightId, passengerIds: v.passengerIds, kind, to: l.to, dedupeKey, ...notice });
  return r.created ? 'queued' : 'already queued';
}

/** The written confirmation of what was agreed; `repriced` for the update a common price sends. */
export async function enqueueConfirmation(em: EntityManager, round: VolunteerRoundEntity, v: VolunteerEntity, enqueue: Enqueue, repriced = false): Promise<NoticeOutcome> {
  const l = await load(em, round, v);
  const key = confirmationKey(v.id, repriced ? (v.agreedMinor ?? 0) : undefined);
  return put(em, enqueue, l, round, v, 'volunteer-confirmation', key, volunteerAgreementNotice({ ...l.input, updated: repriced }));
}

export interface HeldFlight {
  carrierCode: string;
  flightNumber: string;
  departure: Date;
  arrival: Date;
  plannedArrivalDelayMinutes: number;
}

/** The new flight, with what is owed and how it is paid (the form recorded on the compensation rows). */
export async function enqueueRebookingNotice(em: EntityManager, round: VolunteerRoundEntity, v: VolunteerEntity, held: HeldFlight, enqueue: Enqueue): Promise<NoticeOutcome> {
  const l = await load(em, round, v);
  const newFlight = { carrierCode: held.carrierCode, flightNumber: held.flightNumber, origin: l.flight.origin, destination: l.flight.destination, departure: held.departure, arrival: held.arrival };
  const notice = volunteerRebookingNotice({ ...l.input, newFlight, plannedArrivalDelayMinutes: held.plannedArrivalDelayMinutes });
  return put(em, enqueue, l, round, v, 'rebooking-notice', rebookingKey(v.id), notice);
}
