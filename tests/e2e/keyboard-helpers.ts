// The keyboard user's moves for the role paths: Tab to a control (never through the page body), press a key, and
// sign in with the keyboard alone. Focus after each action is checked by the spec against the control or message it
// should land on.
import { expect, type Locator, type Page } from '@playwright/test';
import { DEMO_PASSWORD, tabTo } from './helpers';

export { tabTo };

export const GATE_TERMINAL = { width: 1366, height: 768 };

/** Where focus is, in words, for a failure message: "BUTTON Approve $800.00" or "BODY". */
export const focusedWords = (page: Page) =>
  page.evaluate(() => {
    const el = document.activeElement;
    if (!el || el === document.body) return 'BODY';
    return `${el.tagName} ${(el.getAttribute('aria-label') ?? el.textContent ?? '').trim().slice(0, 80)}`;
  });

/** Fails if focus sits on the page body (or nowhere) once the screen has settled after an action. */
export async function expectFocusKept(page: Page, after: string) {
  // (A locator on body counts as focused whenever anything inside it is, so the test asks the document itself.)
  await expect.poll(() => focusedWords(page), { message: `focus fell to the page body after ${after}`, timeout: 10_000 }).not.toBe('BODY');
}

/** Tabs to `target`, presses `key` there, and checks focus did not fall to the page body. */
export async function activate(page: Page, target: Locator, key: 'Enter' | 'Space' = 'Enter', max = 120) {
  await tabTo(page, target, max);
  // Named before the key press: the control may be gone after it (and a locator waits for it to come back).
  const name = await focusedWords(page);
  await page.keyboard.press(key);
  await expectFocusKept(page, `${key} on ${name}`);
}

/**
 * Shift+Tab back to `target`: from the end of a screen, back up to the navigation, as a keyboard user does rather than
 * tabbing out through the browser's own controls. Fails if focus falls to the page body on the way.
 */
export async function tabBackTo(page: Page, target: Locator, max = 120) {
  for (let i = 0; i < max; i++) {
    if (await target.evaluate((el) => el === document.activeElement).catch(() => false)) return;
    await page.keyboard.press('Shift+Tab');
    expect(await focusedWords(page), 'focus fell to the page body').not.toBe('BODY');
  }
  await expect(target).toBeFocused();
}

/** Tabs to a field and types into it (a date or time field takes its digits segment by segment). */
export async function typeInto(page: Page, field: Locator, text: string, max = 60) {
  await tabTo(page, field, max);
  await page.keyboard.type(text);
}

/** Signs in from the sign-in screen with Tab, typing and Enter; the role's home screen's heading then has focus. */
export async function keyboardSignIn(page: Page, email: string, home: string | RegExp) {
  await page.goto('/sign-in');
  await expect(page.getByRole('heading', { level: 1, name: 'Sign in' })).toBeFocused();
  await typeInto(page, page.getByLabel('E-mail'), email);
  await page.keyboard.press('Tab');
  await page.keyboard.type(DEMO_PASSWORD);
  await page.keyboard.press('Enter');
  // scrypt on purpose: seconds on a busy machine.
  await expect(page.getByRole('heading', { level: 1, name: home })).toBeFocused({ timeout: 20_000 });
}

/** A new screen reached by a link: its heading takes focus and the tab's title names it. */
export async function expectArrival(page: Page, heading: string | RegExp) {
  await expect(page.getByRole('heading', { level: 1, name: heading })).toBeFocused();
}
