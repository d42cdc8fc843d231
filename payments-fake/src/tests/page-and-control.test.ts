import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { createPaymentsFake } from '../app.js';
import { formatMinor } from '../page/format.js';
import { createPassengerCard, startFake, tempDataDir, type RunningFake } from './harness.js';

let running: RunningFake;

beforeAll(async () => {
  running = await startFake();
});
afterAll(async () => {
  await running.stop();
});
beforeEach(() => {
  running.fake.reset();
});

describe('overview page', () => {
  it('is labelled as test data and lists cardholders, cards with amount/currency/status/metadata, and events', async () => {
    const { card } = await createPassengerCard(running.stripe, 60_000);
    await running.stripe.issuing.cards.update(card.id, { metadata: { note: '<b>late</b>' } });
    const response = await fetch(`${running.baseUrl}/`);
    expect(response.headers.get('content-type')).toContain('text/html');
    const html = await response.text();
    expect(html).toContain('Local payments stand-in (test data)');
    expect(html).toContain('Ana Lima');
    expect(html).toContain(card.id);
    expect(html).toContain('EUR 600.00');
    expect(html).toContain('(60000)');
    expect(html).toContain('issuing_card.updated');
    expect(html).toContain('&lt;b&gt;late&lt;/b&gt;'); // metadata is escaped, never rendered as markup
    expect(html).not.toContain('<b>late</b>');
  });

  it('formats minor units with the currency exponent from ISO 4217 (EUR 2 decimals, JPY 0, BHD 3)', () => {
    // ISO 4217 minor-unit exponents: EUR 2, JPY 0, BHD 3 (ISO 4217 currency code list).
    expect(formatMinor(60_000, 'eur')).toBe('EUR 600.00');
    expect(formatMinor(30_000, 'jpy')).toBe('JPY 30000');
    expect(formatMinor(1_500, 'bhd')).toBe('BHD 1.500');
  });
});

describe('control API', () => {
  it('summarises state', async () => {
    await createPassengerCard(running.stripe, 60_000);
    const summary = await running.control('GET', '/summary');
    expect(summary.status).toBe(200);
    expect(summary.json).toMatchObject({
      cardholders: 1,
      cards: { total: 1, byStatus: { active: 1 } },
      events: { total: 2 },
      idempotencyKeys: 2, // the SDK keys both POSTs
    });
  });

  it('validates the webhook endpoint body by field', async () => {
    const response = await running.control('POST', '/webhooks/endpoint', { url: 'not a url', secret: 's' });
    expect(response.status).toBe(400);
    expect(response.json.error.param).toBe('url');
  });

  it('answers 404 on an unknown settle target', async () => {
    const response = await running.control('POST', '/issuing/cards/ic_missing/settle', { amount: 100 });
    expect(response.status).toBe(404);
    expect(response.json.error.code).toBe('resource_missing');
  });
});

describe('state file', () => {
  it('refuses to start on a corrupt state file instead of wiping it', () => {
    const data = tempDataDir();
    try {
      writeFileSync(join(data.dir, 'state.json'), '{ not json');
      expect(() => createPaymentsFake({ dataDir: data.dir })).toThrow(/not valid JSON/);
    } finally {
      data.remove();
    }
  });
});

describe('control API body errors', () => {
  it('answers malformed JSON with a JSON error', async () => {
    const response = await fetch(`${running.baseUrl}/__control/faults`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: '{ kind: ',
    });
    expect(response.status).toBe(400);
    expect((await response.json()).error.message).toContain('JSON');
  });
});
