// The Notices screen: a sent notice opened as the passenger saw it, and sent again; a failed one retried.
import { randomUUID } from 'node:crypto';
import { expect, test } from '@playwright/test';
import { shot, signIn } from './helpers';
import { expectNoAxeViolations, GATE_TERMINAL, sql } from './admin-helpers';

test.use({ viewport: GATE_TERMINAL });
const SUBJECT = `Your new flight ${Date.now().toString(36)}`;

async function notice(status: 'sent' | 'failed') {
  const id = randomUUID();
  await sql(
    `INSERT INTO outbox_messages (id, station_id, flight_id, passenger_ids, kind, to_address, subject, text, html, status, attempts, next_attempt_at, created_at, sent_at, last_error)
     SELECT ?, id, NULL, '[]', 'rebooking-notice', ?, ?, 'Dear guest, your new flight is ZZ 208 at 14:05.', '<p>Dear guest, your new flight is <b>ZZ 208</b> at 14:05.</p>', ?, 2,
            UTC_TIMESTAMP(3), UTC_TIMESTAMP(3), IF(? = 'sent', UTC_TIMESTAMP(3), NULL), IF(? = 'failed', '550 mailbox unavailable', NULL) FROM stations WHERE iata = 'FCO'`,
    [id, `${status}-guest@passengers.bumpboard.test`, SUBJECT, status, status, status],
  );
  return id;
}

test.beforeAll(async () => {
  await notice('sent');
  await notice('failed');
});
test.afterAll(async () => {
  await sql('DELETE FROM outbox_messages WHERE subject = ?', [SUBJECT]);
});

test('a supervisor opens a sent notice, sends it again, and retries a failed one', async ({ page }) => {
  await signIn(page, 'supervisor@bumpboard.test');
  await page.goto('/notices?station=FCO');
  await expect(page).toHaveTitle('Notices · FCO · Bumpboard');
  await page.getByLabel('Recipient or subject').fill(SUBJECT);
  await page.getByRole('button', { name: 'Search' }).click();
  await expect(page.getByRole('row')).toHaveCount(3);
  await page.getByRole('button', { name: `Open “${SUBJECT}” to sent-guest@passengers.bumpboard.test` }).click();
  await expect(page.getByRole('heading', { name: SUBJECT })).toBeFocused();
  await expect(page.frameLocator(`iframe[title="The HTML part of “${SUBJECT}”"]`).locator('b')).toHaveText('ZZ 208');
  await expect(page.getByText('Dear guest, your new flight is ZZ 208 at 14:05.')).toBeVisible();
  await shot(page, 'admin-notice-open-1366');

  await page.getByRole('button', { name: `Send “${SUBJECT}” to sent-guest@passengers.bumpboard.test again` }).click();
  await expect(page.getByRole('status').filter({ hasText: 'A copy of' })).toBeFocused();
  await page.getByRole('button', { name: `Retry “${SUBJECT}” to failed-guest@passengers.bumpboard.test` }).click();
  await expect(page.getByRole('status').filter({ hasText: 'is queued again' })).toBeFocused();
  await expect.poll(async () => (await sql<{ n: number }>('SELECT COUNT(*) AS n FROM outbox_messages WHERE subject = ?', [SUBJECT]))[0].n).toBe(3);
  await page.getByRole('button', { name: 'Close the message' }).click();
  await expectNoAxeViolations(page);
  await shot(page, 'admin-notices-1366');
});
