// Each way of paying a compensation, end to end on a flight of the spec's own: cash handed over at the counter with
// the receipt signed on the desk's screen; a bank transfer whose account the passenger enters on their own phone
// from the payout link (the desk first mails a new link, and the old one stops working); a prepaid card whose full
// details are shown once on the passenger's phone, after which the link is spent and the desk offers no new one.
// Needs: the app at APP_BASE_URL with the payments stand-in, the mail catcher (MAIL_FAKE_URL) and DATABASE_URL of
// the same database. Stripe's test routing number 110000000 passes the ABA check (from memory).
import { expect, test, type Browser, type Page } from '@playwright/test';
import mysql from 'mysql2/promise';
import { mailFromCatcher, SCREENSHOTS, signIn, staffApi } from './helpers';
import { ownFlight, type OwnFlight } from './own-flight';

const BASE_URL = process.env.APP_BASE_URL ?? 'http://127.0.0.1:4700';
const DATABASE_URL = process.env.DATABASE_URL ?? '';
const PHONE = { width: 390, height: 844 };

interface Payee { medium: 'cash' | 'bank-transfer' | 'prepaid-card'; id: number; pnr: string; lastName: string; email: string }
let flight: OwnFlight;
let db: mysql.Connection;
const payees: Record<Payee['medium'], Payee> = {} as Record<Payee['medium'], Payee>;

test.beforeAll(async () => {
  test.skip(!DATABASE_URL, 'DATABASE_URL is needed to make the test flight');
  flight = await ownFlight('media', { checkedIn: 3 });
  db = await mysql.createConnection({ uri: DATABASE_URL.replace(/^mariadb:/, 'mysql:'), timezone: 'Z' });
  const [people] = await db.query<mysql.RowDataPacket[]>(
    'SELECT p.id, p.booking_id, p.last_name, b.pnr, b.contact_email, f.station_id FROM passengers p JOIN bookings b ON b.id = p.booking_id JOIN flights f ON f.id = p.flight_id WHERE p.flight_id = ? ORDER BY p.id',
    [flight.flightId],
  );
  const media: Payee['medium'][] = ['cash', 'bank-transfer', 'prepaid-card'];
  for (const [i, medium] of media.entries()) {
    const p = people[i];
    // A volunteer's agreed amount under the US rule (voluntary: the passenger chose it; no agreement form needed).
    const [comp] = await db.execute<mysql.ResultSetHeader>(
      `INSERT INTO compensations (station_id, flight_id, booking_id, passenger_id, source_kind, source_id, regime, voluntary, amount_minor, currency, band, rule_ref, explanation, state, medium)
       VALUES (?, ?, ?, ?, 'volunteer', ?, 'us-dot', 1, 40000, 'USD', 'posted offer', 'agreed with the volunteer', 'Volunteered (end-to-end test).', 'due', ?)`,
      [p.station_id, flight.flightId, p.booking_id, p.id, 1_900_000_000 + (flight.flightId % 1_000_000) * 10 + i, medium],
    );
    payees[medium] = { medium, id: comp.insertId, pnr: p.pnr, lastName: p.last_name, email: p.contact_email };
  }
  const agent = await staffApi('agent@bumpboard.test');
  try {
    for (const medium of ['bank-transfer', 'prepaid-card'] as const) expect((await agent.post(`/compensations/${payees[medium].id}/issue`)).status).toBe(200);
  } finally {
    await agent.dispose();
  }
});

test.afterAll(async () => {
  await db?.end();
  await flight?.remove();
});

const escaped = BASE_URL.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
const linksIn = (texts: string[], page: 'card' | 'payout') => texts.flatMap((t) => t.match(new RegExp(`${escaped}/${page}/[\\w-]+`, 'g')) ?? []);

async function deskRow(page: Page, who: Payee) {
  await page.goto(`/flights/${flight.flightId}`);
  await expect(page.getByRole('heading', { level: 1, name: flight.label })).toBeVisible();
  return page.getByTestId('desk-compensations').locator(`[data-testid="compensation-row"][data-pnr="${who.pnr}"]`);
}

const phone = async (browser: Browser) => (await browser.newContext({ viewport: PHONE, isMobile: true, hasTouch: true })).newPage();

