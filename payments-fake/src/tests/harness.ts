import { createServer, type IncomingHttpHeaders, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Stripe from 'stripe';
import { createPaymentsFake, type PaymentsFake, type PaymentsFakeOptions } from '../app.js';

export interface RunningFake {
  fake: PaymentsFake;
  port: number;
  baseUrl: string;
  stripe: Stripe;
  /** A client with extra settings, e.g. a short `timeout`. */
  client(extra?: { timeout?: number; maxNetworkRetries?: number }): Stripe;
  control(method: string, path: string, body?: unknown): Promise<{ status: number; json: any }>; // eslint-disable-line @typescript-eslint/no-explicit-any -- test helper returns loosely-typed JSON
  stop(): Promise<void>;
}

function listen(server: Server): Promise<number> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve((server.address() as AddressInfo).port));
  });
}

async function closeServer(server: Server): Promise<void> {
  server.closeAllConnections();
  await new Promise<void>((resolve) => server.close(() => resolve()));
}

/** Starts the stand-in on an ephemeral loopback port with a real stripe-node client pointed at it. */
export async function startFake(options: PaymentsFakeOptions = {}): Promise<RunningFake> {
  const fake = createPaymentsFake(options);
  const server = createServer(fake.app);
  const port = await listen(server);
  const baseUrl = `http://127.0.0.1:${port}`;
  const client = (extra: { timeout?: number; maxNetworkRetries?: number } = {}) =>
    new Stripe('sk_test_x', { host: '127.0.0.1', port, protocol: 'http', maxNetworkRetries: 2, telemetry: false, ...extra });
  return {
    fake,
    port,
    baseUrl,
    stripe: client(),
    client,
    async control(method, path, body) {
      const response = await fetch(`${baseUrl}/__control${path}`, {
        method,
        headers: body === undefined ? {} : { 'Content-Type': 'application/json' },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      return { status: response.status, json: await response.json() };
    },
    async stop() {
      await fake.close();
      await closeServer(server);
    },
  };
}

export interface ReceivedWebhook {
  headers: IncomingHttpHeaders;
  body: string;
}

export interface Receiver {
  url: string;
  received: ReceivedWebhook[];
  close(): Promise<void>;
}

/** A loopback webhook receiver; `answer` picks the status for the n-th request (0-based). */
export async function startReceiver(answer: (index: number) => number = () => 200): Promise<Receiver> {
  const received: ReceivedWebhook[] = [];
  const server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      const index = received.length;
      received.push({ headers: req.headers, body: Buffer.concat(chunks).toString('utf8') });
      res.statusCode = answer(index);
      res.end();
    });
  });
  const port = await listen(server);
  return { url: `http://127.0.0.1:${port}/webhooks`, received, close: () => closeServer(server) };
}

/** Polls until the condition holds; bounded so a broken test fails instead of hanging. */
export async function waitFor(condition: () => boolean, timeoutMs = 5_000, what = 'condition'): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!condition()) {
    if (Date.now() > deadline) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
}

export function tempDataDir(): { dir: string; remove(): void } {
  const dir = mkdtempSync(join(tmpdir(), 'payments-fake-test-'));
  return { dir, remove: () => rmSync(dir, { recursive: true, force: true }) };
}

/** A cardholder as Bumpboard creates one per passenger (test data). */
export const PASSENGER = {
  name: 'Ana Lima',
  email: 'ana.lima@example.test',
  billing: { address: { line1: '1 Rua Augusta', city: 'Lisbon', postal_code: '1100-048', country: 'PT' } },
  metadata: { caseId: 'case-001', pnr: 'X7K2QP' },
};

export async function createPassengerCard(stripe: Stripe, amount: number, currency = 'eur') {
  const cardholder = await stripe.issuing.cardholders.create(PASSENGER);
  const card = await stripe.issuing.cards.create({
    cardholder: cardholder.id,
    currency,
    type: 'virtual',
    status: 'active',
    spending_controls: { spending_limits: [{ amount, interval: 'all_time' }] },
    metadata: { caseId: 'case-001' },
  });
  return { cardholder, card };
}
