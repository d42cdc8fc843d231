// Manifest upload: template, preview with line numbers, all-or-nothing import, re-import that updates in place.
// Runs on a station and flights of its own, so no demo flight's passengers or odds move.
// Outside sources, from memory: RFC 4180 (CSV: header line, quoted cells, CR LF line ends); OWASP File Upload Cheat
// Sheet (limit the size, allow only the expected type, check authorization before reading the file); RFC 9110
// §15.5.2/§15.5.4/§15.5.5 (401 without credentials, 403 for a role that may not, 404 for what the caller may not see).
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { In } from 'typeorm';
import { MANIFEST_ALL_COLUMNS, MANIFEST_COLUMNS, manifestImportResultSchema, manifestPreviewSchema, manifestRejectedSchema } from '@shared/schemas/manifest';
import { AuditLogEntity, BookingEntity, FlightEntity, FlightForecastEntity, PassengerEntity, StationEntity } from '../../server/src/db/entities';
import { Client, startTestApp, upload, type TestApp } from './harness';
import { TEST_PASSWORD, insertUser, removeRunUsers, stationIdByIata } from './helpers';

let t: TestApp;
let station: StationEntity;
let bos: number;
const as = {} as Record<'admin' | 'supervisor' | 'agent', Client>;
const flightIds: number[] = [];

type Cells = Partial<Record<(typeof MANIFEST_ALL_COLUMNS)[number], string>>;

/** Bergen, a real airport in Norway: a station of these tests alone, created once and reused. */
async function testStation(): Promise<StationEntity> {
  const repo = t.db.getRepository(StationEntity);
  return (await repo.findOneBy({ iata: 'BGO' })) ?? repo.save(repo.create({ iata: 'BGO', name: 'Bergen (API test station)', timeZone: 'Europe/Oslo', regime: 'eu-261', currency: 'NOK' }));
}

async function makeFlight(opts: { state?: FlightEntity['state']; departsInHours?: number } = {}): Promise<FlightEntity> {
  const repo = t.db.getRepository(FlightEntity);
  const departure = new Date(Date.now() + (opts.departsInHours ?? 30 * 24) * 3_600_000);
  for (let attempt = 0; attempt < 20; attempt++) {
    const flightNumber = String(9000 + Math.floor(Math.random() * 1000));
    const serviceDate = departure.toISOString().slice(0, 10);
    if (await repo.existsBy({ carrierCode: 'ZZ', flightNumber, serviceDate, origin: 'BGO' })) continue;
    const f = await repo.save(
      repo.create({ stationId: station.id, carrierCode: 'ZZ', flightNumber, serviceDate, origin: 'BGO', destination: 'OSL', scheduledDeparture: departure, scheduledArrival: new Date(departure.getTime() + 3_600_000), aircraftType: null, seatsByCabin: { J: 4, Y: 20 }, gate: null, state: opts.state ?? 'check-in-open', shock: null }),
    );
    flightIds.push(f.id);
    return f;
  }
  throw new Error('no free flight number for the test flight');
}

function csvRow(f: FlightEntity, cells: Cells): string {
  const all: Record<string, string> = {
    flight_carrier: f.carrierCode, flight_number: f.flightNumber, flight_date: f.serviceDate, pnr: 'MNF001', sequence: '1', first_name: 'Lena', last_name: 'Quill',
    cabin: 'Y', fare_minor: '189500', fare_currency: 'NOK', fare_type: 'standard', ssr_codes: '', frequent_flyer_tier: '', is_child: 'false',
    inbound_flight: '', inbound_scheduled_arrival: '', contact_email: '', ...cells,
  };
  return MANIFEST_COLUMNS.map((c) => all[c]).join(',');
}
const csv = (...rows: string[]) => `${MANIFEST_COLUMNS.join(',')}\r\n${rows.join('\r\n')}\r\n`;

async function signInAs(role: 'admin' | 'supervisor' | 'agent'): Promise<Client> {
  const user = await insertUser(t.db, { label: `manifest-${role}`, role, stationIds: [station.id] });
  const c = new Client(t.app);
  const res = await c.signIn(user.email, TEST_PASSWORD);
  expect(res.status).toBe(200);
  return c;
}

