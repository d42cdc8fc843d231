// Weekly schedules: saving one makes its dated flights match it. Flights already sold are never moved off a day or
// cancelled in bulk: they are reported as skipped, for the admin to handle one by one on the flights screen.
import { In, MoreThan, type DataSource, type EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { Schedule, ScheduleCreateBody, ScheduleResult, ScheduleUpdateBody } from '@shared/schemas/admin-flights';
import { FlightEntity, FlightScheduleEntity, StationEntity } from '../../db/entities';
import { badRequest, conflict, DomainError, notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { audit } from '../audit/audit.service';
import { assertKnownAirport, flightTimes } from '../flights/flight-times';
import { scheduleDates } from './schedule-dates';

interface Outcome { created: number; updated: number; cancelled: number; skipped: { date: string; reason: string }[] }

async function liveFlightCount(em: DataSource | EntityManager, scheduleIds: number[]): Promise<Map<number, number>> {
  if (!scheduleIds.length) return new Map();
  const rows: { schedule_id: number; n: string }[] = await em.query("SELECT schedule_id, COUNT(*) AS n FROM flights WHERE schedule_id IN (?) AND state <> 'cancelled' GROUP BY schedule_id", [scheduleIds]);
  return new Map(rows.map((r) => [Number(r.schedule_id), Number(r.n)]));
}

function present(s: FlightScheduleEntity, origin: string, flights: number): Schedule {
  return {
    id: s.id, carrierCode: s.carrierCode, flightNumber: s.flightNumber, origin, destination: s.destination, departureTime: s.departureTime, blockMinutes: s.blockMinutes,
    seatsByCabin: s.seatsByCabin, aircraftType: s.aircraftType, weekdays: [...s.weekdays].sort(), validFrom: s.validFrom, validTo: s.validTo, cancelled: s.cancelled, flights,
  };
}

export async function listSchedules(db: DataSource, station: StationEntity): Promise<{ schedules: Schedule[] }> {
  const rows = await db.getRepository(FlightScheduleEntity).find({ where: { stationId: station.id }, order: { cancelled: 'ASC', carrierCode: 'ASC', flightNumber: 'ASC', validFrom: 'ASC' } });
  const counts = await liveFlightCount(db, rows.map((s) => s.id));
  return { schedules: rows.map((s) => present(s, station.iata, counts.get(s.id) ?? 0)) };
}

async function passengerCounts(em: EntityManager, flightIds: number[]): Promise<Map<number, number>> {
  if (!flightIds.length) return new Map();
  const rows: { flight_id: number; n: string }[] = await em.query("SELECT flight_id, COUNT(*) AS n FROM passengers WHERE flight_id IN (?) AND status <> 'cancelled' GROUP BY flight_id", [flightIds]);
  return new Map(rows.map((r) => [Number(r.flight_id), Number(r.n)]));
}

/**
 * Makes the schedule's future flights match it: creates the missing days, moves and resizes the ones not yet open,
 * cancels days it no longer flies (or all, when the schedule is cancelled) where nobody is booked.
 */
async function reconcile(em: EntityManager, s: FlightScheduleEntity, station: StationEntity, now: Date): Promise<Outcome> {
  const out: Outcome = { created: 0, updated: 0, cancelled: 0, skipped: [] };
  const wanted = new Set(s.cancelled ? [] : scheduleDates(s.validFrom, s.validTo, s.weekdays));
  const own = await em.find(FlightEntity, { where: { scheduleId: s.id, state: In(['scheduled']), scheduledDeparture: MoreThan(now) }, lock: { mode: 'pessimistic_write' } });
  const booked = await passengerCounts(em, own.map((f) => f.id));
  const ownDates = new Set<string>();
  for (const f of own) {
    ownDates.add(f.serviceDate);
    if (!wanted.has(f.serviceDate)) {
      const n = booked.get(f.id) ?? 0;
      if (n > 0) out.skipped.push({ date: f.serviceDate, reason: `${n} passenger${n === 1 ? ' is' : 's are'} booked: cancel this flight on its own if it must go` });
      else {
        f.state = 'cancelled';
        await em.save(f);
        out.cancelled += 1;
      }
      continue;
    }
    const { departure, arrival } = flightTimes(f.serviceDate, s.departureTime, s.blockMinutes, station.timeZone);
    if (f.scheduledDeparture.getTime() !== departure.getTime() || f.scheduledArrival.getTime() !== arrival.getTime() || JSON.stringify(f.seatsByCabin) !== JSON.stringify(s.seatsByCabin) || f.aircraftType !== s.aircraftType) {
      Object.assign(f, { scheduledDeparture: departure, scheduledArrival: arrival, seatsByCabin: s.seatsByCabin, aircraftType: s.aircraftType });
      await em.save(f);
      out.updated += 1;
    }
  }
  for (const date of wanted) {
    if (ownDates.has(date)) continue;
    let times: { departure: Date; arrival: Date };
    try {
      times = flightTimes(date, s.departureTime, s.blockMinutes, station.timeZone);
    } catch (err) {
      if (!(err instanceof DomainError)) throw err;
      out.skipped.push({ date, reason: `${s.departureTime} does not exist on the station's clock that day` });
      continue;
    }
    if (times.departure <= now) continue;
    const key = { carrierCode: s.carrierCode, flightNumber: s.flightNumber, serviceDate: date, origin: station.iata };
    if (await em.findOneBy(FlightEntity, key)) {
      out.skipped.push({ date, reason: 'a flight with this number already flies that day' });
      continue;
    }
    await em.insert(FlightEntity, { ...key, stationId: station.id, destination: s.destination, scheduledDeparture: times.departure, scheduledArrival: times.arrival, aircraftType: s.aircraftType, seatsByCabin: s.seatsByCabin, gate: null, state: 'scheduled', shock: null, scheduleId: s.id });
    out.created += 1;
  }
  out.skipped.sort((a, b) => a.date.localeCompare(b.date));
  return out;
}

async function result(em: EntityManager, s: FlightScheduleEntity, station: StationEntity, outcome: Outcome): Promise<ScheduleResult> {
  const counts = await liveFlightCount(em, [s.id]);
  return { schedule: present(s, station.iata, counts.get(s.id) ?? 0), ...outcome };
}

export async function createSchedule(db: DataSource, user: SessionUser, station: StationEntity, body: ScheduleCreateBody, now = new Date()): Promise<ScheduleResult> {
  assertKnownAirport('destination', body.destination);
  // A clock time is checked once on a day that surely has it, so a plainly wrong time is refused as invalid before anything is stored.
  flightTimes(body.validFrom, body.departureTime, body.blockMinutes, 'UTC');
  return db.transaction(async (em) => {
    const s = await em.save(
      em.create(FlightScheduleEntity, { stationId: station.id, carrierCode: body.carrierCode, flightNumber: body.flightNumber, destination: body.destination, departureTime: body.departureTime, blockMinutes: body.blockMinutes, seatsByCabin: body.seatsByCabin, aircraftType: body.aircraftType || null, weekdays: body.weekdays, validFrom: body.validFrom, validTo: body.validTo, cancelled: false }),
    );
    const outcome = await reconcile(em, s, station, now);
    const out = await result(em, s, station, outcome);
    await audit(em, { actor: user, action: 'schedule.created', entityType: 'flight_schedule', entityId: s.id, stationId: station.id, after: { ...out.schedule, created: outcome.created, skipped: outcome.skipped.length } });
    return out;
  });
}

async function lockedSchedule(em: EntityManager, user: SessionUser, id: number): Promise<{ s: FlightScheduleEntity; station: StationEntity }> {
  const s = await em.findOne(FlightScheduleEntity, { where: { id }, lock: { mode: 'pessimistic_write' } });
  if (!s || !canSeeStation(user, s.stationId)) throw notFound('Schedule');
  if (s.cancelled) throw conflict('schedule_cancelled', `Schedule ${s.carrierCode}${s.flightNumber} is cancelled; create a new one instead.`);
  return { s, station: await em.findOneByOrFail(StationEntity, { id: s.stationId }) };
}

export async function updateSchedule(db: DataSource, user: SessionUser, id: number, body: ScheduleUpdateBody, now = new Date()): Promise<ScheduleResult> {
  return db.transaction(async (em) => {
    const { s, station } = await lockedSchedule(em, user, id);
    const before = present(s, station.iata, 0);
    const next = { ...before, ...body, aircraftType: body.aircraftType === undefined ? s.aircraftType : body.aircraftType || null };
    if (next.validFrom > next.validTo) throw badRequest('validTo: validTo must not be before validFrom', [{ field: 'validTo', rule: 'validTo must not be before validFrom' }]);
    Object.assign(s, { departureTime: next.departureTime, blockMinutes: next.blockMinutes, seatsByCabin: next.seatsByCabin, aircraftType: next.aircraftType, weekdays: next.weekdays, validFrom: next.validFrom, validTo: next.validTo });
    await em.save(s);
    const outcome = await reconcile(em, s, station, now);
    const out = await result(em, s, station, outcome);
    await audit(em, { actor: user, action: 'schedule.updated', entityType: 'flight_schedule', entityId: s.id, stationId: station.id, before, after: { ...out.schedule, created: outcome.created, updated: outcome.updated, cancelled: outcome.cancelled } });
    return out;
  });
}

export async function cancelSchedule(db: DataSource, user: SessionUser, id: number, now = new Date()): Promise<ScheduleResult> {
  return db.transaction(async (em) => {
    const { s, station } = await lockedSchedule(em, user, id);
    s.cancelled = true;
    await em.save(s);
    const outcome = await reconcile(em, s, station, now);
    const out = await result(em, s, station, outcome);
    await audit(em, { actor: user, action: 'schedule.cancelled', entityType: 'flight_schedule', entityId: s.id, stationId: station.id, before: { cancelled: false }, after: { cancelled: true, flightsCancelled: outcome.cancelled, flightsKept: outcome.skipped.length } });
    return out;
  });
}
