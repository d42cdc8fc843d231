// The passenger's page and a notice in each language, in a real browser on a phone-size screen: the words of the
// chosen language, nothing wider than the screen, screenshots to look at.
import { expect, test } from '@playwright/test';
import { LANGUAGES, type Language } from '../../shared/i18n/languages';
import { CATALOGUES } from '../../shared/i18n/catalogues';
import { compensationDue } from '../../shared/compensation';
import { accessibleStatementPage, writtenStatement } from '../../shared/compensation/statement';
import { volunteerRebookingNotice } from '../../server/src/modules/volunteers/notices';
import { shot, staffApi } from './helpers';

const PHONE = { viewport: { width: 360, height: 740 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true };
const BROWSER_LOCALE: Record<Language, string> = { en: 'en-US', fr: 'fr-CA', es: 'es-ES', de: 'de-DE', it: 'it-IT' };

async function bidLink(): Promise<string> {
  const agent = await staffApi('agent@bumpboard.test');
  try {
    const session = await (await agent.api.get('/api/auth/session')).json();
    const bos = session.user.stations.find((s: { iata: string }) => s.iata === 'BOS');
    const board = await (await agent.api.get(`/api/departures?stationId=${bos.id}`)).json();
    const flight = board.flights.find((f: { carrierCode: string; flightNumber: string }) => f.carrierCode === 'ZZ' && f.flightNumber === '105');
    expect(flight, 'the demo still has ZZ 105 at BOS').toBeTruthy();
    return (await (await agent.api.get(`/api/flights/${flight.id}/rounds`)).json()).bidLink as string;
  } finally {
    await agent.dispose();
  }
}

for (const language of LANGUAGES) {
  test(`the passenger page in the browser's language: ${language}`, async ({ browser }) => {
    const link = await bidLink();
    const context = await browser.newContext({ ...PHONE, locale: BROWSER_LOCALE[language] });
    try {
      const page = await context.newPage();
      await page.goto(link);
      const words = CATALOGUES[language];
      await expect(page.getByText(words['passenger.title'], { exact: true })).toBeVisible();
      await expect(page.getByText(words['passenger.yourFlight'], { exact: true })).toBeVisible();
      await expect(page.getByRole('heading', { name: words['passenger.before.title'] })).toBeVisible();
      expect(await page.evaluate(() => document.documentElement.lang)).toBe(language);
      // Nothing wider than a 360 px phone.
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360);
      await shot(page, `languages-passenger-${language}`);
    } finally {
      await context.close();
    }
  });
}

test('the passenger switches language on the page, and it stays for the tab', async ({ browser }) => {
  const link = await bidLink();
  const context = await browser.newContext({ ...PHONE, locale: 'en-US' });
  try {
    const page = await context.newPage();
    await page.goto(link);
    await page.getByLabel('Language').selectOption('fr');
    await expect(page.getByText('Cédez votre place', { exact: true })).toBeVisible();
    await page.reload();
    await expect(page.getByLabel('Langue')).toHaveValue('fr');
  } finally {
    await context.close();
  }
});

for (const language of LANGUAGES) {
  test(`the written statement's accessible page in ${language} fits a phone`, async ({ browser }) => {
    // EUR 250 for FCO-HAM, 1,326 km (Reg. 261/2004 Art. 7(1)(a); CJEU C-559/16 Bossen).
    const statement = writtenStatement({
      regime: 'eu-261', language, carrierName: 'Larkfield Air', station: 'Rome Fiumicino (FCO)',
      passenger: { name: 'Giulia Ferri', pnr: 'K7Q2XM' },
      flight: { number: 'ZZ 210', date: '2026-07-01', origin: 'FCO', destination: 'HAM' },
      alternate: { flightNumber: 'ZZ 214', plannedArrival: '2026-07-01 16:20' },
      compensation: compensationDue({ regime: 'eu-261', deniedOn: '2026-07-01', distanceKm: 1326, intraCommunity: true, plannedArrivalDelayMinutes: 150 }),
      priorityRules: [{ factor: 'check-in-time', direction: 'latest-first' }],
      enforcementBody: { name: 'Example enforcement body', website: 'enforcement.example' },
      care: [{ kind: 'meal', description: 'Meal voucher', amountMinor: 1_500, currency: 'EUR' }],
    });
    const context = await browser.newContext(PHONE);
    try {
      const page = await context.newPage();
      await page.setContent(accessibleStatementPage(statement));
      await expect(page.getByRole('heading', { level: 1 })).toHaveText(statement.subject);
      await expect(page.getByRole('heading', { name: CATALOGUES[language]['statement.eu.art9.heading'] })).toBeVisible();
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360);
      await shot(page, `languages-statement-${language}`);
    } finally {
      await context.close();
    }
  });
}

for (const language of LANGUAGES) {
  test(`a volunteer's rebooking notice in ${language} reads on a phone`, async ({ browser }) => {
    // USD 900 at Montréal-Trudeau for a volunteer; the amount is whatever was agreed (no rule's figure to check).
    const notice = volunteerRebookingNotice({
      station: { iata: 'YUL', name: 'Montréal-Trudeau', timeZone: 'America/Toronto' },
      flight: { carrierCode: 'ZZ', flightNumber: '310', origin: 'YUL', destination: 'CDG', scheduledDeparture: new Date('2026-07-01T23:00:00Z') },
      newFlight: { carrierCode: 'ZZ', flightNumber: '312', origin: 'YUL', destination: 'CDG', departure: new Date('2026-07-02T23:00:00Z'), arrival: new Date('2026-07-03T11:00:00Z') },
      plannedArrivalDelayMinutes: 24 * 60,
      pnr: 'K7Q2XM', passengerNames: ['Élodie Martin'], language,
      agreement: { perPassenger: { amountMinor: 90_000, currency: 'CAD' }, extras: ['Hotel night'], form: 'prepaid-card', voucherRestrictions: [] },
    });
    const context = await browser.newContext(PHONE);
    try {
      const page = await context.newPage();
      await page.setContent(notice.html);
      expect(await page.evaluate(() => document.documentElement.lang)).toBe(language);
      await expect(page.getByText(CATALOGUES[language]['notice.volunteer.owed'])).toBeVisible();
      await expect(page.getByText(CATALOGUES[language]['notice.pleaseNote'])).toBeVisible();
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360);
      await shot(page, `languages-notice-${language}`);
    } finally {
      await context.close();
    }
  });
}