const url = (stationId: number, what: 'template' | 'preview' | 'import') => `/api/stations/${stationId}/manifests/${what}`;
const send = (c: Client, what: 'preview' | 'import', content: string, name = 'manifest.csv', type = 'text/csv') => upload(c, url(station.id, what), { name, content, type });
/** An import that cancels passengers goes through only with the confirmation the preview asks for. */
const confirmed = (content: string) => upload(as.admin, url(station.id, 'import'), { name: 'manifest.csv', content }).field('confirmRemovals', 'true');
const passengersOf = (flightId: number) => t.db.getRepository(PassengerEntity).find({ where: { flightId }, order: { id: 'ASC' } });

async function waitForForecast(flightId: number, after: number): Promise<FlightForecastEntity> {
  return vi.waitFor(async () => {
    const row = await t.db.getRepository(FlightForecastEntity).findOneBy({ flightId });
    if (!row || row.computedAt.getTime() < after) throw new Error(`flight ${flightId} was not recomputed within 5 s`);
    return row;
  }, { timeout: 5_000, interval: 100 });
}

beforeAll(async () => {
  t = await startTestApp();
  station = await testStation();
  bos = await stationIdByIata(t.db, 'BOS');
  for (const role of ['admin', 'supervisor', 'agent'] as const) as[role] = await signInAs(role);
});
afterAll(async () => {
  if (flightIds.length) {
    await t.db.getRepository(FlightForecastEntity).delete({ flightId: In(flightIds) });
    await t.db.query('DELETE FROM forecast_snapshots WHERE flight_id IN (?)', [flightIds]);
    await t.db.getRepository(FlightEntity).delete({ id: In(flightIds) });
  }
  await removeRunUsers(t.db);
  await t.close();
});

describe('the template', () => {
  it('is a CSV of every column on one of the station’s own flights, and imports as downloaded (round trip)', async () => {
    // Latest flight of the station, so the template names it.
    const f = await makeFlight({ departsInHours: 400 * 24 });
    const res = await as.admin.get(url(station.id, 'template')).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?bumpboard-manifest-template\.csv"?$/);
    const lines = res.text.trimEnd().split('\n');
    expect(lines[0]).toBe(MANIFEST_ALL_COLUMNS.join(','));
    expect(lines).toHaveLength(3);
    expect(lines[1]).toContain(`ZZ,${f.flightNumber},${f.serviceDate}`);

    const preview = manifestPreviewSchema.parse((await send(as.admin, 'preview', res.text).expect(200)).body);
    expect(preview.errors).toEqual([]);
    expect(preview.flights[0]).toMatchObject({ found: true, bookings: 1, passengers: 2, willCancel: 0, diff: { added: 2, changed: 0, removed: 0 } });
    const result = manifestImportResultSchema.parse((await send(as.admin, 'import', res.text).expect(200)).body);
    expect(result.totals).toMatchObject({ bookingsCreated: 1, passengersCreated: 2 });
    // The example's onward flight is stored with the booking.
    const booking = await t.db.getRepository(BookingEntity).findOneByOrFail({ flightId: f.id });
    expect(booking.itinerary).toHaveLength(1);
    expect(booking.itinerary?.[0]).toMatchObject({ origin: 'OSL', destination: 'YUL' });
  });
});

