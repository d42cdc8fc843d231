// An agent proposes an involuntary denial on the flight desk, a supervisor in another browser authorizes it in the
// bump review and rebooks the passenger, and the passenger's written statement arrives in the mail catcher.
// Needs: the app at APP_BASE_URL with its outbox worker sending to the catcher at MAIL_FAKE_URL, and DATABASE_URL of
// the same database (the test writes its own flight, 8xxx on a far-off date, and removes it afterwards).
import { expect, test, type Browser, type Page } from '@playwright/test';
import mysql from 'mysql2/promise';
import { SCREENSHOTS, mailFromCatcher, removeTestFlights, shot, signIn, staffApi } from './helpers';

const DATABASE_URL = process.env.DATABASE_URL ?? '';
const RUN = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;

interface Fixture {
  flightId: number;
  alternateId: number;
  label: string;
  alternateLabel: string;
  /** Booking contact of the passenger who checked in last: the one the default rules select first. */
  lastEmail: string;
  lastName: string;
}

let db: mysql.Connection;
let fixture: Fixture;

async function insertFlight(stationId: number, number: string, departure: Date, seats: number): Promise<number> {
  const arrival = new Date(departure.getTime() + 165 * 60_000);
  const [res] = await db.execute<mysql.ResultSetHeader>(
    `INSERT INTO flights (station_id, carrier_code, flight_number, service_date, origin, destination, scheduled_departure, scheduled_arrival, aircraft_type, seats_by_cabin, gate, state)
     VALUES (?, 'ZZ', ?, ?, 'BOS', 'ORD', ?, ?, '320', ?, 'B9', 'check-in-open')`,
    [stationId, number, departure.toISOString().slice(0, 10), departure, arrival, JSON.stringify({ Y: seats })],
  );
  return res.insertId;
}

async function insertSingle(flightId: number, pnr: string, first: string, last: string, checkedInAt: Date, email: string) {
  const [booking] = await db.execute<mysql.ResultSetHeader>(`INSERT INTO bookings (flight_id, pnr, contact_email, travels_together, status) VALUES (?, ?, ?, 1, 'active')`, [flightId, pnr, email]);
  await db.execute(
    `INSERT INTO passengers (booking_id, flight_id, pnr_sequence, first_name, last_name, cabin, fare_minor, fare_currency, fare_type, ssr_codes, is_child, status, checked_in_at, status_changed_at)
     VALUES (?, ?, 1, ?, ?, 'Y', 24900, 'USD', 'standard', '[]', 0, 'checked-in', ?, ?)`,
    [booking.insertId, flightId, first, last, checkedInAt, checkedInAt],
  );
}

/**
 * A BOS-ORD flight of 30 seats (the smallest aircraft 14 CFR 250.2 covers) with 31 checked in, and a later flight with
 * room: one seat short, one alternate.
 */
async function createFixture(): Promise<Fixture> {
  const [[station]] = await db.query<mysql.RowDataPacket[]>(`SELECT id FROM stations WHERE iata = 'BOS'`);
  const departure = new Date(Date.now() + (100 + Math.floor(Math.random() * 600)) * 86_400_000);
  departure.setUTCHours(15, 0, 0, 0);
  const number = String(8000 + Math.floor(Math.random() * 1000));
  const flightId = await insertFlight(station.id, number, departure, 30);
  const alternateNumber = String(8000 + ((Number(number) - 8000 + 500) % 1000));
  const alternateId = await insertFlight(station.id, alternateNumber, new Date(departure.getTime() + 4 * 3_600_000), 150);
  const pnr = (i: number) => `E${RUN.slice(-4).toUpperCase()}${String(i).padStart(2, '0')}`.replace(/[^A-Z0-9]/g, 'X').slice(0, 8);
  const email = (i: number) => `e2e-bump-${RUN}-${i}@passengers.bumpboard.test`;
  for (let i = 1; i <= 30; i++) {
    await insertSingle(flightId, pnr(i), 'Early', `Passenger${String.fromCharCode(64 + ((i - 1) % 26) + 1)}${i}`, new Date(departure.getTime() - (200 - i) * 60_000), email(i));
  }
  await insertSingle(flightId, pnr(31), 'Lena', 'Lastcheck', new Date(departure.getTime() - 45 * 60_000), email(31));
  return { flightId, alternateId, label: `ZZ ${number}`, alternateLabel: `ZZ ${alternateNumber}`, lastEmail: email(31), lastName: 'Lena Lastcheck' };
}

