// A time typed for an airport is read on that airport's clock, whatever zone the browser is in: a supervisor in Tokyo
// and one in Los Angeles rebook a denied passenger on another carrier's flight, typing the arrival in Chicago time,
// and both get the same planned delay and the same band.
// Needs: the app at APP_BASE_URL and DATABASE_URL of the same database (the test writes its own BOS-ORD flights,
// 8xxx on a far-off date, and removes them afterwards).
// Outside sources: the IANA time zone database (America/Chicago is UTC-6 in winter, UTC-5 in summer); 14 CFR
// 250.5(a)(2): a domestic alternate more than 1 h and less than 2 h late -> 200 % of the one-way fare.
import { expect, test, type Browser } from '@playwright/test';
import mysql from 'mysql2/promise';
import { DEMO_PASSWORD, removeTestFlights, shot } from './helpers';

const DATABASE_URL = process.env.DATABASE_URL ?? '';
const RUN = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`.toUpperCase().replace(/[^A-Z0-9]/g, 'X');
let db: mysql.Connection;

/** As the shared sign-in, with more patience: two browsers sign in back to back on a busy machine. */
async function signIn(page: import('@playwright/test').Page, email: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('button', { name: 'Sign out' })).toBeVisible({ timeout: 20_000 });
}
const flightIds: number[] = [];

/** "YYYY-MM-DDTHH:mm" of an instant on an airport's clock, as a person there would type it. */
function wallClock(at: Date, timeZone: string): string {
  const parts = Object.fromEntries(new Intl.DateTimeFormat('en-CA', { timeZone, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit' }).formatToParts(at).map((p) => [p.type, p.value]));
  return `${parts.year}-${parts.month}-${parts.day}T${parts.hour}:${parts.minute}`;
}

/** A BOS-ORD flight of 30 seats with 31 checked in; the last to check in is proposed and authorized through the API. */
async function deniedCase(tag: string) {
  const [[station]] = await db.query<mysql.RowDataPacket[]>(`SELECT id FROM stations WHERE iata = 'BOS'`);
  const departure = new Date(Date.now() + (100 + Math.floor(Math.random() * 600)) * 86_400_000);
  departure.setUTCHours(15, 0, 0, 0);
  const arrival = new Date(departure.getTime() + 165 * 60_000);
  const number = String(8000 + Math.floor(Math.random() * 1000));
  const [flight] = await db.execute<mysql.ResultSetHeader>(
    `INSERT INTO flights (station_id, carrier_code, flight_number, service_date, origin, destination, scheduled_departure, scheduled_arrival, aircraft_type, seats_by_cabin, gate, state)
     VALUES (?, 'ZZ', ?, ?, 'BOS', 'ORD', ?, ?, '320', '{"Y":30}', 'B9', 'check-in-open')`,
    [station.id, number, departure.toISOString().slice(0, 10), departure, arrival],
  );
  flightIds.push(flight.insertId);
  for (let i = 1; i <= 31; i++) {
    const [b] = await db.execute<mysql.ResultSetHeader>(`INSERT INTO bookings (flight_id, pnr, contact_email, travels_together, status) VALUES (?, ?, NULL, 1, 'active')`, [flight.insertId, `${tag}${String(i).padStart(2, '0')}`.slice(0, 8)]);
    const checkedIn = new Date(departure.getTime() - (i === 31 ? 45 : 200 - i) * 60_000);
    await db.execute(
      `INSERT INTO passengers (booking_id, flight_id, pnr_sequence, first_name, last_name, cabin, fare_minor, fare_currency, fare_type, ssr_codes, is_child, status, checked_in_at, status_changed_at)
       VALUES (?, ?, 1, ?, ?, 'Y', 24900, 'USD', 'standard', '[]', 0, 'checked-in', ?, ?)`,
      [b.insertId, flight.insertId, i === 31 ? 'Tomo' : 'Early', i === 31 ? 'Zoneless' : `Passenger${i}`, checkedIn, checkedIn],
    );
  }
  return { flightId: flight.insertId, label: `ZZ ${number}`, arrival };
}

test.beforeAll(async () => {
  expect(DATABASE_URL, 'DATABASE_URL of the database the app uses').not.toBe('');
  db = await mysql.createConnection({ uri: DATABASE_URL.replace(/^mariadb:/, 'mysql:'), timezone: 'Z' });
});
test.afterAll(async () => {
  if (flightIds.length) {
    await removeTestFlights(db, flightIds);
  }
  await db?.end();
});

async function rebookFrom(browser: Browser, browserZone: string, tag: string) {
  const c = await deniedCase(tag);
  const context = await browser.newContext({ timezoneId: browserZone });
  const page = await context.newPage();
  // The browser's own clock really is elsewhere.
  expect(await page.evaluate(() => Intl.DateTimeFormat().resolvedOptions().timeZone)).toBe(browserZone);
  await signIn(page, 'agent@bumpboard.test');
  await page.goto(`/flights/${c.flightId}`);
  const form = page.getByRole('form', { name: 'Propose denials' });
  await form.getByLabel('Reason').fill('1 short at the gate');
  await form.getByRole('button', { name: 'Propose denials' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Proposed: 1 seat in 1 booking' })).toBeVisible({ timeout: 20_000 });
  await context.close();

  const supervisor = await browser.newContext({ timezoneId: browserZone });
  const sp = await supervisor.newPage();
  await signIn(sp, 'supervisor@bumpboard.test');
  await sp.goto(`/flights/${c.flightId}/bump-review`);
  const proposal = sp.getByRole('article', { name: /^Proposal \d+$/ });
  await proposal.getByRole('button', { name: 'Authorize all (1)' }).click();
  await expect(proposal.locator('[data-proposal-status="authorized"]')).toBeVisible();
  const rebook = proposal.getByLabel(/^Rebook /);
  await rebook.getByText('Another carrier’s flight').click();
  await rebook.getByLabel('Carrier').fill('QQ');
  await rebook.getByLabel('Number').fill('321');
  // Typed on each airport's clock: leaves Boston 30 min after the original, lands in Chicago 90 min after it.
  await rebook.getByLabel(/^Departs · this station local time/).fill(wallClock(new Date(c.arrival.getTime() - 135 * 60_000), 'America/New_York'));
  await rebook.getByLabel(/^Arrives · ORD local time/).fill(wallClock(new Date(c.arrival.getTime() + 90 * 60_000), 'America/Chicago'));
  await expect(rebook.getByText(/Read in America\/Chicago \(C[DS]T\)/)).toBeVisible();
  await shot(sp, `airport-times-${browserZone.replace('/', '-')}`);
  await rebook.getByRole('button', { name: 'Rebook on this flight' }).click();
  await expect(proposal.getByText('Compensation (fixed):')).toBeVisible();
  // 200 % of USD 249.00 = USD 498.00, the band of an arrival 1 h 30 min late (14 CFR 250.5(a)(2)).
  await expect(proposal.getByRole('cell', { name: '$498.00' })).toBeVisible();
  const [[row]] = await db.query<mysql.RowDataPacket[]>(
    `SELECT r.planned_arrival_delay_minutes AS delay FROM rebookings r JOIN denials d ON d.id = r.denial_id WHERE d.flight_id = ?`, [c.flightId]);
  expect(row.delay).toBe(90);
  await supervisor.close();
}

test('a supervisor whose browser is in Tokyo types the Chicago arrival on Chicago’s clock', async ({ browser }) => {
  await rebookFrom(browser, 'Asia/Tokyo', `T${RUN.slice(-4)}`);
});

test('and so does one whose browser is in Los Angeles', async ({ browser }) => {
  await rebookFrom(browser, 'America/Los_Angeles', `L${RUN.slice(-4)}`);
});