describe('a good import', () => {
  it('previews, then stores the bookings and passengers in one go, audits the counts and recomputes the odds', async () => {
    const f = await makeFlight();
    const file = csv(
      csvRow(f, { pnr: 'MNF001', sequence: '1', first_name: 'Lena', contact_email: 'lena.quill@example.com', frequent_flyer_tier: 'gold' }),
      csvRow(f, { pnr: 'MNF001', sequence: '2', first_name: 'Ivo', is_child: 'true', ssr_codes: 'CHLD VGML', fare_minor: '99000', contact_email: 'lena.quill@example.com' }),
      csvRow(f, { pnr: 'MNF002', sequence: '1', first_name: 'Sofie', last_name: 'Brann', cabin: 'J', fare_type: 'flex', inbound_flight: 'ZZ 386', inbound_scheduled_arrival: '2031-01-01T10:05:00+01:00' }),
    );
    const preview = manifestPreviewSchema.parse((await send(as.admin, 'preview', file).expect(200)).body);
    expect(preview).toMatchObject({ rows: 3, errors: [], needsConfirmation: false, flights: [{ carrier: 'ZZ', number: f.flightNumber, date: f.serviceDate, found: true, bookings: 2, passengers: 3, willCancel: 0, seats: 24, bookingLimit: 36 }] });
    expect(preview.flights[0].diff).toMatchObject({ added: 3, changed: 0, removed: 0, unchanged: 0 });
    expect(await passengersOf(f.id)).toHaveLength(0); // a preview stores nothing

    const before = Date.now();
    const res = await send(as.admin, 'import', file).expect(200);
    const result = manifestImportResultSchema.parse(res.body);
    expect(result.totals).toEqual({ bookingsCreated: 2, bookingsUpdated: 0, bookingsCancelled: 0, passengersCreated: 3, passengersUpdated: 0, passengersCancelled: 0 });

    const bookings = await t.db.getRepository(BookingEntity).find({ where: { flightId: f.id }, order: { pnr: 'ASC' } });
    expect(bookings.map((b) => [b.pnr, b.contactEmail, b.status])).toEqual([['MNF001', 'lena.quill@example.com', 'active'], ['MNF002', null, 'active']]);
    const pax = await passengersOf(f.id);
    expect(pax.map((p) => [p.firstName, p.pnrSequence, p.cabin, p.fareMinor, p.fareType, p.status])).toEqual([
      ['Lena', 1, 'Y', 189500, 'standard', 'booked'],
      ['Ivo', 2, 'Y', 99000, 'standard', 'booked'],
      ['Sofie', 1, 'J', 189500, 'flex', 'booked'],
    ]);
    expect(pax[1]).toMatchObject({ isChild: true, ssrCodes: ['CHLD', 'VGML'], frequentFlyerTier: null });
    expect(pax[0].frequentFlyerTier).toBe('gold');
    // 10:05 at +01:00 is 09:05 UTC (ISO 8601 offsets); the estimate starts at the schedule
    expect(pax[2]).toMatchObject({ inboundFlight: 'ZZ386', inboundScheduledArrival: new Date('2031-01-01T09:05:00Z'), inboundEstimatedArrival: new Date('2031-01-01T09:05:00Z') });

    const auditRow = await t.db.getRepository(AuditLogEntity).findOneByOrFail({ action: 'manifest.imported', entityType: 'flight', entityId: String(f.id) });
    expect(auditRow).toMatchObject({ stationId: station.id, after: { fileName: 'manifest.csv', rows: 3, bookings: 2, passengersCreated: 3, passengersCancelled: 0 } });
    await waitForForecast(f.id, before - 1000);
  });
});

describe('a file with problems', () => {
  it('lists every problem with its line and column, and an import of it stores nothing', async () => {
    const f = await makeFlight();
    const file = csv(
      csvRow(f, { pnr: 'BAD001', sequence: '1' }),
      csvRow(f, { pnr: 'BAD001', sequence: '2', fare_minor: '1895.00' }),
      csvRow(f, { pnr: 'BAD002', sequence: '1', cabin: 'F' }),
      csvRow({ ...f, flightNumber: '1' } as FlightEntity, { pnr: 'BAD003' }),
      csvRow(f, { pnr: 'BAD004', contact_email: 'not-an-address', inbound_scheduled_arrival: '2031-01-01 10:05' }),
    );
    const preview = manifestPreviewSchema.parse((await send(as.admin, 'preview', file).expect(200)).body);
    expect(preview.rows).toBe(5);
    // header = line 1, so the five passengers are on lines 2-6
    expect(preview.errors).toEqual([
      { line: 3, field: 'fare_minor', rule: 'fare_minor must be whole minor units, digits only (18950 for 189.50)' },
      { line: 4, field: 'cabin', rule: `flight ZZ${f.flightNumber} on ${f.serviceDate} has no cabin F (its cabins: J, Y)` },
      { line: 5, field: 'flight_number', rule: `no flight ZZ1 on ${f.serviceDate} departs from BGO` },
      { line: 6, field: 'inbound_scheduled_arrival', rule: 'inbound_scheduled_arrival must be an ISO 8601 date-time with an offset' },
      { line: 6, field: 'contact_email', rule: 'contact_email must be an e-mail address' },
    ]);

    const res = await send(as.admin, 'import', file).expect(400);
    const body = manifestRejectedSchema.parse(res.body);
    expect(body.error).toBe('manifest_invalid');
    expect(body.message).toBe('The manifest has 5 problems; nothing was imported.');
    expect(body.errors).toEqual(preview.errors);
    expect(body.details?.[0]).toEqual({ field: 'line 3: fare_minor', rule: preview.errors[0].rule });
    expect(await passengersOf(f.id)).toHaveLength(0);
    expect(await t.db.getRepository(BookingEntity).countBy({ flightId: f.id })).toBe(0);
  });

  it('refuses a manifest for a flight that has departed', async () => {
    const f = await makeFlight({ state: 'departed' });
    const res = await send(as.admin, 'import', csv(csvRow(f, {}))).expect(400);
    expect(res.body.errors).toEqual([{ line: 2, field: 'flight_number', rule: `flight ZZ${f.flightNumber} on ${f.serviceDate} is departed; its manifest can no longer change` }]);
  });

  it('names a broken header on line 1', async () => {
    const res = await send(as.admin, 'preview', 'flight,pnr\nZZ107,ABC123\n').expect(200);
    expect(res.body.rows).toBe(0);
    expect(res.body.errors).toEqual(expect.arrayContaining([{ line: 1, field: 'sequence', rule: 'column is missing from the header' }]));
  });
});

