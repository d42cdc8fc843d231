// The passenger's own payment pages on a phone: the full card details from the receipt's single-use link, shown
// once, and the bank account for a transfer entered from the payout link. Both links come from the mail catcher,
// as the passenger would get them.
// Needs: the app at APP_BASE_URL with the payments stand-in (STRIPE_API_URL), the mail catcher (MAIL_FAKE_URL), and
// DATABASE_URL of the same database: the test writes its own flight on a far-off date with two compensations,
// one a prepaid card and one a bank transfer, which an agent issues through the API. Stripe's test routing number
// 110000000 (from memory) passes the ABA check.
import { expect, request, test, type APIRequestContext } from '@playwright/test';
import mysql from 'mysql2/promise';
import { CATALOGUES } from '../../shared/i18n/catalogues';
import { LANGUAGES, type Language } from '../../shared/i18n/languages';
import { DEMO_PASSWORD, mailFromCatcher, removeTestFlights, SCREENSHOTS } from './helpers';

const BASE_URL = process.env.APP_BASE_URL ?? 'http://127.0.0.1:4700';
const DATABASE_URL = process.env.DATABASE_URL ?? '';
const RUN = Date.now() % 1_000_000;
const SERVICE_DATE = `2034-0${1 + (RUN % 9)}-${String(10 + (RUN % 18)).padStart(2, '0')}`;
const PHONE = { width: 390, height: 844 };

let db: mysql.Connection;
let flightId: number;
const people = {
  card: { pnr: `C${RUN}`.slice(0, 8), lastName: 'Cardwell', email: `payout-e2e-card-${RUN}@example.test`, medium: 'prepaid-card', id: 0 },
  transfer: { pnr: `T${RUN}`.slice(0, 8), lastName: 'Banksley', email: `payout-e2e-transfer-${RUN}@example.test`, medium: 'bank-transfer', id: 0 },
};

async function agentApi(): Promise<{ api: APIRequestContext; csrf: string }> {
  const api = await request.newContext({ baseURL: BASE_URL });
  const session = await (await api.get('/api/auth/session')).json();
  const res = await api.post('/api/auth/sign-in', { headers: { 'X-CSRF-Token': session.csrfToken }, data: { email: 'agent@bumpboard.test', password: DEMO_PASSWORD } });
  expect(res.ok()).toBe(true);
  return { api, csrf: (await res.json()).csrfToken };
}

test.beforeAll(async () => {
  test.skip(!DATABASE_URL, 'DATABASE_URL is needed to make the test flight');
  db = await mysql.createConnection(DATABASE_URL.replace(/^mariadb:/, 'mysql:'));
  const [[bos]] = await db.query<mysql.RowDataPacket[]>("SELECT id FROM stations WHERE iata = 'BOS'");
  const departure = new Date(`${SERVICE_DATE}T14:00:00Z`);
  const [flight] = await db.execute<mysql.ResultSetHeader>(
    `INSERT INTO flights (station_id, carrier_code, flight_number, service_date, origin, destination, scheduled_departure, scheduled_arrival, aircraft_type, seats_by_cabin, gate, state)
     VALUES (?, 'ZZ', ?, ?, 'BOS', 'ORD', ?, ?, '320', '{"Y":150}', 'B6', 'departed')`,
    [bos.id, String(6000 + (RUN % 1000)), SERVICE_DATE, departure, new Date(departure.getTime() + 3 * 3_600_000)],
  );
  flightId = flight.insertId;
  const { api, csrf } = await agentApi();
  let i = 0;
  for (const who of Object.values(people)) {
    i += 1;
    const [booking] = await db.execute<mysql.ResultSetHeader>(`INSERT INTO bookings (flight_id, pnr, contact_email, travels_together, status) VALUES (?, ?, ?, 1, 'active')`, [flightId, who.pnr, who.email]);
    const [passenger] = await db.execute<mysql.ResultSetHeader>(
      `INSERT INTO passengers (booking_id, flight_id, pnr_sequence, first_name, last_name, cabin, fare_minor, fare_currency, fare_type, ssr_codes, is_child, status)
       VALUES (?, ?, 1, 'Ana', ?, 'Y', 31000, 'USD', 'standard', '[]', 0, 'boarded')`,
      [booking.insertId, flightId, who.lastName],
    );
    const [comp] = await db.execute<mysql.ResultSetHeader>(
      `INSERT INTO compensations (station_id, flight_id, booking_id, passenger_id, source_kind, source_id, regime, voluntary, amount_minor, currency, band, rule_ref, explanation, state, medium)
       VALUES (?, ?, ?, ?, 'volunteer', ?, 'us-dot', 1, 45000, 'USD', 'posted offer', 'agreed with the volunteer', 'Volunteered (end-to-end test).', 'due', ?)`,
      [bos.id, flightId, booking.insertId, passenger.insertId, 1_800_000_000 + RUN * 10 + i, who.medium],
    );
    who.id = comp.insertId;
    expect((await api.post(`/api/compensations/${who.id}/issue`, { headers: { 'X-CSRF-Token': csrf } })).ok()).toBe(true);
  }
  await api.dispose();
});

test.afterAll(async () => {
  if (!db) return;
  if (flightId) await removeTestFlights(db, [flightId]);
  await db.end();
});

const linkIn = (text: string, page: 'card' | 'payout') => new RegExp(`${BASE_URL.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}/${page}/[\\w-]+`).exec(text)?.[0];

