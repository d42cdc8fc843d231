import { expect, test } from '@playwright/test';
import { shot, staffApi } from './helpers';
import { ownFlight, type OwnFlight } from './own-flight';
import { en } from '../../shared/i18n/messages/en';

// The server's refusals reach the person in words, whichever layer raised them: a passenger's booking that does not
// match (the server's sentence) and a link that does not open (the page's own words for link_invalid), both from the
// offer page's rules, and a sign-in that fails (the auth service).
let flight: OwnFlight;
test.beforeAll(async () => {
  flight = await ownFlight('errwords');
});
test.afterAll(async () => {
  await flight?.remove();
});

test('a passenger who mistypes their name, or opens a broken link, is told what to check', async ({ browser }) => {
  const agent = await staffApi('agent@bumpboard.test');
  expect((await agent.post(`/flights/${flight.flightId}/rounds`, { kind: 'sealed', volunteersNeeded: 1 })).status).toBe(201);
  const { bidLink } = await (await agent.api.get(`/api/flights/${flight.flightId}/rounds`)).json();
  const context = await browser.newContext({ locale: 'en-US', viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
  try {
    const p = await context.newPage();
    await p.goto(bidLink);
    await p.getByLabel(en['passenger.identify.pnr']).fill('ZZZZZ9');
    await p.getByLabel(en['passenger.identify.lastName']).fill('Nobody');
    await p.getByRole('button', { name: en['passenger.identify.continue'] }).click();
    await expect(p.getByRole('alert')).toContainText('We could not find that booking on this flight.');
    await shot(p, 'error-words-booking-not-matched');

    await p.goto(`${new URL(bidLink).origin}/offer/not-a-real-link`);
    await expect(p.getByRole('alert').getByRole('heading', { name: en['passenger.link.title'] })).toBeVisible();
    await shot(p, 'error-words-link-invalid');
  } finally {
    for (const r of (await (await agent.api.get(`/api/flights/${flight.flightId}/rounds`)).json()).rounds.filter((x: { status: string }) => x.status === 'open')) await agent.post(`/rounds/${r.id}/close`);
    await context.close();
    await agent.dispose();
  }
});

test('a wrong password gets one sentence that does not say which part was wrong', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('agent@bumpboard.test');
  await page.getByLabel('Password').fill('not-the-password-at-all');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByText('That e-mail and password do not match an active account.')).toBeVisible({ timeout: 20_000 });
  await shot(page, 'error-words-sign-in-failed');
});
