// The optional fees a passenger paid (seat selection, bags…) arrive by the manifest and by the feed, are stored on the
// passenger, and a bad fee is refused naming the field and the rule. Runs on a station and flights of its own
// (Trondheim, a real airport no other test uses).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { MANIFEST_COLUMNS, manifestRejectedSchema } from '@shared/schemas/manifest';
import { createdIntegrationKeySchema, eventBatchResponseSchema } from '@shared/schemas/integration-events';
import { FlightEntity, PassengerEntity, StationEntity } from '../../server/src/db/entities';
import { removeFlights } from './volunteers-fixtures';
import { Client, startTestApp, upload, type TestApp } from './harness';
import { RUN_ID, TEST_PASSWORD, insertUser, removeRunUsers } from './helpers';

let t: TestApp;
let station: StationEntity;
let admin: Client;
let key: string;
const flightIds: number[] = [];

async function testStation(): Promise<StationEntity> {
  const repo = t.db.getRepository(StationEntity);
  return (await repo.findOneBy({ iata: 'TRD' })) ?? repo.save(repo.create({ iata: 'TRD', name: 'Trondheim (API test station)', timeZone: 'Europe/Oslo', regime: 'eu-261', currency: 'NOK' }));
}

async function makeFlight(): Promise<FlightEntity> {
  const repo = t.db.getRepository(FlightEntity);
  const departure = new Date(Math.floor(Date.now() / 60_000) * 60_000 + 25 * 24 * 3_600_000);
  for (let attempt = 0; attempt < 20; attempt++) {
    const flightNumber = String(7000 + Math.floor(Math.random() * 1000));
    const serviceDate = departure.toISOString().slice(0, 10);
    if (await repo.existsBy({ carrierCode: 'ZZ', flightNumber, serviceDate, origin: 'TRD' })) continue;
    const f = await repo.save(repo.create({ stationId: station.id, carrierCode: 'ZZ', flightNumber, serviceDate, origin: 'TRD', destination: 'OSL', scheduledDeparture: departure, scheduledArrival: new Date(departure.getTime() + 3_600_000), aircraftType: null, seatsByCabin: { J: 4, Y: 20 }, gate: null, state: 'check-in-open', shock: null }));
    flightIds.push(f.id);
    return f;
  }
  throw new Error('no free flight number');
}

const HEADER = [...MANIFEST_COLUMNS, 'optional_fees'].join(',');
function csvRow(f: FlightEntity, pnr: string, fees: string, currency = 'NOK'): string {
  const cells: Record<string, string> = {
    flight_carrier: f.carrierCode, flight_number: f.flightNumber, flight_date: f.serviceDate, pnr, sequence: '1', first_name: 'Ada', last_name: 'Extras',
    cabin: 'J', fare_minor: '450000', fare_currency: currency, fare_type: 'standard', ssr_codes: '', frequent_flyer_tier: '', is_child: 'false',
    inbound_flight: '', inbound_scheduled_arrival: '', contact_email: '',
  };
  return `${MANIFEST_COLUMNS.map((c) => cells[c]).join(',')},"${fees}"`;
}
const importCsv = (text: string) => upload(admin, `/api/stations/${station.id}/manifests/import`, { name: 'manifest.csv', content: text, type: 'text/csv' });

function feedBooking(f: FlightEntity, pnr: string, optionalFees: unknown) {
  return {
    id: `fees-${RUN_ID}-${pnr}`, type: 'booking.added', occurredAt: new Date().toISOString(), flight: { carrier: 'ZZ', number: f.flightNumber, date: f.serviceDate }, pnr,
    passengers: [{ firstName: 'Bo', lastName: 'Extras', cabin: 'Y', fareMinor: 99_000, fareCurrency: 'NOK', optionalFees }],
  };
}
const feed = (...events: object[]) => request(t.app).post('/api/integrations/events').set('Authorization', `Bearer ${key}`).send({ events });

