// "Offer your seat" without sign-in: the link names the flight; the passenger proves their booking with its reference
// and a last name (throttled, and the same answer whichever part is wrong), then offers their seat or names the
// least they would accept. Every refusal here is a domain failure; the route only parses and answers.
import { createHash } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import type { identifyBodySchema, passengerBidBodySchema } from '@shared/schemas/volunteers';
import { BookingEntity, FlightEntity, FlightForecastEntity, PassengerEntity, RebookingEntity, StationEntity, VolunteerEntity, VolunteerRoundEntity } from '../../db/entities';
import { sharedCounter, type CounterStore } from '../../db/shared-counter';
import { conflict, DomainError, tooManyRequests, unauthenticated } from '../../domain/errors';
import { passengerToken, readFlightToken, readPassengerToken } from './bid-link';
import { volunteerDisclosure } from './disclosure';
import { policyFor } from './policy.service';
import { addVolunteer } from './rounds.service';

const linkInvalid = () => new DomainError('not_found', 'link_invalid', 'This link is not valid any more. Ask the gate agent for the current one.');
const notMatched = () => new DomainError('not_found', 'booking_not_matched', 'We could not find that booking on this flight. Check the booking reference and the last name as printed on your boarding pass.');

const STATUS_WORDS = {
  offered: 'Thank you. Your offer is with the gate agent; please stay near the gate.',
  accepted: 'Your offer was accepted. The gate agent will give you your new boarding pass and compensation.',
  declined: 'Thank you. The gate did not need your seat this time; please board as normal.',
  withdrawn: 'Your offer was withdrawn.',
} as const;

/** A passenger link that opened: the flight it names and when it stops working. */
export interface OfferLink {
  token: string;
  flight: FlightEntity;
  exp: number;
}

export interface PublicOffersDeps {
  db: DataSource;
  secret: string;
  identifyLimit?: number;
  /** Where the guesses are counted: MariaDB, so every server process holds a guesser to one allowance. */
  counters?: CounterStore;
}

export function publicOffers(deps: PublicOffersDeps) {
  const { db, secret } = deps;
  // OWASP Authentication Cheat Sheet (from memory): throttle guessing of booking references; only failures count.
  // Counted per link and per round, never per address: a whole airport often shares one address, and one guesser
  // behind it must not lock every passenger out. The link is shared by the flight's passengers, so the allowance is
  // generous, and a new round starts a new count.
  const limiter = sharedCounter(deps.counters, { keyPrefix: 'identify', points: deps.identifyLimit ?? 30, duration: 15 * 60 });
  const throttleKey = (token: string, roundId: number | undefined) => `${createHash('sha256').update(token).digest('base64url')}:${roundId ?? 'none'}`;
  const openRound = (flightId: number) => db.getRepository(VolunteerRoundEntity).findOne({ where: { flightId, status: 'open' }, order: { openedAt: 'DESC' } });

  function bookingOf(link: OfferLink, token: string): number {
    const claim = readPassengerToken(secret, token);
    if (!claim || claim.f !== link.flight.id) throw unauthenticated('passenger_token_invalid', 'Please identify your booking again.');
    return claim.b;
  }

  return {
    /** Opens a link: refuses one that is forged, expired or names a flight we no longer have. */
    async open(token: string): Promise<OfferLink> {
      const claim = readFlightToken(secret, token);
      const flight = claim ? await db.getRepository(FlightEntity).findOneBy({ id: claim.f }) : null;
      if (!claim || !flight) throw linkInvalid();
      return { token, flight, exp: claim.exp };
    },

    /** What the page shows: the flight, the open round (if any) and the passenger's rights in words. */
    async page({ flight }: OfferLink) {
      const [station, round, forecast] = await Promise.all([
        db.getRepository(StationEntity).findOneByOrFail({ id: flight.stationId }),
        openRound(flight.id),
        db.getRepository(FlightForecastEntity).findOneBy({ flightId: flight.id }),
      ]);
      const policy = await policyFor(db, flight.stationId);
      return {
        flight: { label: `${flight.carrierCode} ${flight.flightNumber}`, destination: flight.destination, departure: flight.scheduledDeparture.toISOString(), timeZone: station.timeZone },
        round: round ? { kind: round.kind, offerMinor: round.offerMinor, currency: round.currency, extras: round.extras } : null,
        disclosure: volunteerDisclosure(station.regime, policy, forecast?.pOversale ?? 0),
      };
    },

    /** Matches a booking reference and last name to a party on the flight; a wrong guess spends the link's allowance. */
    async identify(link: OfferLink, body: z.infer<typeof identifyBodySchema>) {
      const { flight } = link;
      const key = throttleKey(link.token, (await openRound(flight.id))?.id);
      const seen = await limiter.get(key);
      if (seen && seen.remainingPoints <= 0) throw tooManyRequests('Too many attempts on this link. Please ask the gate agent for help.');
      // One query whichever part is wrong, so neither the answer nor its timing tells a guesser which part was right.
      const party = (await db.getRepository(PassengerEntity).find({ where: { flightId: flight.id, booking: { pnr: body.pnr, status: 'active' } } }))
        .filter((p) => p.status !== 'cancelled');
      const match = party.find((p) => p.lastName.localeCompare(body.lastName, undefined, { sensitivity: 'base' }) === 0);
      if (!match) {
        await limiter.penalty(key, 1);
        throw notMatched();
      }
      const booking = await db.getRepository(BookingEntity).findOneBy({ id: match.bookingId });
      return { passengerToken: passengerToken(secret, flight.id, match.bookingId, link.exp), names: party.map((p) => `${p.firstName} ${p.lastName}`), language: booking?.language ?? null };
    },

    /** The identified passenger offers their seat in the round open now (a sealed round takes their ask). */
    async offerSeat(link: OfferLink, body: z.infer<typeof passengerBidBodySchema>) {
      const { flight } = link;
      const bookingId = bookingOf(link, body.passengerToken);
      return db.transaction(async (em) => {
        const round = await em.findOne(VolunteerRoundEntity, { where: { flightId: flight.id, status: 'open' }, lock: { mode: 'pessimistic_write' } });
        if (!round) throw conflict('no_open_round', 'The gate is not asking for volunteers right now.');
        return addVolunteer(em, round, bookingId, null, round.kind === 'sealed' ? (body.askMinor ?? null) : null, 'passenger-link', { label: `passenger link (booking ${bookingId})` });
      });
    },

    /** Where the passenger's offer stands, in words for them. */
    async status(link: OfferLink, token: string) {
      const { flight } = link;
      const bookingId = bookingOf(link, token);
      const v = await db.getRepository(VolunteerEntity).findOne({ where: { flightId: flight.id, bookingId }, order: { createdAt: 'DESC' } });
      const hold = v ? await db.getRepository(RebookingEntity).findOneBy({ volunteerId: v.id }) : null;
      const round = v ? await db.getRepository(VolunteerRoundEntity).findOneBy({ id: v.roundId }) : null;
      return {
        status: v?.status ?? 'none',
        agreedMinor: v?.agreedMinor ?? null,
        currency: round?.currency ?? '',
        rebooking: hold ? { flight: hold.label, departure: hold.departure.toISOString(), arrival: hold.arrival.toISOString(), plannedArrivalDelayMinutes: hold.plannedArrivalDelayMinutes } : null,
        message: v ? STATUS_WORDS[v.status] : 'You have not offered your seat on this flight.',
      };
    },
  };
}