test('cash at the counter: the drawer, the passenger signs on the desk’s screen, the receipt', async ({ page }) => {
  const who = payees.cash;
  await signIn(page, 'agent@bumpboard.test');
  const row = await deskRow(page, who);
  await expect(row).toHaveAttribute('data-state', 'due');
  const form = row.getByTestId('counter-payment-form');
  await form.getByLabel('Drawer the cash comes from').fill('D-07');
  // Without a signature the payment is refused, naming what is missing; nothing is recorded.
  await form.getByRole('button', { name: /^Record .* paid and signed for$/ }).click();
  await expect(form.getByRole('alert')).toContainText(/signature/i);
  await expect(row).toHaveAttribute('data-state', 'due');

  const pad = form.getByTestId('signature-pad');
  await pad.scrollIntoViewIfNeeded();
  const box = (await pad.boundingBox())!;
  await page.mouse.move(box.x + 20, box.y + box.height * 0.7);
  await page.mouse.down();
  for (let step = 1; step <= 12; step += 1) await page.mouse.move(box.x + 20 + step * 18, box.y + box.height * (0.7 - 0.4 * Math.abs(Math.sin(step / 2))), { steps: 2 });
  await page.mouse.up();
  await row.screenshot({ path: `${SCREENSHOTS}/payment-media-cash-signed.png` });
  await form.getByRole('button', { name: /^Record .* paid and signed for$/ }).click();
  await expect(row).toHaveAttribute('data-state', 'settled');
  await expect(row.getByTestId('passenger-link')).toHaveCount(0); // paid at the counter: no passenger link
  await row.getByRole('button', { name: 'Show the receipt' }).click();
  const receipt = page.getByRole('dialog');
  await expect(receipt).toContainText('D-07');
  await expect(receipt.locator('img')).toBeVisible(); // the passenger's signature, printed into the receipt
  await receipt.screenshot({ path: `${SCREENSHOTS}/payment-media-cash-receipt.png` });
});

test('a bank transfer: the desk mails a new payout link, the old one stops working, the passenger gives the account on it', async ({ page, browser }) => {
  const who = payees['bank-transfer'];
  const first = await mailFromCatcher(`to=${encodeURIComponent(who.email)}`, (messages) => linksIn(messages.map((m) => m.text), 'payout')[0], 'the payout link');

  await signIn(page, 'agent@bumpboard.test');
  const row = await deskRow(page, who);
  const link = row.getByTestId('passenger-link');
  await expect(link).toContainText('payout link');
  await link.getByRole('button', { name: 'Mail the passenger a new link' }).click();
  await expect(link.getByRole('status')).toContainText('The old one no longer works');
  await row.screenshot({ path: `${SCREENSHOTS}/payment-media-new-link.png` });
  const fresh = await mailFromCatcher(`to=${encodeURIComponent(who.email)}`, (messages) => linksIn(messages.map((m) => m.text), 'payout').find((url) => url !== first), 'the new payout link');

  const mobile = await phone(browser);
  await mobile.goto(first);
  await expect(mobile.getByTestId('link-problem')).toContainText('expired');
  await mobile.goto(fresh);
  await expect(mobile.getByRole('heading', { name: 'Your bank account (United States)' })).toBeVisible();
  await mobile.getByLabel('Booking reference').fill(who.pnr);
  await mobile.getByLabel('Last name', { exact: true }).fill(who.lastName);
  await mobile.getByLabel('Name of the account holder').fill('Ana Tester');
  await mobile.getByLabel('Routing number (9 digits)').fill('110000000');
  await mobile.getByLabel('Account number', { exact: true }).fill('000123454321');
  await mobile.getByLabel('Account number again').fill('000123454321');
  await mobile.getByRole('button', { name: 'Send my compensation to this account' }).click();
  await expect(mobile.getByTestId('payout-done')).toContainText('ending 4321');
  await mobile.screenshot({ path: `${SCREENSHOTS}/payment-media-transfer-done.png`, fullPage: true });
  await expect.poll(async () => {
    const [[comp]] = await db.query<mysql.RowDataPacket[]>('SELECT state FROM compensations WHERE id = ?', [who.id]);
    return comp.state;
  }, { timeout: 20_000 }).toMatch(/^(issued|settled)$/);
  await mobile.context().close();

  // The account is in: the desk no longer offers a new link.
  await page.reload();
  await expect(row.getByTestId('passenger-link')).toContainText('has done its job');
  await expect(row.getByRole('button', { name: 'Mail the passenger a new link' })).toHaveCount(0);
});

test('a prepaid card: its details shown once on the passenger’s phone, then the link is spent', async ({ page, browser }) => {
  const who = payees['prepaid-card'];
  const url = await mailFromCatcher(`to=${encodeURIComponent(who.email)}`, (messages) => linksIn(messages.map((m) => m.text), 'card')[0], 'the card link');
  const mobile = await phone(browser);
  await mobile.goto(url);
  await mobile.getByLabel('Booking reference').fill(who.pnr);
  await mobile.getByLabel('Last name').fill(who.lastName);
  await mobile.getByRole('button', { name: 'Show my card details' }).click();
  await expect(mobile.getByTestId('card-number')).toHaveText(/^\d{4} \d{4} \d{4} \d{4}$/);
  const number = (await mobile.getByTestId('card-number').textContent())!.replace(/\s/g, '');
  await mobile.screenshot({ path: `${SCREENSHOTS}/payment-media-card-shown.png`, fullPage: true });
  await mobile.reload();
  await expect(mobile.getByTestId('link-problem')).toContainText('already been used');
  await expect(mobile.getByTestId('card-number')).toHaveCount(0);
  await mobile.context().close();

  await signIn(page, 'agent@bumpboard.test');
  const row = await deskRow(page, who);
  await expect(row.getByTestId('passenger-link')).toContainText('has done its job');
  await expect(row.getByRole('button', { name: 'Mail the passenger a new link' })).toHaveCount(0);
  await expect(row).not.toContainText(number); // never on a staff screen
  await row.screenshot({ path: `${SCREENSHOTS}/payment-media-card-desk.png` });
});
