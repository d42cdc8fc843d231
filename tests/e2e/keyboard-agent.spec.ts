import { expect, test, type Page } from '@playwright/test';
import { DEMO_PASSWORD, tabTo, staffApi, type Staff } from './helpers';

/** The gate agent's main path with the keyboard alone, on the demo's oversold ZZ 105 (invented data). */
test.setTimeout(180_000);

async function closeOpenRounds(staff: Staff, page: Page) {
  const id = Number(/\/flights\/(\d+)/.exec(page.url())?.[1]);
  if (!id) return;
  const rounds = (await (await staff.api.get(`/api/flights/${id}/rounds`)).json()) as { rounds: { id: number; status: string }[] };
  for (const r of rounds.rounds.filter((x) => x.status === 'open')) await staff.post(`/rounds/${r.id}/close`);
}

const focusedIs = (page: Page, selector: string) => page.evaluate((s) => document.activeElement?.matches(s) ?? false, selector);

test('an agent signs in, opens the flight, starts a round, shows the gate QR and closes the round without a mouse', async ({ page }) => {
  const agent = await staffApi('agent@bumpboard.test');
  await page.setViewportSize({ width: 1366, height: 768 });
  try {
    await page.goto('/sign-in');
    await expect(page.getByRole('heading', { level: 1, name: 'Sign in' })).toBeFocused();
    await tabTo(page, page.getByLabel('E-mail'));
    await page.keyboard.type('agent@bumpboard.test');
    await page.keyboard.press('Tab');
    await page.keyboard.type(DEMO_PASSWORD);
    await page.keyboard.press('Enter');
    // Signed in, the home screen's heading has focus: never the page body.
    // scrypt on purpose: seconds on a busy machine.
    await expect(page.getByRole('heading', { level: 1, name: /^Departures · / })).toBeFocused({ timeout: 20_000 });

    await tabTo(page, page.getByRole('link', { name: 'ZZ 105' }).first());
    await page.keyboard.press('Enter');
    await expect(page.getByRole('heading', { level: 1, name: 'ZZ 105' })).toBeFocused();
    await expect(page).toHaveTitle(/Flight desk · ZZ 105/);
    await closeOpenRounds(agent, page);
    await page.reload();
    await expect(page.getByRole('heading', { level: 1, name: 'ZZ 105' })).toBeFocused();

    // At the gate terminal's size the counts, odds, volunteer target and round sit above the fold.
    const glance = page.getByTestId('desk-glance');
    const box = await glance.boundingBox();
    expect(box && box.y + box.height).toBeLessThanOrEqual(768);
    await page.screenshot({ path: 'test-results/screenshots/keyboard-agent-desk-1366.png' });

    const openRound = page.getByRole('button', { name: /^Open a volunteer round at / });
    await tabTo(page, openRound, 120);
    await page.keyboard.press('Enter');
    // The form is replaced by the running round: focus lands on its progress line.
    await expect(page.getByTestId('round-progress')).toBeFocused();
    await expect(page.getByTestId('glance-round')).toHaveText(/0 of \d+/);

    const qr = page.getByRole('button', { name: 'Show QR for the gate screen' });
    await tabTo(page, qr);
    await page.keyboard.press('Enter');
    const gate = page.getByRole('dialog', { name: 'Gate screen: offer your seat' });
    await expect(gate).toBeVisible();
    await page.keyboard.press('Escape');
    await expect(gate).toHaveCount(0);
    await expect(qr).toBeFocused();

    await tabTo(page, page.getByRole('button', { name: 'Close this round' }));
    await page.keyboard.press('Enter');
    const confirm = page.getByRole('dialog', { name: 'Close the round?' });
    await expect(confirm.getByRole('button', { name: 'Keep it open' })).toBeFocused();
    await page.keyboard.press('Tab');
    expect(await focusedIs(page, '[role="dialog"] button')).toBe(true);
    await expect(confirm.getByRole('button', { name: 'Yes, close the round' })).toBeFocused();
    await page.keyboard.press('Enter');
    await expect(confirm).toHaveCount(0);
    await expect(page.getByRole('heading', { name: 'Volunteer rounds' })).toBeFocused();
    await expect(page.getByTestId('glance-round')).toHaveCount(0);
  } finally {
    await closeOpenRounds(agent, page);
    await agent.dispose();
  }
});
