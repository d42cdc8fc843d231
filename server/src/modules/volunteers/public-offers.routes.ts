// "Offer your seat": the passenger's page, reached from a signed link or QR code at the gate, with no sign-in.
// The link names the flight; the passenger proves their booking with its reference and a last name (throttled, and
// the same answer whichever part is wrong), then offers their seat or names the least they would accept.
import { createHash } from 'node:crypto';
import express, { Router } from 'express';
import type { DataSource } from 'typeorm';
import { identifyBodySchema, passengerBidBodySchema } from '@shared/schemas/volunteers';
import { BookingEntity, FlightEntity, FlightForecastEntity, PassengerEntity, RebookingEntity, StationEntity, VolunteerEntity, VolunteerRoundEntity } from '../../db/entities';
import { HttpError, tooManyRequests } from '../../http/errors';
import { sharedCounter, type CounterStore } from '../../http/shared-counter';
import { parse } from '../../http/validate';
import { passengerToken, readFlightToken, readPassengerToken } from './bid-link';
import { volunteerDisclosure } from './disclosure';
import { policyFor } from './policy.service';
import { addVolunteer } from './rounds.service';

const linkInvalid = () => new HttpError(404, 'link_invalid', 'This link is not valid any more. Ask the gate agent for the current one.');
const notMatched = () => new HttpError(404, 'booking_not_matched', 'We could not find that booking on this flight. Check the booking reference and the last name as printed on your boarding pass.');

export function publicOffersRouter(deps: { db: DataSource; secret: string; identifyLimit?: number;
  /** Where the guesses are counted: MariaDB, so every server process holds a guesser to one allowance. */
  counters?: CounterStore;
}) {
  const r = Router();
  r.use(express.json({ limit: '16kb' }));
  // OWASP Authentication Cheat Sheet (from memory): throttle guessing of booking references; only failures count.
  // Counted per link and per round, never per address: a whole airport often shares one address, and one guesser
  // behind it must not lock every passenger out. The link is shared by the flight's passengers, so the allowance is
  // generous, and a new round starts a new count.
  const limiter = sharedCounter(deps.counters, { keyPrefix: 'identify', points: deps.identifyLimit ?? 30, duration: 15 * 60 });
  const throttleKey = (token: string, roundId: number | undefined) => `${createHash('sha256').update(token).digest('base64url')}:${roundId ?? 'none'}`;

  async function flightOf(token: string) {
    const claim = readFlightToken(deps.secret, token);
    const flight = claim ? await deps.db.getRepository(FlightEntity).findOneBy({ id: claim.f }) : null;
    if (!claim || !flight) throw linkInvalid();
    return { flight, exp: claim.exp };
  }
  const openRound = (flightId: number) => deps.db.getRepository(VolunteerRoundEntity).findOne({ where: { flightId, status: 'open' }, order: { openedAt: 'DESC' } });
  async function bookingOf(flightId: number, token: string) {
    const claim = readPassengerToken(deps.secret, token);
    if (!claim || claim.f !== flightId) throw new HttpError(401, 'passenger_token_invalid', 'Please identify your booking again.');
    return claim.b;
  }

  r.get('/offers/:token', async (req, res) => {
    const { flight } = await flightOf(req.params.token);
    const [station, round, forecast] = await Promise.all([
      deps.db.getRepository(StationEntity).findOneByOrFail({ id: flight.stationId }),
      openRound(flight.id),
      deps.db.getRepository(FlightForecastEntity).findOneBy({ flightId: flight.id }),
    ]);
    const policy = await policyFor(deps.db, flight.stationId);
    res.json({
      flight: { label: `${flight.carrierCode} ${flight.flightNumber}`, destination: flight.destination, departure: flight.scheduledDeparture.toISOString(), timeZone: station.timeZone },
      round: round ? { kind: round.kind, offerMinor: round.offerMinor, currency: round.currency, extras: round.extras } : null,
      disclosure: volunteerDisclosure(station.regime, policy, forecast?.pOversale ?? 0),
    });
  });

  r.post('/offers/:token/identify', async (req, res) => {
    const { flight, exp } = await flightOf(req.params.token);
    const key = throttleKey(req.params.token, (await openRound(flight.id))?.id);
    const seen = await limiter.get(key);
    if (seen && seen.remainingPoints <= 0) throw tooManyRequests('Too many attempts on this link. Please ask the gate agent for help.');
    const body = parse(identifyBodySchema, req.body);
    // One query whichever part is wrong, so neither the answer nor its timing tells a guesser which part was right.
    const party = (await deps.db.getRepository(PassengerEntity).find({ where: { flightId: flight.id, booking: { pnr: body.pnr, status: 'active' } } }))
      .filter((p) => p.status !== 'cancelled');
    const match = party.find((p) => p.lastName.localeCompare(body.lastName, undefined, { sensitivity: 'base' }) === 0);
    if (!match) {
      await limiter.penalty(key, 1);
      throw notMatched();
    }
    const booking = await deps.db.getRepository(BookingEntity).findOneBy({ id: match.bookingId });
    res.json({ passengerToken: passengerToken(deps.secret, flight.id, match.bookingId, exp), names: party.map((p) => `${p.firstName} ${p.lastName}`), language: booking?.language ?? null });
  });

  r.post('/offers/:token/bids', async (req, res) => {
    const { flight } = await flightOf(req.params.token);
    const body = parse(passengerBidBodySchema, req.body);
    const bookingId = await bookingOf(flight.id, body.passengerToken);
    const v = await deps.db.transaction(async (em) => {
      const round = await em.findOne(VolunteerRoundEntity, { where: { flightId: flight.id, status: 'open' }, lock: { mode: 'pessimistic_write' } });
      if (!round) throw new HttpError(409, 'no_open_round', 'The gate is not asking for volunteers right now.');
      return addVolunteer(em, round, bookingId, null, round.kind === 'sealed' ? (body.askMinor ?? null) : null, 'passenger-link', { label: `passenger link (booking ${bookingId})` });
    });
    res.status(201).json({ status: v.status });
  });

  r.get('/offers/:token/status', async (req, res) => {
    const { flight } = await flightOf(req.params.token);
    const bookingId = await bookingOf(flight.id, String(req.query.passengerToken ?? ''));
    const v = await deps.db.getRepository(VolunteerEntity).findOne({ where: { flightId: flight.id, bookingId }, order: { createdAt: 'DESC' } });
    const hold = v ? await deps.db.getRepository(RebookingEntity).findOneBy({ volunteerId: v.id }) : null;
    const round = v ? await deps.db.getRepository(VolunteerRoundEntity).findOneBy({ id: v.roundId }) : null;
    const words = { offered: 'Thank you. Your offer is with the gate agent; please stay near the gate.', accepted: 'Your offer was accepted. The gate agent will give you your new boarding pass and compensation.', declined: 'Thank you. The gate did not need your seat this time; please board as normal.', withdrawn: 'Your offer was withdrawn.' };
    res.json({
      status: v?.status ?? 'none',
      agreedMinor: v?.agreedMinor ?? null,
      currency: round?.currency ?? '',
      rebooking: hold ? { flight: hold.label, departure: hold.departure.toISOString(), arrival: hold.arrival.toISOString(), plannedArrivalDelayMinutes: hold.plannedArrivalDelayMinutes } : null,
      message: v ? words[v.status] : 'You have not offered your seat on this flight.',
    });
  });

  return r;
}