describe('a re-import of the same flight', () => {
  it('updates bookings and passengers in place, keeps check-in state, cancels who left the file, and never duplicates', async () => {
    const f = await makeFlight();
    const first = csv(
      csvRow(f, { pnr: 'REI001', sequence: '1', first_name: 'Ana' }),
      csvRow(f, { pnr: 'REI001', sequence: '2', first_name: 'Ben' }),
      csvRow(f, { pnr: 'REI002', sequence: '1', first_name: 'Cleo' }),
    );
    await send(as.admin, 'import', first).expect(200);
    const [ana, ben, cleo] = await passengersOf(f.id);
    // As the departure-control feed would record it: Ana checked in, Cleo boarded.
    const checkedInAt = new Date(Math.floor(Date.now() / 1000) * 1000 - 600_000);
    await t.db.getRepository(PassengerEntity).update({ id: ana.id }, { status: 'checked-in', checkedInAt, statusChangedAt: checkedInAt, seat: '12C' });
    await t.db.getRepository(PassengerEntity).update({ id: cleo.id }, { status: 'boarded', checkedInAt, boardedAt: checkedInAt, statusChangedAt: checkedInAt });

    const second = csv(
      csvRow(f, { pnr: 'REI001', sequence: '1', first_name: 'Ana Maria', fare_minor: '200000' }),
      csvRow(f, { pnr: 'REI002', sequence: '1', first_name: 'Cleo' }),
      csvRow(f, { pnr: 'REI003', sequence: '1', first_name: 'Dag' }),
    );
    const preview = manifestPreviewSchema.parse((await send(as.admin, 'preview', second).expect(200)).body);
    expect(preview.flights[0].willCancel).toBe(1); // Ben
    expect(preview.needsConfirmation).toBe(true);
    expect(preview.flights[0].diff).toMatchObject({ added: 1, changed: 1, removed: 1, unchanged: 1, addedNames: ['Dag Quill (REI003)'], changedNames: ['Ana Maria Quill (REI001)'], removedNames: ['Ben Quill (REI001)'] });
    // Without the confirmation nothing changes, and the refusal names the field and who would go.
    const refused = await send(as.admin, 'import', second).expect(400);
    expect(refused.body.details).toEqual([{ field: 'confirmRemovals', rule: expect.stringMatching(/cancels passengers \(1 from ZZ\d+ on /) }]);
    expect((await passengersOf(f.id)).map((p) => p.status)).toEqual(['checked-in', 'booked', 'boarded']);
    const result = manifestImportResultSchema.parse((await confirmed(second).expect(200)).body);
    expect(result.totals).toEqual({ bookingsCreated: 1, bookingsUpdated: 2, bookingsCancelled: 0, passengersCreated: 1, passengersUpdated: 2, passengersCancelled: 1 });

    const pax = await passengersOf(f.id);
    expect(pax).toHaveLength(4);
    const byId = new Map(pax.map((p) => [p.id, p]));
    expect(byId.get(ana.id)).toMatchObject({ firstName: 'Ana Maria', fareMinor: 200000, status: 'checked-in', checkedInAt, seat: '12C' });
    expect(byId.get(ben.id)).toMatchObject({ status: 'cancelled' });
    expect(byId.get(cleo.id)).toMatchObject({ status: 'boarded', boardedAt: checkedInAt });
    expect(pax.find((p) => p.firstName === 'Dag')).toMatchObject({ status: 'booked', pnrSequence: 1 });
    expect(await t.db.getRepository(BookingEntity).countBy({ flightId: f.id })).toBe(3);

    // The same file again changes nothing and adds no one.
    const again = manifestImportResultSchema.parse((await send(as.admin, 'import', second).expect(200)).body);
    expect(again.totals).toEqual({ bookingsCreated: 0, bookingsUpdated: 3, bookingsCancelled: 0, passengersCreated: 0, passengersUpdated: 3, passengersCancelled: 0 });
    expect(await passengersOf(f.id)).toHaveLength(4);

    // A booking that leaves the file entirely is cancelled with its passengers.
    const third = csv(csvRow(f, { pnr: 'REI001', sequence: '1', first_name: 'Ana Maria' }));
    const dropped = manifestImportResultSchema.parse((await confirmed(third).expect(200)).body);
    expect(dropped.totals).toMatchObject({ bookingsCancelled: 2, passengersCancelled: 2 });
    const bookings = await t.db.getRepository(BookingEntity).find({ where: { flightId: f.id }, order: { pnr: 'ASC' } });
    expect(bookings.map((b) => [b.pnr, b.status])).toEqual([['REI001', 'active'], ['REI002', 'cancelled'], ['REI003', 'cancelled']]);
  });
});

describe('limits and journeys', () => {
  it('refuses more bookings than capacity times the station’s maximum overbooking factor, naming both', async () => {
    // 24 seats × 1.5 (the default 15000 basis points) = 36 bookings at most (derived).
    const f = await makeFlight();
    const rows = (n: number) => Array.from({ length: n }, (_, i) => csvRow(f, { pnr: `LIM${String(Math.floor(i / 9)).padStart(3, '0')}`, sequence: String((i % 9) + 1), first_name: `P${i}` }));
    const res = await send(as.admin, 'import', csv(...rows(37))).expect(400);
    const body = manifestRejectedSchema.parse(res.body);
    expect(body.errors).toEqual([{ line: 2, field: 'flight_number', rule: expect.stringContaining('would hold 37 booked passengers; BGO allows at most 36 (24 seats × 1.5 maximum overbooking)') }]);
    expect(await passengersOf(f.id)).toHaveLength(0);
    await send(as.admin, 'import', csv(...rows(36))).expect(200);
  });

  it('stores each booking’s onward flights, and refuses ones that do not join this flight', async () => {
    const f = await makeFlight();
    const dep = new Date(f.scheduledArrival.getTime() + 2 * 3_600_000).toISOString();
    const arr = new Date(f.scheduledArrival.getTime() + 4 * 3_600_000).toISOString();
    const onward = `ZZ812 OSL-HAM ${dep} ${arr}`;
    const header = [...MANIFEST_COLUMNS, 'itinerary'].join(',');
    const withItinerary = (cell: string) => `${header}\r\n${csvRow(f, {})},${cell}\r\n`;
    await send(as.admin, 'import', withItinerary(onward)).expect(200);
    const booking = await t.db.getRepository(BookingEntity).findOneByOrFail({ flightId: f.id, pnr: 'MNF001' });
    expect(booking.itinerary).toEqual([{ carrier: 'ZZ', number: '812', origin: 'OSL', destination: 'HAM', departure: dep, arrival: arr }]);

    const wrongAirport = await send(as.admin, 'preview', withItinerary(`ZZ812 BGO-HAM ${dep} ${arr}`)).expect(200);
    expect(manifestPreviewSchema.parse(wrongAirport.body).errors).toEqual([{ line: 2, field: 'itinerary', rule: 'PNR MNF001: itinerary[0].origin: must be OSL, where the flight before it arrives (got BGO)' }]);
    const garbled = await send(as.admin, 'preview', withItinerary('to Hamburg tomorrow')).expect(200);
    expect(manifestPreviewSchema.parse(garbled.body).errors[0]).toMatchObject({ line: 2, field: 'itinerary', rule: expect.stringMatching(/^itinerary flight 1 must read like/) });
  });

  it('knows the fare types the compensation rules read, and refuses others', async () => {
    const f = await makeFlight();
    const res = await send(as.admin, 'preview', csv(csvRow(f, { fare_type: 'promo' }))).expect(200);
    expect(manifestPreviewSchema.parse(res.body).errors).toEqual([{ line: 2, field: 'fare_type', rule: 'fare_type must be one of standard, flex, award, staff, free' }]);
  });
});

describe('the file itself', () => {
  it('refuses a file over 2 MB, naming the rule', async () => {
    const res = await send(as.admin, 'preview', 'x'.repeat(2 * 1024 * 1024 + 1)).expect(400);
    expect(res.body.details).toEqual([{ field: 'file', rule: 'must be at most 2 MB' }]);
  });

  it('refuses a file that is not CSV by type or name', async () => {
    const res = await send(as.admin, 'import', csv(), 'manifest.txt', 'text/plain').expect(400);
    expect(res.body.details).toEqual([{ field: 'file', rule: 'must be a CSV file (text/csv or a name ending in .csv)' }]);
    // a .csv name is enough: some systems label CSV as a spreadsheet type
    await send(as.admin, 'preview', csv(csvRow({ carrierCode: 'ZZ', flightNumber: '1', serviceDate: '2031-01-01' } as FlightEntity, {})), 'export.CSV', 'application/vnd.ms-excel').expect(200);
  });

  it('asks for the file when none is sent, and for UTF-8 text', async () => {
    const none = await as.admin.post(url(station.id, 'preview')).expect(400);
    expect(none.body.details).toEqual([{ field: 'file', rule: 'is required, as a CSV in the multipart field "file"' }]);
    const latin1 = await upload(as.admin, url(station.id, 'preview'), { name: 'm.csv', content: Buffer.from([0x66, 0x69, 0x72, 0x73, 0x74, 0xe9, 0x0a]) }).expect(400);
    expect(latin1.body.details[0]).toMatchObject({ field: 'file', rule: 'must be UTF-8 text (save the CSV as UTF-8)' });
    const wrongField = await upload(as.admin, url(station.id, 'preview'), { field: 'manifest', name: 'm.csv', content: csv() }).expect(400);
    expect(wrongField.body.details).toEqual([{ field: 'file', rule: 'must be sent in the multipart field "file"' }]);
  });
});

describe('who may', () => {
  it('lets only admins of the station use it: 401 signed out, 403 for agent and supervisor, 404 for another station', async () => {
    const anon = new Client(t.app);
    await anon.refreshCsrf();
    await upload(anon, url(station.id, 'preview'), { name: 'm.csv', content: csv() }).expect(401);
    for (const role of ['agent', 'supervisor'] as const) {
      await as[role].get(url(station.id, 'template')).expect(403);
      await send(as[role], 'preview', csv()).expect(403);
      await send(as[role], 'import', csv()).expect(403);
    }
    // The admin of this run belongs to the test station only, so BOS is another station to them.
    await as.admin.get(url(bos, 'template')).expect(404);
    await upload(as.admin, url(bos, 'import'), { name: 'm.csv', content: csv() }).expect(404);
  });

  it('checks the upload is CSRF-protected like every other change', async () => {
    await as.admin.agent.post(url(station.id, 'preview')).attach('file', Buffer.from(csv()), { filename: 'm.csv', contentType: 'text/csv' }).expect(403);
  });
});

describe('seats', () => {
  it('stores a seat the file gives, keeps the one check-in gave when the cell is empty, and names the rule for a bad one', async () => {
    const f = await makeFlight();
    const header = [...MANIFEST_COLUMNS, 'seat'].join(',');
    const file = (first: string, second: string) =>
      `${header}\r\n${csvRow(f, { pnr: 'SEAT01', sequence: '1' })},${first}\r\n${csvRow(f, { pnr: 'SEAT01', sequence: '2', first_name: 'Ola' })},${second}\r\n`;
    await send(as.admin, 'import', file('14c', '')).expect(200);
    expect((await passengersOf(f.id)).map((p) => p.seat)).toEqual(['14C', null]);
    // Check-in seated the second passenger; a later export without a seat for them keeps it.
    await t.db.query(`UPDATE passengers SET seat = '15A' WHERE flight_id = ? AND pnr_sequence = 2`, [f.id]);
    await send(as.admin, 'import', file('14D', '')).expect(200);
    expect((await passengersOf(f.id)).map((p) => p.seat)).toEqual(['14D', '15A']);
    const preview = manifestPreviewSchema.parse((await send(as.admin, 'preview', file('aisle', '')).expect(200)).body);
    expect(preview.errors).toEqual([{ line: 2, field: 'seat', rule: 'seat must be a row number and a seat letter A-K (14C), or empty' }]);
  });
});
