import { expect, request, type APIRequestContext, type Page } from '@playwright/test';
import type { Connection, RowDataPacket } from 'mysql2/promise';
import type { EntityManager } from 'typeorm';
import { deleteInDependencyOrder } from '../../server/src/demo/delete-in-order';
import { removeCompensations } from '../cleanup/compensations';

export const DEMO_PASSWORD = 'bumpboard-demo-2026';
export const SCREENSHOTS = 'test-results/screenshots';

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  // The password hash is slow on purpose (scrypt); on a busy machine it takes seconds, not the default five.
  await expect(page.getByRole('button', { name: 'Sign out' })).toBeVisible({ timeout: 20_000 });
}

export async function shot(page: Page, name: string) {
  await page.screenshot({ path: `${SCREENSHOTS}/${name}.png`, fullPage: true });
}

/** A staff member's API session for setting a scene (signed in, with the CSRF token on every POST). */
export interface Staff {
  api: APIRequestContext;
  csrf: string;
  post: (path: string, data?: unknown) => Promise<{ status: number; body: unknown }>;
  dispose: () => Promise<void>;
}

export async function staffApi(email: string): Promise<Staff> {
  const api = await request.newContext({ baseURL: process.env.APP_BASE_URL ?? 'http://127.0.0.1:4700' });
  const session = await (await api.get('/api/auth/session')).json();
  const signedIn = await api.post('/api/auth/sign-in', { headers: { 'X-CSRF-Token': session.csrfToken }, data: { email, password: DEMO_PASSWORD } });
  expect(signedIn.ok()).toBe(true);
  const csrf: string = (await signedIn.json()).csrfToken;
  return {
    api,
    csrf,
    post: async (path, data = {}) => {
      const res = await api.post(`/api${path}`, { headers: { 'X-CSRF-Token': csrf }, data });
      return { status: res.status(), body: await res.json().catch(() => null) };
    },
    dispose: () => api.dispose(),
  };
}

// The test instance's catcher (npm test sets MAIL_FAKE_URL; 4701 is its default port).
export const MAIL_FAKE_URL = process.env.MAIL_FAKE_URL ?? 'http://127.0.0.1:4701';

export interface CaughtMail {
  subject: string;
  text: string;
  to: string[];
}

/**
 * Polls the mail catcher's JSON API (`/api/messages?<query>`) until `pick` finds what the test waits for, within
 * 30 s (the outbox worker polls every half second); returns it.
 */
export async function mailFromCatcher<T>(query: string, pick: (messages: CaughtMail[]) => T | undefined, what: string): Promise<T> {
  const catcher = await request.newContext({ baseURL: MAIL_FAKE_URL });
  let found: T | undefined;
  try {
    await expect.poll(async () => {
      const res = await catcher.get(`/api/messages?${query}`);
      expect(res.ok()).toBe(true);
      found = pick(((await res.json()) as { messages: CaughtMail[] }).messages);
      return found !== undefined;
    }, { message: `${what} did not reach the mail catcher at ${MAIL_FAKE_URL}`, timeout: 30_000, intervals: [250, 500, 1_000] }).toBe(true);
    return found as T;
  } finally {
    await catcher.dispose();
  }
}

/**
 * Removes a spec's own flights and all that hangs off them. The app never deletes money rows, so the spec removes its
 * own first; the rest goes children first by the foreign keys the database declares.
 */
export async function removeTestFlights(db: Connection, flightIds: number[]): Promise<void> {
  if (!flightIds.length) return;
  const [comps] = await db.query<RowDataPacket[]>('SELECT id FROM compensations WHERE flight_id IN (?)', [flightIds]);
  const compIds = comps.map((c) => Number(c.id));
  await db.query('DELETE FROM outbox_messages WHERE flight_id IN (?)', [flightIds]);
  await removeCompensations(async (sql, params) => (await db.query(sql, params))[0], compIds);
  const asManager = { query: async (sql: string, params?: unknown[]) => (await db.query(sql, params))[0] } as unknown as EntityManager;
  await deleteInDependencyOrder(asManager, 'flights', flightIds);
}

/**
 * Runs axe on the page as it stands, against WCAG 2.0–2.2 A and AA, and fails with each violation named by its rule,
 * the first offending element and axe's own help text, so a failure reads as a to-do list.
 */
export async function expectNoAxeViolations(page: Page, where: string) {
  const { default: AxeBuilder } = await import('@axe-core/playwright');
  const result = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  const found = result.violations.map((v) => `${v.id} (${v.nodes.length}×): ${v.help} — e.g. ${v.nodes[0]?.target.join(' ')}`);
  expect(found, `axe on ${where}`).toEqual([]);
}

/**
 * Presses Tab until `target` has focus (at most `max` times), failing if focus ever falls to the page body on the
 * way: the keyboard user's path, step by step.
 */
export async function tabTo(page: Page, target: import('@playwright/test').Locator, max = 60) {
  for (let i = 0; i < max; i++) {
    if (await target.evaluate((el) => el === document.activeElement).catch(() => false)) return;
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement === document.body), 'focus fell to the page body').toBe(false);
  }
  await expect(target).toBeFocused();
}