test('the passenger sees the card details once on their phone; a second open gets a clear page', async ({ browser }) => {
  const who = people.card;
  const url = await mailFromCatcher(`to=${encodeURIComponent(who.email)}`, (messages) => messages.map((m) => linkIn(m.text, 'card')).find(Boolean), 'the receipt with the card link');
  const page = await (await browser.newContext({ viewport: PHONE, isMobile: true, hasTouch: true })).newPage();
  await page.goto(url);
  await expect(page.getByRole('heading', { name: 'Confirm it is you' })).toBeVisible();
  await expect(page.getByTestId('passenger-caution')).toContainText('rules');
  await page.getByLabel('Booking reference').fill(who.pnr);
  await page.getByLabel('Last name').fill('Somebody');
  await page.getByRole('button', { name: 'Show my card details' }).click();
  await expect(page.getByRole('alert')).toContainText('do not match');
  await page.getByLabel('Last name').fill(who.lastName);
  await page.screenshot({ path: `${SCREENSHOTS}/payout-card-proof.png`, fullPage: true });
  await page.getByRole('button', { name: 'Show my card details' }).click();
  await expect(page.getByTestId('card-number')).toHaveText(/^\d{4} \d{4} \d{4} \d{4}$/);
  await page.screenshot({ path: `${SCREENSHOTS}/payout-card-details.png`, fullPage: true });

  await page.reload();
  await expect(page.getByTestId('link-problem')).toContainText('already been used');
  await expect(page.getByTestId('card-number')).toHaveCount(0);
  await page.screenshot({ path: `${SCREENSHOTS}/payout-card-used.png`, fullPage: true });
});

// Only reads the link's state, so the same link serves every language before the passenger sends anything.
const BROWSER_LOCALE: Record<Language, string> = { en: 'en-US', fr: 'fr-CA', es: 'es-ES', de: 'de-DE', it: 'it-IT' };
test('the payout page speaks the browser’s language, and the passenger can switch it', async ({ browser }) => {
  const who = people.transfer;
  const url = await mailFromCatcher(`to=${encodeURIComponent(who.email)}`, (messages) => messages.map((m) => linkIn(m.text, 'payout')).find(Boolean), 'the payout link');
  for (const language of LANGUAGES) {
    const context = await browser.newContext({ viewport: PHONE, isMobile: true, hasTouch: true, locale: BROWSER_LOCALE[language] });
    try {
      const page = await context.newPage();
      await page.goto(url);
      const words = CATALOGUES[language];
      await expect(page.getByRole('heading', { name: words['payout.accountTitle'] })).toBeVisible();
      await expect(page.getByText(words['payout.title'], { exact: true })).toBeVisible();
      await expect(page.getByTestId('passenger-caution')).toHaveText(words['paylink.caution']);
      expect(await page.evaluate(() => document.documentElement.lang)).toBe(language);
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
      await page.screenshot({ path: `${SCREENSHOTS}/languages-payout-${language}.png`, fullPage: true });
      if (language === 'en') {
        await page.getByTestId('language-switch').selectOption('fr');
        await expect(page.getByRole('button', { name: CATALOGUES.fr['payout.send'] })).toBeVisible();
      }
    } finally {
      await context.close();
    }
  }
});

test('the passenger enters their own bank account from the payout link and the transfer leaves', async ({ browser }) => {
  const who = people.transfer;
  const url = await mailFromCatcher(`to=${encodeURIComponent(who.email)}`, (messages) => messages.map((m) => linkIn(m.text, 'payout')).find(Boolean), 'the payout link');
  const page = await (await browser.newContext({ viewport: PHONE, isMobile: true, hasTouch: true })).newPage();
  await page.goto(url);
  await expect(page.getByRole('heading', { name: 'Your bank account (United States)' })).toBeVisible();
  await page.getByLabel('Booking reference').fill(who.pnr);
  await page.getByLabel('Last name', { exact: true }).fill(who.lastName);
  await page.getByLabel('Name of the account holder').fill('Ana Banksley');
  await page.getByLabel('Routing number (9 digits)').fill('110000001');
  await page.getByLabel('Account number', { exact: true }).fill('000123456789');
  await page.getByLabel('Account number again').fill('000123456780');
  await page.getByRole('button', { name: 'Send my compensation to this account' }).click();
  await expect(page.getByText('check digit')).toBeVisible();
  await expect(page.getByText('the two account numbers must be the same')).toBeVisible();
  await page.screenshot({ path: `${SCREENSHOTS}/payout-account-errors.png`, fullPage: true });

  await page.getByLabel('Routing number (9 digits)').fill('110000000');
  await page.getByLabel('Account number again').fill('000123456789');
  await page.getByRole('button', { name: 'Send my compensation to this account' }).click();
  await expect(page.getByTestId('payout-done')).toContainText('ending 6789');
  await page.screenshot({ path: `${SCREENSHOTS}/payout-account-done.png`, fullPage: true });
  await expect.poll(async () => {
    const [[row]] = await db.query<mysql.RowDataPacket[]>('SELECT state FROM compensations WHERE id = ?', [who.id]);
    return row.state;
  }, { timeout: 20_000 }).toBe('issued');

  await page.reload();
  await expect(page.getByTestId('link-problem')).toContainText('ending 6789');
});
