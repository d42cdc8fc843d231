// Every pointer target on every screen of every role is at least 24×24 CSS px: WCAG 2.2 SC 2.5.8 "Target Size
// (Minimum)", level AA, https://www.w3.org/TR/WCAG22/#target-size-minimum. Its two exceptions that apply here are
// measured the way the SC words them:
// - spacing: a smaller target passes when a 24 px circle centred on its box meets no other target and no other
//   small target's circle;
// - inline: a link inside a sentence (its line holds other text) is sized by the line and is left out.
// Elements measured: buttons, links, inputs, selects, text areas, checkboxes and anything with a button, link,
// checkbox, radio, switch or tab role, when rendered (a box, not hidden) and not inside an aria-hidden or inert part.
import { expect, test, type Page } from '@playwright/test';
import type { Role } from '@shared/schemas/common';
import { NAV_ITEMS } from '../../client/src/app/role-homes';
import { signIn } from './helpers';
import { sql } from './admin-helpers';

const EMAIL: Record<Role, string> = {
  agent: 'agent@bumpboard.test',
  supervisor: 'supervisor@bumpboard.test',
  finance: 'finance@bumpboard.test',
  admin: 'admin@bumpboard.test',
};
const MIN = 24;

test.setTimeout(240_000);

async function demoFlightId(): Promise<number> {
  const [flight] = await sql<{ id: number }>(
    "SELECT f.id FROM flights f JOIN stations s ON s.id = f.station_id WHERE s.iata = 'BOS' AND f.carrier_code = 'ZZ' AND f.flight_number = '105' ORDER BY f.scheduled_departure DESC LIMIT 1",
  );
  expect(flight, 'ZZ 105 at BOS in the demo').toBeDefined();
  return Number(flight.id);
}

/** Each target under 24×24 that neither exception saves, as "tag "name" w×h". */
function undersizedTargets(page: Page): Promise<string[]> {
  return page.evaluate((min) => {
    const selector = 'button, a[href], input:not([type=hidden]), select, textarea, summary, [role=button], [role=link], [role=checkbox], [role=radio], [role=switch], [role=tab]';
    const rendered = (el: Element) => {
      const r = el.getBoundingClientRect();
      const style = getComputedStyle(el);
      return r.width > 0 && r.height > 0 && style.visibility !== 'hidden' && !el.closest('[aria-hidden=true], [inert]');
    };
    /** A link whose block holds other words: a link in a sentence, sized by the line it sits on. */
    const inSentence = (el: Element) => {
      if (el.tagName !== 'A' || getComputedStyle(el).display !== 'inline') return false;
      const block = el.parentElement;
      const own = (el.textContent ?? '').trim().length;
      return !!block && (block.textContent ?? '').trim().length > own;
    };
    const targets = [...document.querySelectorAll(selector)].filter(rendered).filter((el) => !inSentence(el));
    const boxes = targets.map((el) => el.getBoundingClientRect());
    const small = boxes.map((r) => r.width < min - 0.5 || r.height < min - 0.5);
    const centre = (r: DOMRect) => ({ x: r.left + r.width / 2, y: r.top + r.height / 2 });
    const distanceToBox = (p: { x: number; y: number }, r: DOMRect) => Math.hypot(Math.max(r.left - p.x, 0, p.x - r.right), Math.max(r.top - p.y, 0, p.y - r.bottom));
    const spacedEnough = (i: number) => {
      const c = centre(boxes[i]);
      return boxes.every((r, j) => {
        if (j === i || targets[j].contains(targets[i]) || targets[i].contains(targets[j])) return true;
        if (distanceToBox(c, r) < min / 2) return false;
        if (small[j]) {
          const o = centre(r);
          if (Math.hypot(o.x - c.x, o.y - c.y) < min) return false;
        }
        return true;
      });
    };
    return targets.flatMap((el, i) => {
      if (!small[i] || spacedEnough(i)) return [];
      const name = (el.getAttribute('aria-label') ?? el.textContent ?? (el as HTMLInputElement).name ?? '').trim().replace(/\s+/g, ' ').slice(0, 50);
      const type = el.tagName === 'INPUT' ? `input[type=${(el as HTMLInputElement).type}]` : el.tagName.toLowerCase();
      return [`${type} "${name}" ${Math.round(boxes[i].width)}×${Math.round(boxes[i].height)}`];
    });
  }, MIN);
}

async function expectTargetsBigEnough(page: Page, path: string, screen: string) {
  await page.goto(path);
  await expect(page.locator('main h1')).toBeVisible();
  await expect(page.getByText(/^Loading/)).toHaveCount(0, { timeout: 15_000 });
  expect(await undersizedTargets(page), `targets under ${MIN}×${MIN} px with too little space around them on ${screen}`).toEqual([]);
}

test('the measure itself finds small crowded targets and spares spaced ones and links in a sentence', async ({ page }) => {
  await page.setContent(`<main>
    <button style="position:absolute;left:0;top:0;width:16px;height:16px;padding:0">a</button>
    <button style="position:absolute;left:18px;top:0;width:16px;height:16px;padding:0">b</button>
    <input type="checkbox" style="position:absolute;left:200px;top:200px;width:20px;height:20px;margin:0">
    <p style="position:absolute;top:400px">Read <a href="#x">the rule</a> first.</p>
  </main>`);
  expect(await undersizedTargets(page)).toEqual(['button "a" 16×16', 'button "b" 16×16']);
});

test('the sign-in screen’s targets are at least 24×24', async ({ page }) => {
  await page.setViewportSize({ width: 1366, height: 768 });
  await expectTargetsBigEnough(page, '/sign-in', 'sign-in');
});

for (const role of Object.keys(EMAIL) as Role[]) {
  test(`every ${role} screen’s targets are at least 24×24`, async ({ page }) => {
    await page.setViewportSize({ width: 1366, height: 768 });
    await signIn(page, EMAIL[role]);
    const screens = NAV_ITEMS.filter((n) => n.roles.includes(role)).map((n) => ({ name: n.to.slice(1), path: `${n.to}?station=BOS` }));
    if (role !== 'finance') {
      const id = await demoFlightId();
      screens.push({ name: 'flight-desk', path: `/flights/${id}` }, { name: 'bump-review', path: `/flights/${id}/bump-review` });
    }
    // Every screen is measured before failing, so one run lists all of them.
    const failures: string[] = [];
    for (const s of screens) {
      await test.step(s.name, async () => {
        try {
          await expectTargetsBigEnough(page, s.path, `${role} ${s.name}`);
        } catch (e) {
          failures.push((e as Error).message.split('\n').slice(0, 30).join('\n'));
        }
      });
    }
    expect(failures, `screens with small targets for ${role}`).toEqual([]);
  });
}
