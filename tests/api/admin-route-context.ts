// Objects the access matrix needs for the admin screens' routes: fresh flights, schedules and notices to change,
// one per call (every call builds its URL, refused ones included), at the own station and at the other one.
import type { DataSource } from 'typeorm';
import { FlightEntity, FlightScheduleEntity } from '../../server/src/db/entities';
import { enqueueMessage } from '../../server/src/modules/outbox/outbox.service';
import type { RouteContext, RouteRow, Scope } from './route-table';

export interface AdminRouteContext {
  /** A scheduled flight nobody is booked on, fresh per call (a cancelled one cannot be cancelled again). */
  flightId(scope: Scope): number;
  scheduleId(scope: Scope): number;
  failedNoticeId(scope: Scope): string;
  sentNoticeId(scope: Scope): string;
  /** A flight number no other row uses, for the routes that create flights and schedules. */
  nextNumber(): string;
}

/** Marks the rows this file makes, so cleanup finds exactly them. */
const SUFFIX = 'M';
const POOL = 14;
let counter = 0;

function pooled<T>(pools: Record<Scope, T[]>, what: string) {
  return (scope: Scope): T => {
    const v = pools[scope].shift();
    if (v === undefined) throw new Error(`the matrix ran out of ${what} for scope ${scope}`);
    return v;
  };
}

export async function adminRouteContext(db: DataSource, stations: Record<Scope, { id: number; iata: string }>): Promise<AdminRouteContext> {
  const flights: Record<Scope, number[]> = { own: [], other: [] };
  const schedules: Record<Scope, number[]> = { own: [], other: [] };
  const failed: Record<Scope, string[]> = { own: [], other: [] };
  const sent: Record<Scope, string[]> = { own: [], other: [] };
  const base = 1000 + Math.floor(Math.random() * 8000);
  for (const scope of ['own', 'other'] as const) {
    const st = stations[scope];
    for (let i = 0; i < POOL; i++) {
      const number = `${(base + counter++) % 10_000}${SUFFIX}`;
      const departure = new Date(Date.UTC(2027, 5, 1 + i, 12));
      const f = await db.getRepository(FlightEntity).save({ stationId: st.id, carrierCode: 'ZZ', flightNumber: number, serviceDate: departure.toISOString().slice(0, 10), origin: st.iata, destination: 'ORD', scheduledDeparture: departure, scheduledArrival: new Date(departure.getTime() + 7_200_000), aircraftType: null, seatsByCabin: { Y: 100 }, gate: null, state: 'scheduled', shock: null, scheduleId: null });
      flights[scope].push(f.id);
      const s = await db.getRepository(FlightScheduleEntity).save({ stationId: st.id, carrierCode: 'ZZ', flightNumber: number, destination: 'ORD', departureTime: '12:00', blockMinutes: 120, seatsByCabin: { Y: 100 }, aircraftType: null, weekdays: [1], validFrom: '2027-07-05', validTo: '2027-07-05', cancelled: false });
      schedules[scope].push(s.id);
      for (const [pool, status] of [[failed, 'failed'], [sent, 'sent']] as const) {
        const { id } = await db.transaction((em) => enqueueMessage(em, { stationId: st.id, flightId: null, passengerIds: [], kind: 'volunteer-confirmation', to: 'matrix@passengers.bumpboard.test', subject: 'Admin route matrix notice', text: 'Admin route matrix notice' }));
        await db.query(`UPDATE outbox_messages SET status = ?, sent_at = IF(? = 'sent', UTC_TIMESTAMP(3), NULL), last_error = 'admin route matrix' WHERE id = ?`, [status, status, id]);
        pool[scope].push(id);
      }
    }
  }
  return {
    flightId: pooled(flights, 'flights'),
    scheduleId: pooled(schedules, 'schedules'),
    failedNoticeId: pooled(failed, 'failed notices'),
    sentNoticeId: pooled(sent, 'sent notices'),
    nextNumber: () => `${(base + counter++) % 10_000}${SUFFIX}`,
  };
}

export async function removeAdminRouteFixtures(db: DataSource): Promise<void> {
  await db.query("DELETE FROM outbox_messages WHERE subject = 'Admin route matrix notice'");
  await db.query("DELETE FROM flights WHERE carrier_code = 'ZZ' AND flight_number LIKE ? AND service_date >= '2027-01-01'", [`%${SUFFIX}`]);
  await db.query("DELETE FROM flight_schedules WHERE carrier_code = 'ZZ' AND flight_number LIKE ?", [`%${SUFFIX}`]);
}

