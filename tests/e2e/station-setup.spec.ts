// Station setup, as an admin works it: an integration key shown once and revoked, a show-up profile value edited
// (a rule broken first, then a good value), and a manifest uploaded with one bad line, fixed and imported.
// Needs DATABASE_URL (the same test database the server runs on): the manifest goes into a flight this spec creates
// at YUL and removes again, so no demo flight's passengers change; the YUL profile is put back as it was found.
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { expect, test, type Page } from '@playwright/test';
import mysql from 'mysql2/promise';
import { shot, signIn } from './helpers';

const DATABASE_URL = process.env.DATABASE_URL ?? '';
const RUN = Date.now().toString(36);
const FILES = path.resolve('test-results/e2e-files');

const COLUMNS = 'flight_carrier,flight_number,flight_date,pnr,sequence,first_name,last_name,cabin,fare_minor,fare_currency,fare_type,ssr_codes,frequent_flyer_tier,is_child,inbound_flight,inbound_scheduled_arrival,contact_email';

interface TestFlight {
  id: number;
  number: string;
  date: string;
}

async function db() {
  return mysql.createConnection({ uri: DATABASE_URL.replace(/^mariadb:/, 'mysql:'), timezone: 'Z' });
}

/** A YUL flight of this spec alone, 30 days out so it stays off the departures board. */
async function createFlight(): Promise<TestFlight> {
  const conn = await db();
  try {
    const [[yul]] = (await conn.query('SELECT id FROM stations WHERE iata = ?', ['YUL'])) as unknown as [{ id: number }[]];
    const departure = new Date(Date.now() + 30 * 86_400_000);
    const date = departure.toISOString().slice(0, 10);
    const sql = (d: Date) => d.toISOString().slice(0, 19).replace('T', ' ');
    for (let attempt = 0; attempt < 20; attempt++) {
      const number = String(9000 + Math.floor(Math.random() * 1000));
      const [rows] = (await conn.query('SELECT id FROM flights WHERE carrier_code = ? AND flight_number = ? AND service_date = ? AND origin = ?', ['ZZ', number, date, 'YUL'])) as unknown as [unknown[]];
      if (rows.length) continue;
      const [res] = (await conn.query(
        `INSERT INTO flights (station_id, carrier_code, flight_number, service_date, origin, destination, scheduled_departure, scheduled_arrival, seats_by_cabin, state)
         VALUES (?, 'ZZ', ?, ?, 'YUL', 'YYZ', ?, ?, ?, 'scheduled')`,
        [yul.id, number, date, sql(departure), sql(new Date(departure.getTime() + 90 * 60_000)), JSON.stringify({ J: 4, Y: 20 })],
      )) as unknown as [{ insertId: number }];
      return { id: res.insertId, number, date };
    }
    throw new Error('no free flight number for the test flight');
  } finally {
    await conn.end();
  }
}

async function removeFlight(f: TestFlight) {
  const conn = await db();
  try {
    await conn.query('DELETE FROM flight_forecasts WHERE flight_id = ?', [f.id]);
    await conn.query('DELETE FROM forecast_snapshots WHERE flight_id = ?', [f.id]);
    await conn.query('DELETE FROM flights WHERE id = ?', [f.id]); // bookings and passengers cascade
  } finally {
    await conn.end();
  }
}

/** The key of this run is revoked by the test; its row goes too, so YUL's list does not fill with test keys. */
async function removeKey(name: string) {
  const conn = await db();
  try {
    await conn.query('DELETE FROM integration_keys WHERE name = ? AND revoked_at IS NOT NULL', [name]);
  } finally {
    await conn.end();
  }
}

async function yulProfileStored(): Promise<boolean> {
  const conn = await db();
  try {
    const [rows] = (await conn.query('SELECT p.station_id FROM show_up_profiles p JOIN stations s ON s.id = p.station_id WHERE s.iata = ?', ['YUL'])) as unknown as [unknown[]];
    return rows.length > 0;
  } finally {
    await conn.end();
  }
}

