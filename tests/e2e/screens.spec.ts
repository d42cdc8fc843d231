// Every screen of every role at the gate terminal's size (1366×768) and a desktop's (1920×1080), as the user first
// sees it (the viewport, not the whole page), into test-results/screens/ (ignored by git): for people to open and
// look at. The one thing asserted is what an agent must never scroll for: on the flight desk, the live counts, the
// odds, the volunteer target and the current round sit above the fold at both sizes.
import { expect, test, type Page } from '@playwright/test';
import type { Role } from '@shared/schemas/common';
import { NAV_ITEMS } from '../../client/src/app/role-homes';
import { signIn } from './helpers';
import { sql } from './admin-helpers';

const SIZES = [
  { width: 1366, height: 768 },
  { width: 1920, height: 1080 },
];
const OUT = 'test-results/screens';
const EMAIL: Record<Role, string> = {
  agent: 'agent@bumpboard.test',
  supervisor: 'supervisor@bumpboard.test',
  finance: 'finance@bumpboard.test',
  admin: 'admin@bumpboard.test',
};
/** The demo's oversold flight at BOS, whose desk and bump review every desk role sees. */
const DEMO_FLIGHT = 'ZZ 105';

test.setTimeout(240_000);

async function demoFlightId(): Promise<number> {
  const [flight] = await sql<{ id: number }>(
    "SELECT f.id FROM flights f JOIN stations s ON s.id = f.station_id WHERE s.iata = 'BOS' AND f.carrier_code = 'ZZ' AND f.flight_number = '105' ORDER BY f.scheduled_departure DESC LIMIT 1",
  );
  expect(flight, `${DEMO_FLIGHT} at BOS in the demo`).toBeDefined();
  return Number(flight.id);
}

/** Waits for the screen's heading (focused on arrival) and for the loading lines to go, then takes the viewport. */
async function capture(page: Page, name: string) {
  await expect(page.locator('main h1')).toBeVisible();
  await expect(page.getByText(/^Loading/)).toHaveCount(0, { timeout: 15_000 });
  await page.screenshot({ path: `${OUT}/${name}.png` });
}

for (const role of Object.keys(EMAIL) as Role[]) {
  test(`every ${role} screen at 1366×768 and 1920×1080`, async ({ page }) => {
    await signIn(page, EMAIL[role]);
    const screens = NAV_ITEMS.filter((n) => n.roles.includes(role)).map((n) => ({ name: n.to.slice(1), path: `${n.to}?station=BOS` }));
    if (role !== 'finance') {
      const id = await demoFlightId();
      screens.push({ name: 'flight-desk', path: `/flights/${id}` }, { name: 'bump-review', path: `/flights/${id}/bump-review` });
    }
    for (const size of SIZES) {
      await page.setViewportSize(size);
      for (const s of screens) {
        await page.goto(s.path);
        await capture(page, `${role}-${s.name}-${size.width}`);
        if (s.name === 'flight-desk') {
          const glance = await page.getByTestId('desk-glance').boundingBox();
          expect(glance, 'the desk’s glance panel').not.toBeNull();
          expect(glance!.y + glance!.height, `the glance panel ends above the fold at ${size.width}×${size.height}`).toBeLessThanOrEqual(size.height);
        }
      }
    }
  });
}
