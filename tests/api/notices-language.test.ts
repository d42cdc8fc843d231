// A denied passenger's mails go out in the booking's language: the written statement and the rebooking notice are
// rendered from the shared catalogues, queued in the outbox, sent over real SMTP and read back from the catcher.
// Check values: Reg. 261/2004 Art. 7(1)(a) (EUR 250 up to 1,500 km; FCO-HAM is 1,326 km great-circle, CJEU
// C-559/16 Bossen), Art. 14(2) (Art. 7, 8, 9 and the enforcement body, in the notice handed to the passenger).
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { integrationEventSchema } from '@shared/schemas/integration-events';
import { createMailFake, type MailFake } from '../../mail-fake/src/app';
import { BookingEntity } from '../../server/src/db/entities';
import { createMailTransport, type MailTransport } from '../../server/src/integrations/mail/mail-transport';
import { createOutboxWorker } from '../../server/src/modules/outbox/outbox-worker';
import { addBooking, addSingles, createFlight, removeDenialFixtures } from './denials-fixtures';
import { signedIn, startTestApp, type Client, type TestApp } from './harness';
import { DEMO } from './helpers';

let t: TestApp;
let agent: Client;
let supervisor: Client;
let mailFake: MailFake;
let catcherUrl: string;
let transport: MailTransport;
let dataDir: string;

beforeAll(async () => {
  t = await startTestApp();
  [agent, supervisor] = await Promise.all([signedIn(t, DEMO.agent), signedIn(t, DEMO.supervisor)]);
  dataDir = mkdtempSync(path.join(os.tmpdir(), 'bumpboard-language-test-'));
  mailFake = createMailFake({ dataDir });
  const ports = await mailFake.listen({ smtpPort: 0, httpPort: 0 });
  catcherUrl = `http://127.0.0.1:${ports.httpPort}`;
  transport = createMailTransport({ SMTP_HOST: '127.0.0.1', SMTP_PORT: ports.smtpPort, SMTP_SECURE: false, MAIL_FROM: 'Bumpboard <notices@bumpboard.test>' });
});
afterAll(async () => {
  transport.close();
  await removeDenialFixtures(t.db);
  await mailFake.close();
  rmSync(dataDir, { recursive: true, force: true });
  await t.close();
});

interface Caught { subject: string; text: string; html: string | null }

async function caught(to: string, count: number): Promise<Caught[]> {
  let messages: Caught[] = [];
  await expect.poll(async () => {
    const response = await fetch(`${catcherUrl}/api/messages?to=${encodeURIComponent(to)}`);
    messages = ((await response.json()) as { messages: Caught[] }).messages;
    return messages.length;
  }, { timeout: 15_000, interval: 200 }).toBe(count);
  return messages;
}

/** A full flight FCO-HAM where one booking in `language` checked in last: it is denied, then rebooked 150 min later. */
async function deniedAndRebooked(language: 'it' | 'de' | null, email: string) {
  const flight = await createFlight(t.db, { station: 'FCO', destination: 'HAM', seats: 30 });
  await addSingles(t.db, flight, 30, { fareMinor: 20_000, fareCurrency: 'EUR' });
  const party = await addBooking(t.db, flight, [{ first: 'Giulia', last: 'Lingua', fareMinor: 9_900, fareCurrency: 'EUR', checkedInBefore: 30 }], { email });
  await t.db.getRepository(BookingEntity).update({ id: party.booking.id }, { language });
  const alternate = await createFlight(t.db, { station: 'FCO', destination: 'HAM', seats: 150, after: flight, laterBy: 150 });
  const proposal = (await agent.post(`/api/flights/${flight.id}/denial-proposals`, { seatsNeeded: 1, reason: 'oversold at the gate' }).expect(201)).body;
  await supervisor.post(`/api/denial-proposals/${proposal.id}/authorize`).expect(200);
  await agent.post(`/api/denials/${proposal.denials[0].id}/rebook`, { alternateFlightId: alternate.id }).expect(200);
  const worker = createOutboxWorker(t.db, transport, { pollMs: 100, onlyFlightIds: [flight.id], log: () => undefined });
  worker.start();
  try {
    return await caught(email, 2);
  } finally {
    await worker.stop();
  }
}

const nb = (s: string) => s.replace(/[\u00a0\u202f]/g, ' ');

describe('mail in the booking\'s language', () => {
  it('an Italian booking gets the Art. 14(2) statement and the rebooking notice in Italian', async () => {
    const mails = await deniedAndRebooked('it', `lingua-it-${Date.now()}@passengers.bumpboard.test`);
    const statement = mails.find((m) => m.subject.startsWith('Negato imbarco'))!;
    const notice = mails.find((m) => m.subject.startsWith('Il suo nuovo volo'))!;
    expect(statement).toBeDefined();
    expect(notice).toBeDefined();
    for (const heading of ['Compensazione (articolo 7)', 'Rimborso o volo alternativo (articolo 8)', 'Assistenza durante l’attesa (articolo 9)', 'Organismo responsabile', 'Altri formati', 'Avvertenza']) {
      expect(statement.text).toContain(`\n${heading}\n`);
    }
    expect(nb(statement.text)).toContain('La sua compensazione: 250,00 EUR.');
    // Art. 14(3): the mail's HTML is the accessible page, in the passenger's language.
    expect(statement.html).toMatch(/<html lang="it">/);
    expect(statement.html).toContain('<nav aria-label="Indice">');
    expect(notice.text).toContain('Gentile Giulia Lingua,');
    expect(notice.text).toContain('2 ore e 30 minuti più tardi');
    expect(notice.html).toMatch(/<html lang="it">/);
  });

  it('a booking without a language gets English', async () => {
    const mails = await deniedAndRebooked(null, `lingua-none-${Date.now()}@passengers.bumpboard.test`);
    expect(mails.map((m) => m.subject.split(' ')[0]).sort()).toEqual(['Denied', 'Your']);
    expect(mails.find((m) => m.subject.startsWith('Denied'))!.html).toMatch(/<html lang="en">/);
  });
});

describe('the booking language in the feed', () => {
  it('is optional, and refused by name when it is not one we offer', () => {
    const event = {
      id: 'e1', occurredAt: '2026-07-01T08:00:00Z', flight: { carrier: 'ZZ', number: '10', date: '2026-07-01' }, type: 'booking.added', pnr: 'ABC123',
      passengers: [{ firstName: 'A', lastName: 'B', cabin: 'Y', fareMinor: 100, fareCurrency: 'EUR' }],
    };
    expect(integrationEventSchema.parse(event)).toMatchObject({ language: null });
    expect(integrationEventSchema.parse({ ...event, language: 'fr' })).toMatchObject({ language: 'fr' });
    const refused = integrationEventSchema.safeParse({ ...event, language: 'pt' });
    expect(refused.success).toBe(false);
    expect(refused.error?.issues[0]).toMatchObject({ path: ['language'], message: 'language must be one of en, fr, es, de, it' });
  });
});