async function forgetYulProfile() {
  const conn = await db();
  try {
    await conn.query('DELETE p FROM show_up_profiles p JOIN stations s ON s.id = p.station_id WHERE s.iata = ?', ['YUL']);
  } finally {
    await conn.end();
  }
}

function manifestFile(name: string, f: TestFlight, fareOfLine3: string): string {
  const row = (pnr: string, seq: number, first: string, last: string, cabin: string, fare: string, extra = ',standard,,,false,,,') => `ZZ,${f.number},${f.date},${pnr},${seq},${first},${last},${cabin},${fare},CAD${extra}`;
  const text = [
    COLUMNS,
    row(`E2E${RUN.slice(-3).toUpperCase()}A`, 1, 'Maelle', 'Ouimet', 'Y', '32900', ',standard,,gold,false,,,maelle.ouimet@example.com'),
    row(`E2E${RUN.slice(-3).toUpperCase()}A`, 2, 'Theo', 'Ouimet', 'Y', fareOfLine3, ',standard,CHLD,,true,,,maelle.ouimet@example.com'),
    row(`E2E${RUN.slice(-3).toUpperCase()}B`, 1, 'Ravi', 'Lachance', 'J', '121000', ',flex,,,false,ZZ386,2031-01-01T09:05:00-05:00,'),
  ].join('\n');
  mkdirSync(FILES, { recursive: true });
  const file = path.join(FILES, name);
  writeFileSync(file, `${text}\n`);
  return file;
}

/** A setup panel: the section under its heading. */
const panel = (page: Page, title: string) => page.locator('section').filter({ has: page.getByRole('heading', { level: 2, name: title, exact: true }) }).last();

async function openSetupAtYul(page: Page) {
  await signIn(page, 'admin@bumpboard.test');
  await page.goto('/setup');
  await page.getByRole('banner').getByRole('combobox').selectOption({ label: 'YUL · Montréal–Trudeau' });
  await expect(page.getByRole('heading', { name: 'Show-up profile · YUL' })).toBeVisible();
}

test.describe.configure({ mode: 'serial' });