async function removeFixture(f: Fixture) {
  const ids = [f.flightId, f.alternateId];
  await removeTestFlights(db, ids);
}

test.beforeAll(async () => {
  expect(DATABASE_URL, 'DATABASE_URL of the database the app uses').not.toBe('');
  db = await mysql.createConnection({ uri: DATABASE_URL.replace(/^mariadb:/, 'mysql:'), timezone: 'Z' });
  fixture = await createFixture();
});

test.afterAll(async () => {
  if (fixture) await removeFixture(fixture);
  await db?.end();
});

async function signedInPage(browser: Browser, email: string): Promise<Page> {
  const context = await browser.newContext();
  const page = await context.newPage();
  await signIn(page, email);
  return page;
}

/** The written statement mailed to `to`, once the catcher has it. */
function statementMail(to: string) {
  return mailFromCatcher(`to=${encodeURIComponent(to)}&subject=${encodeURIComponent('Denied boarding')}`, (messages) => messages[0], `the written statement to ${to}`);
}

test('an agent proposes, a supervisor authorizes in another browser, and the statement reaches the passenger', async ({ browser }) => {
  const agent = await signedInPage(browser, 'agent@bumpboard.test');
  await agent.goto(`/flights/${fixture.flightId}`);
  // The panel is the section its heading titles.
  const panel = agent.getByRole('heading', { name: 'Denied boarding', exact: true }).locator('xpath=..');
  // The first page of the run: the ranking waits for the forecast of a flight nobody opened yet.
  await expect(panel.getByText('1 seat short now')).toBeVisible({ timeout: 15_000 });
  const form = agent.getByRole('form', { name: 'Propose denials' });
  // Prefilled from the live shortfall: 31 checked in on 30 seats.
  await expect(form.getByLabel('Seats needed')).toHaveValue('1');
  await form.getByLabel('Reason').fill('1 short at the gate; no more volunteers');
  await form.getByRole('button', { name: 'Propose denials' }).click();
  await expect(agent.getByRole('status').filter({ hasText: 'Proposed: 1 seat in 1 booking' })).toBeVisible();
  await expect(panel.getByText(`${fixture.lastName} — Waiting for a supervisor`)).toBeVisible();
  await shot(agent, 'bump-review-1-agent-proposed');
  await panel.screenshot({ path: `${SCREENSHOTS}/bump-review-1b-agent-panel.png` });

  const supervisor = await signedInPage(browser, 'supervisor@bumpboard.test');
  await supervisor.goto('/day');
  const waiting = supervisor.getByRole('list', { name: 'Denied-boarding proposals waiting' }).getByRole('listitem').filter({ hasText: fixture.label });
  await expect(waiting).toBeVisible();
  await shot(supervisor, 'bump-review-2-station-day');
  await waiting.getByRole('link', { name: /Open bump review/ }).click();
  await expect(supervisor.getByRole('heading', { name: `Bump review · ${fixture.label} to ORD` })).toBeVisible();
  await expect(supervisor.getByRole('note').filter({ hasText: 'compliance staff decide' })).toBeVisible();
  const proposal = supervisor.getByRole('article', { name: /^Proposal \d+$/ });
  // The preview assumes the first alternate with room: 4 h later on a domestic flight, 400% of USD 249.00 (14 CFR 250.5(a)(3)).
  await expect(proposal.getByRole('cell', { name: '$996.00' })).toBeVisible();
  await expect(proposal.getByRole('cell', { name: '14 CFR 250.5(a)(3)' })).toBeVisible();
  await shot(supervisor, 'bump-review-3-supervisor-review');
  await proposal.getByRole('button', { name: 'Authorize all (1)' }).click();
  await expect(proposal.locator('[data-proposal-status="authorized"]')).toBeVisible();
  await proposal.getByRole('button', { name: new RegExp(`^Rebook on ${fixture.alternateLabel}`) }).click();
  await expect(proposal.getByText('Compensation (fixed):')).toBeVisible();
  await expect(proposal.getByText(/Report line 1a/)).toBeVisible();

  // The agent's desk follows without a reload.
  await expect(panel.getByText(new RegExp(`${fixture.lastName} — Authorized by Sam Okafor \\(demo supervisor\\) at \\d\\d:\\d\\d; rebooked on ${fixture.alternateLabel}`))).toBeVisible({ timeout: 15_000 });
  await shot(agent, 'bump-review-4-agent-live-status');
  await panel.screenshot({ path: `${SCREENSHOTS}/bump-review-4b-agent-panel-live.png` });

  const mail = await statementMail(fixture.lastEmail);
  expect(mail.subject).toMatch(new RegExp(`^Denied boarding on Larkfield Air \\(demo carrier\\) flight ${fixture.label} of `));
  expect(mail.text).toContain('Volunteers and Boarding Priorities');
  // Amounts are written as Intl writes them, with a no-break space between the code and the figure.
  expect(mail.text.replace(/\u00a0/g, ' ')).toContain('Your compensation: USD 996.00.');
  await expect(proposal.getByText(/: sent \(/)).toBeVisible({ timeout: 15_000 });
  await shot(supervisor, 'bump-review-5-statement-sent');
  await proposal.screenshot({ path: `${SCREENSHOTS}/bump-review-5b-proposal.png` });

  const [printable] = await Promise.all([supervisor.context().waitForEvent('page'), proposal.getByRole('link', { name: 'Print the statement' }).click()]);
  await printable.waitForLoadState();
  await expect(printable.getByRole('heading', { level: 2, name: 'Compensation for Involuntary Denied Boarding' })).toBeVisible();
  await shot(printable, 'bump-review-6-printable-statement');
});

test('after the selection changes, the authorize buttons follow it; an admin changes but never authorizes', async ({ browser }) => {
  // A second flight of the same shape: 31 present on 30 seats, one short.
  const [[station]] = await db.query<mysql.RowDataPacket[]>(`SELECT id FROM stations WHERE iata = 'BOS'`);
  const departure = new Date(Date.now() + (100 + Math.floor(Math.random() * 600)) * 86_400_000);
  departure.setUTCHours(17, 0, 0, 0);
  const number = String(8000 + Math.floor(Math.random() * 1000));
  const flightId = await insertFlight(station.id, number, departure, 30);
  const tag = `S${RUN.slice(-4).toUpperCase()}`.replace(/[^A-Z0-9]/g, 'X');
  try {
    for (let i = 1; i <= 31; i++) {
      await insertSingle(flightId, `${tag}${String(i).padStart(2, '0')}`.slice(0, 8), 'Seat', `Holder${i}`, new Date(departure.getTime() - (200 - i) * 60_000), `e2e-swap-${RUN}-${i}@passengers.bumpboard.test`);
    }
    const agentApi = await staffApi('agent@bumpboard.test');
    const proposed = await agentApi.post(`/flights/${flightId}/denial-proposals`, { seatsNeeded: 1, reason: 'one short at the gate' });
    expect(proposed.status).toBe(201);
    const first = (proposed.body as { id: number; denials: { id: number }[] });
    await agentApi.dispose();

    const supervisor = await signedInPage(browser, 'supervisor@bumpboard.test');
    await supervisor.goto(`/flights/${flightId}/bump-review`);
    const proposal = supervisor.getByRole('article', { name: `Proposal ${first.id}` });
    const authorizeAll = proposal.getByRole('button', { name: 'Authorize all (1)' });
    await expect(authorizeAll).toHaveAttribute('data-denial-ids', String(first.denials[0].id));

    // The admin swaps the selected booking for the next in line; the admin's own page offers no authorization.
    const admin = await signedInPage(browser, 'admin@bumpboard.test');
    await admin.goto(`/flights/${flightId}/bump-review`);
    const adminProposal = admin.getByRole('article', { name: `Proposal ${first.id}` });
    await expect(adminProposal.getByText('Authorizing an involuntary denial is a supervisor’s act')).toBeVisible();
    await expect(adminProposal.getByRole('button', { name: /^Authorize/ })).toHaveCount(0);
    await adminProposal.getByRole('button', { name: 'Change selection' }).click();
    const change = adminProposal.getByRole('form', { name: 'Change the selection' });
    await change.getByRole('checkbox').first().check();
    await change.getByRole('checkbox').nth(1).check();
    await change.getByLabel('Reason for the change (required)').fill('travelling to a funeral; next in line instead');
    await change.getByRole('button', { name: 'Save the change' }).click();
    await expect(adminProposal.locator('[data-proposal-status="changed"]')).toBeVisible();
    await shot(admin, 'bump-review-8-admin-changed-no-authorize');

    // The supervisor's open page follows without a reload: the button now names the new denial only.
    await expect(proposal.locator('[data-proposal-status="changed"]')).toBeVisible({ timeout: 15_000 });
    const [[added]] = await db.query<mysql.RowDataPacket[]>(`SELECT id FROM denials WHERE proposal_id = ? AND status = 'proposed'`, [first.id]);
    await expect(authorizeAll).toHaveAttribute('data-denial-ids', String(added.id));
    await shot(supervisor, 'bump-review-9-supervisor-after-change');
    await authorizeAll.click();
    await expect(proposal.locator('[data-proposal-status="authorized"]')).toBeVisible();
    const [rows] = await db.query<mysql.RowDataPacket[]>(`SELECT id, status FROM denials WHERE proposal_id = ? ORDER BY id`, [first.id]);
    expect(rows.map((r) => [r.id, r.status])).toEqual([[first.denials[0].id, 'removed'], [added.id, 'authorized']]);

    // The other outcomes live on the same page: a refusal of carriage and a supervisor's after-the-fact record.
    await expect(supervisor.getByRole('form', { name: 'Refuse carriage' })).toBeVisible();
    await expect(supervisor.getByRole('form', { name: 'Record a denial after the fact' })).toBeVisible();
    await supervisor.getByRole('form', { name: 'Refuse carriage' }).screenshot({ path: `${SCREENSHOTS}/bump-review-10-refuse-carriage.png` });
  } finally {
    await removeFixture({ flightId, alternateId: flightId } as Fixture);
  }
});

test('an admin sees the station\'s boarding priorities in station setup, with the statement\'s wording', async ({ page }) => {
  await signIn(page, 'admin@bumpboard.test');
  await page.goto('/setup');
  const editor = page.getByRole('form', { name: 'Boarding priority rules' });
  await expect(editor.getByText('Check-in time', { exact: true })).toBeVisible();
  await expect(editor.getByText(/^1\. Check-in time: passengers who checked in latest/)).toBeVisible();
  await editor.getByRole('button', { name: 'Move Fare paid up' }).click();
  // The preview follows the draft before anything is saved.
  await expect(editor.getByText(/^1\. Fare paid: passengers who paid the lowest fare/)).toBeVisible();
  await editor.screenshot({ path: `${SCREENSHOTS}/bump-review-7-priority-rules-editor.png` });
});
