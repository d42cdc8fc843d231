import { afterEach, describe, expect, it } from 'vitest';
import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import Stripe from 'stripe';
import { createPassengerCard, startFake, startReceiver, tempDataDir, waitFor, type Receiver, type RunningFake } from './harness.js';

const SECRET = 'whsec_restart_secret';
const cleanups: Array<() => Promise<void> | void> = [];

afterEach(async () => {
  while (cleanups.length > 0) await cleanups.pop()?.();
});

async function start(dataDir: string, webhookUrl: string): Promise<RunningFake> {
  const running = await startFake({
    dataDir,
    webhook: { url: webhookUrl, secret: SECRET },
    webhookRetry: { baseDelayMs: 30, maxDelayMs: 200, maxAttempts: 50, requestTimeoutMs: 500 },
  });
  return running;
}

describe('restart on the same data dir (persistence by write-then-rename)', () => {
  it('keeps cardholders, cards, events, idempotency records and pending webhook deliveries', async () => {
    const data = tempDataDir();
    cleanups.push(() => data.remove());
    // The receiver is down during the first run: deliveries stay pending.
    const deadReceiver = await startReceiver(() => 503);
    const url = deadReceiver.url;
    const first = await start(data.dir, url);
    const { cardholder, card } = await createPassengerCard(first.stripe, 60_000);
    const keyed = await first.stripe.issuing.cards.update(card.id, { status: 'canceled', metadata: { voidReason: 'rebooked' } }, { idempotencyKey: 'void-case-001' });
    await waitFor(() => deadReceiver.received.length >= 3, 5_000, 'failing attempts');
    const eventsBefore = (await first.stripe.events.list({ limit: 100 })).data.map((e) => e.id);
    await first.stop();
    await deadReceiver.close();

    expect(existsSync(join(data.dir, 'state.json'))).toBe(true);
    expect(readdirSync(data.dir).filter((name) => name.endsWith('.tmp'))).toEqual([]); // every temp file was renamed

    // Second run on the same port number the receiver had, now answering 200.
    const port = Number(new URL(url).port);
    const received: Array<{ body: string; signature: string }> = [];
    const { createServer } = await import('node:http');
    const liveReceiver = createServer((req, res) => {
      const chunks: Buffer[] = [];
      req.on('data', (chunk: Buffer) => chunks.push(chunk));
      req.on('end', () => {
        received.push({ body: Buffer.concat(chunks).toString('utf8'), signature: String(req.headers['stripe-signature']) });
        res.end();
      });
    });
    await new Promise<void>((resolve) => liveReceiver.listen(port, '127.0.0.1', () => resolve()));
    cleanups.push(
      () =>
        new Promise<void>((resolve) => {
          liveReceiver.closeAllConnections();
          liveReceiver.close(() => resolve());
        }),
    );

    const second = await start(data.dir, url);
    cleanups.push(() => second.stop());
    expect((await second.stripe.issuing.cardholders.retrieve(cardholder.id)).name).toBe('Ana Lima');
    const reloaded = await second.stripe.issuing.cards.retrieve(card.id);
    expect(reloaded.status).toBe('canceled');
    expect(reloaded.metadata).toEqual({ caseId: 'case-001', voidReason: 'rebooked' });
    expect((await second.stripe.events.list({ limit: 100 })).data.map((e) => e.id)).toEqual(eventsBefore);

    const replay = await second.stripe.issuing.cards.update(card.id, { status: 'canceled', metadata: { voidReason: 'rebooked' } }, { idempotencyKey: 'void-case-001' });
    expect(replay.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect(replay).toEqual(keyed);
    await expect(
      second.stripe.issuing.cards.update(card.id, { metadata: { other: 'x' } }, { idempotencyKey: 'void-case-001' }),
    ).rejects.toBeInstanceOf(Stripe.errors.StripeIdempotencyError);

    // The three events that never got through are delivered after the restart (at least once).
    await waitFor(() => new Set(received.map((r) => r.body)).size === 3, 5_000, 'pending deliveries after restart');
    const delivered = received.map((r) => Stripe.webhooks.constructEvent(r.body, r.signature, SECRET));
    expect(new Set(delivered.map((e) => e.id))).toEqual(new Set(eventsBefore));
  }, 20_000);

  it('starts empty in a fresh data dir and after a reset', async () => {
    const data = tempDataDir();
    cleanups.push(() => data.remove());
    const receiver: Receiver = await startReceiver();
    cleanups.push(() => receiver.close());
    const running = await start(data.dir, receiver.url);
    cleanups.push(() => running.stop());
    expect((await running.stripe.issuing.cards.list()).data).toEqual([]);
    await createPassengerCard(running.stripe, 1_000);
    const reset = await running.control('POST', '/reset');
    expect(reset.json.cards.total).toBe(0);
    const again = await start(data.dir, receiver.url);
    cleanups.push(() => again.stop());
    expect((await again.stripe.issuing.cards.list()).data).toEqual([]);
  });
});