test('an admin creates and revokes a key, edits the show-up profile, and imports a manifest after fixing a bad line', async ({ page }) => {
  test.skip(!DATABASE_URL, 'DATABASE_URL must point at the test database the server runs on');
  const flight = await createFlight();
  const profileWasStored = await yulProfileStored();
  const keyName = `E2E gate system ${RUN}`;
  try {
    await openSetupAtYul(page);
    await expect(page.getByRole('heading', { name: 'Users' })).toBeVisible();
    await expect(page.getByRole('heading', { name: 'Your stations' })).toBeVisible();

    // 1. Integration key: shown once, then only its prefix; revoked after a confirm.
    const keys = panel(page, 'Integration keys · YUL');
    await keys.getByLabel('Key name').fill(keyName);
    await keys.getByRole('button', { name: 'Create key' }).click();
    const box = page.getByRole('region', { name: 'New integration key' });
    await expect(box.getByText('Copy it now: you will not see it again.')).toBeVisible();
    const secret = await box.getByLabel('The new key').inputValue();
    expect(secret).toMatch(/^bbk_/);
    await box.scrollIntoViewIfNeeded();
    await shot(page, 'station-setup-key-shown-once');
    await box.getByRole('button', { name: 'I have stored the key' }).click();
    const keyRow = keys.getByRole('row', { name: new RegExp(keyName) });
    await expect(keyRow).toContainText(secret.slice(0, 10));
    await expect(page.getByText(secret)).toHaveCount(0);
    await keyRow.getByRole('button', { name: 'Revoke' }).click();
    await keyRow.getByRole('group', { name: `Confirm revoking ${keyName}` }).getByRole('button', { name: 'Revoke key' }).click();
    await expect(keyRow).toContainText('Revoked');

    // 2. Show-up profile: a broken rule is named beside the field and what was typed stays; then a good value saves.
    const profile = page.getByRole('form', { name: 'Show-up profile of YUL' });
    const connect = profile.getByLabel('Minimum connecting time (minutes)');
    const original = await connect.inputValue();
    await connect.fill('300');
    await profile.getByRole('button', { name: 'Save profile' }).click();
    await expect(profile.getByText('minimumConnectMinutes must be at most 240')).toBeVisible();
    await expect(connect).toHaveValue('300');
    await expect(connect).toHaveAttribute('aria-invalid', 'true');
    await connect.scrollIntoViewIfNeeded();
    await shot(page, 'station-setup-profile-field-error');
    await connect.fill(String(Number(original) + 5));
    await profile.getByRole('button', { name: 'Save profile' }).click();
    await expect(profile.getByRole('status')).toContainText('Saved');
    await page.reload();
    await expect(page.getByRole('form', { name: 'Show-up profile of YUL' }).getByLabel('Minimum connecting time (minutes)')).toHaveValue(String(Number(original) + 5));
    await shot(page, 'station-setup-profile-saved');

    // 3. Manifest: line 3 has a fare with a decimal point; the preview names it and there is nothing to import.
    const manifests = panel(page, 'Manifest upload · YUL');
    await manifests.getByLabel(/^Manifest file/).setInputFiles(manifestFile('manifest-bad.csv', flight, '189.50'));
    const problems = manifests.getByRole('table', { name: /1 problem in the file/ });
    await expect(problems.getByRole('row', { name: /^3 fare_minor fare_minor must be whole minor units/ })).toBeVisible();
    await expect(manifests.getByRole('button', { name: /^Import/ })).toHaveCount(0);
    await problems.scrollIntoViewIfNeeded();
    await shot(page, 'station-setup-manifest-error');

    // Fixed and chosen again: no problems, then the import runs (held back a moment so the bar can be seen).
    await manifests.getByLabel(/^Manifest file/).setInputFiles(manifestFile('manifest-fixed.csv', flight, '18950'));
    await expect(manifests.getByText('✓ no problems found.')).toBeVisible();
    await expect(manifests.getByRole('table', { name: 'Flights in the file' })).toContainText(`ZZ ${flight.number}`);
    let releaseImport!: () => void;
    const importHeld = new Promise<void>((resolve) => (releaseImport = resolve));
    await page.route('**/manifests/import', async (route) => {
      await importHeld;
      await route.continue();
    });
    await manifests.getByRole('button', { name: 'Import 3 passengers' }).click();
    await expect(manifests.getByRole('progressbar', { name: 'Importing the manifest' })).toBeVisible();
    await shot(page, 'station-setup-manifest-importing');
    releaseImport();
    const result = manifests.getByRole('status', { name: 'Import result' });
    await expect(result).toContainText('Imported 3 passenger rows for 1 flight.');
    await expect(result.getByRole('row', { name: new RegExp(`ZZ ${flight.number}`) })).toContainText('2 / 0 / 0');
    await expect(manifests.getByRole('progressbar')).toHaveCount(0);
    await result.scrollIntoViewIfNeeded();
    await shot(page, 'station-setup-manifest-imported');

    // The profile goes back to what it was.
    await page.getByRole('form', { name: 'Show-up profile of YUL' }).getByLabel('Minimum connecting time (minutes)').fill(original);
    await page.getByRole('form', { name: 'Show-up profile of YUL' }).getByRole('button', { name: 'Save profile' }).click();
    await expect(page.getByRole('form', { name: 'Show-up profile of YUL' }).getByRole('status')).toContainText('Saved');
  } finally {
    await removeFlight(flight);
    await removeKey(keyName);
    if (!profileWasStored) await forgetYulProfile();
  }
});