beforeAll(async () => {
  t = await startTestApp();
  station = await testStation();
  const user = await insertUser(t.db, { label: 'fees-admin', role: 'admin', stationIds: [station.id] });
  admin = new Client(t.app);
  expect((await admin.signIn(user.email, TEST_PASSWORD)).status).toBe(200);
  key = createdIntegrationKeySchema.parse((await admin.post(`/api/stations/${station.id}/integration-keys`, { name: `fees ${RUN_ID}` }).expect(201)).body).key;
});
afterAll(async () => {
  if (flightIds.length) await removeFlights(t.db, flightIds);
  await t.db.query('DELETE FROM integration_keys WHERE name = ?', [`fees ${RUN_ID}`]);
  await removeRunUsers(t.db);
  await t.close();
});

describe('optional fees on the booking', () => {
  it('the manifest stores each fee with its kind, minor units and currency, beside the cabin and fare paid', async () => {
    const f = await makeFlight();
    await importCsv(`${HEADER}\r\n${csvRow(f, 'FEE001', 'seat:3500:NOK; bag:40000:NOK')}\r\n`).expect(200);
    const [p] = await t.db.getRepository(PassengerEntity).findBy({ flightId: f.id });
    expect(p).toMatchObject({ cabin: 'J', fareMinor: 450_000, fareCurrency: 'NOK', optionalFees: [{ kind: 'seat', amountMinor: 3500, currency: 'NOK' }, { kind: 'bag', amountMinor: 40_000, currency: 'NOK' }] });
  });

  it('the manifest refuses a bad fee naming the line, the column and the rule, and stores nothing', async () => {
    const f = await makeFlight();
    const res = await importCsv(`${HEADER}\r\n${csvRow(f, 'FEE002', 'seat:-5:NOK')}\r\n${csvRow(f, 'FEE003', 'bag:100:EUR')}\r\n`).expect(400);
    expect(manifestRejectedSchema.parse(res.body).errors).toEqual([
      { line: 2, field: 'optional_fees', rule: 'optional_fees fee 1 must read like "seat:3500:USD" (kind:minor units:currency)' },
      { line: 3, field: 'optional_fees', rule: "optional_fees must be the fare's currency NOK (fee 1 is in EUR)" },
    ]);
    expect(await t.db.getRepository(PassengerEntity).countBy({ flightId: f.id })).toBe(0);
  });

  it('the feed stores the fees and rejects a bad one naming the field', async () => {
    const f = await makeFlight();
    const res = eventBatchResponseSchema.parse((await feed(
      feedBooking(f, 'FEE010', [{ kind: 'seat', amountMinor: 2500, currency: 'NOK' }]),
      feedBooking(f, 'FEE011', [{ kind: 'spa', amountMinor: 2500, currency: 'NOK' }]),
      feedBooking(f, 'FEE012', [{ kind: 'bag', amountMinor: 2.5, currency: 'NOK' }]),
      feedBooking(f, 'FEE013', [{ kind: 'bag', amountMinor: 250, currency: 'SEK' }]),
    ).expect(200)).body);
    expect(res.results.map((r) => r.status)).toEqual(['applied', 'rejected', 'rejected', 'rejected']);
    expect(res.results[1].details).toContainEqual({ field: 'passengers.0.optionalFees.0.kind', rule: 'kind must be one of seat, bag, priority, meal, wifi, lounge, other' });
    expect(res.results[2].details).toContainEqual({ field: 'passengers.0.optionalFees.0.amountMinor', rule: 'amountMinor must be a whole number of minor units (e.g. cents)' });
    expect(res.results[3].details).toContainEqual({ field: 'passengers.0.optionalFees.0.currency', rule: "currency must be the fare's currency NOK (fee 1 is in SEK)" });
    const [p] = await t.db.getRepository(PassengerEntity).findBy({ flightId: f.id });
    expect(p.optionalFees).toEqual([{ kind: 'seat', amountMinor: 2500, currency: 'NOK' }]);
  });
});