const stationOf = (ctx: RouteContext, scope: Scope) => (scope === 'own' ? ctx.ownStationId : ctx.otherStationId);
const flightBody = (ctx: RouteContext) => ({ carrierCode: 'ZZ', flightNumber: ctx.admin.nextNumber(), serviceDate: '2027-08-02', departureTime: '10:00', blockMinutes: 90, destination: 'ORD', seatsByCabin: { Y: 120 } });
const scheduleBody = (ctx: RouteContext) => ({ ...flightBody(ctx), serviceDate: undefined, weekdays: [1], validFrom: '2027-08-02', validTo: '2027-08-09' });

/** The admin screens' rows of the route table. */
export const ADMIN_ROUTES: readonly RouteRow[] = [
  { method: 'GET', pattern: '/api/stations/settings', access: ['admin'], call: () => ({ url: '/api/stations/settings' }), success: 200 },
  { method: 'GET', pattern: '/api/stations/airports/:iata', access: ['admin'], call: () => ({ url: '/api/stations/airports/BGO' }), success: 200 },
  // Opening a station takes a carrier-wide admin; the matrix's demo admin holds its stations only, so 403 is its answer
  // (tests/api/admin-stations.test.ts shows a carrier-wide admin's 201).
  { method: 'POST', pattern: '/api/stations', access: ['admin'], call: () => ({ url: '/api/stations', body: { iata: 'BGO', regime: 'eu-261', currency: 'NOK' } }), success: 403 },
  { method: 'PATCH', pattern: '/api/stations/:id', access: ['admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}`, body: { departureGraceMinutes: 10 } }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/stations/:stationId/flights', access: ['admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/flights?from=2027-06-01&to=2027-06-30` }), success: 200, otherStation: 404 },
  { method: 'POST', pattern: '/api/stations/:stationId/flights', access: ['admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/flights`, body: flightBody(ctx) }), success: 201, otherStation: 404 },
  { method: 'PATCH', pattern: '/api/flights/:flightId', access: ['admin'], call: (ctx, scope) => ({ url: `/api/flights/${ctx.admin.flightId(scope)}`, body: { gate: 'M1' } }), success: 200, otherStation: 404 },
  { method: 'POST', pattern: '/api/flights/:flightId/cancel', access: ['admin'], call: (ctx, scope) => ({ url: `/api/flights/${ctx.admin.flightId(scope)}/cancel`, body: { reason: 'route matrix' } }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/stations/:stationId/schedules', access: ['admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/schedules` }), success: 200, otherStation: 404 },
  { method: 'POST', pattern: '/api/stations/:stationId/schedules', access: ['admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/schedules`, body: scheduleBody(ctx) }), success: 201, otherStation: 404 },
  { method: 'PATCH', pattern: '/api/schedules/:id', access: ['admin'], call: (ctx, scope) => ({ url: `/api/schedules/${ctx.admin.scheduleId(scope)}`, body: { blockMinutes: 95 } }), success: 200, otherStation: 404 },
  { method: 'POST', pattern: '/api/schedules/:id/cancel', access: ['admin'], call: (ctx, scope) => ({ url: `/api/schedules/${ctx.admin.scheduleId(scope)}/cancel` }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/stations/:stationId/notices', access: ['supervisor', 'admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/notices` }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/stations/:stationId/notices/:id', access: ['supervisor', 'admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/notices/${ctx.admin.sentNoticeId(scope)}` }), success: 200, otherStation: 404 },
  { method: 'POST', pattern: '/api/stations/:stationId/notices/:id/retry', access: ['supervisor', 'admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/notices/${ctx.admin.failedNoticeId(scope)}/retry` }), success: 200, otherStation: 404 },
  { method: 'POST', pattern: '/api/stations/:stationId/notices/:id/resend', access: ['supervisor', 'admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/notices/${ctx.admin.sentNoticeId(scope)}/resend` }), success: 201, otherStation: 404 },
  { method: 'GET', pattern: '/api/stations/:stationId/audit', access: ['admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/audit?action=flight.` }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/stations/:stationId/audit.csv', access: ['admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/audit.csv?action=flight.` }), success: 200, otherStation: 404 },
];
