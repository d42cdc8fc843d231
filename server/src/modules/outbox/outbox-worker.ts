// Sends what the outbox holds: polls, claims due rows, sends each through SMTP and records the outcome.
import type { DataSource } from 'typeorm';
import type { MailTransport } from '../../integrations/mail/mail-transport';
import { classifySmtpFailure } from '../../integrations/mail/smtp-failure';
import { DEFAULT_BACKOFF, DEFAULT_MAX_ATTEMPTS, retryDelayMs, type BackoffPolicy } from './outbox-backoff';
import { claimDueMessages, markFailed, markRetry, markSent, releaseClaim, type ClaimedMessage } from './outbox-claims';
import { domainEventsOf } from '../../events';

export const MESSAGE_ID_HEADER = 'X-Bumpboard-Message-Id';
const MESSAGE_ID_DOMAIN = 'bumpboard';

export interface OutboxWorkerOptions {
  /** Wait between polls when the queue was empty. */
  pollMs?: number;
  /** Rows claimed at once; a full batch is followed straight away by the next. */
  batchSize?: number;
  maxAttempts?: number;
  backoff?: BackoffPolicy;
  /**
   * How long a claim keeps other workers off a row. Longer than the transport's connection, greeting and
   * socket timeouts together, so a slow send ends (one way or the other) before anyone else may take the row.
   */
  leaseMs?: number;
  onlyFlightIds?: readonly number[];
  log?: (line: string) => void;
}

export interface OutboxWorker {
  start(): void;
  /** Look now instead of at the next poll. */
  kick(): void;
  /** Stops polling and waits for the send in flight; claimed rows not yet tried are handed back. */
  stop(): Promise<void>;
  /** One claim-and-send pass; resolves with how many rows it claimed. For a worker that is not started (tests, scripts). */
  runOnce(): Promise<number>;
}

/** Writes of an outcome are retried briefly: a row left 'pending' after a 250 would be sent again. */
const RECORD_RETRY_DELAYS_MS = [200, 1_000, 3_000];

export function createOutboxWorker(db: DataSource, transport: MailTransport, opts: OutboxWorkerOptions = {}): OutboxWorker {
  const pollMs = opts.pollMs ?? 500;
  const batchSize = opts.batchSize ?? 10;
  const maxAttempts = opts.maxAttempts ?? DEFAULT_MAX_ATTEMPTS;
  const backoff = opts.backoff ?? DEFAULT_BACKOFF;
  const leaseMs = opts.leaseMs ?? 120_000;
  const log = opts.log ?? ((line: string) => console.warn(line));

  let stopped = true;
  let timer: NodeJS.Timeout | null = null;
  let running: Promise<number> | null = null;
  let lookAgain = false;
  let unsubscribe: (() => void) | null = null;
  /** Set by stop() while a pass may be between sends; the pass hands back what it has not tried. */
  let stopRequested = false;

  async function record(what: string, claim: ClaimedMessage, write: () => Promise<boolean>): Promise<void> {
    for (let i = 0; ; i += 1) {
      try {
        if (!(await write())) log(`[outbox] ${claim.id}: could not record "${what}": another worker claimed it after this claim's lease ran out`);
        return;
      } catch (error) {
        if (i >= RECORD_RETRY_DELAYS_MS.length) {
          log(`[outbox] ${claim.id}: recording "${what}" failed: ${(error as Error).message}`);
          return;
        }
        await sleep(RECORD_RETRY_DELAYS_MS[i]);
      }
    }
  }

  async function deliver(claim: ClaimedMessage): Promise<void> {
    try {
      await transport.sendMail({
        to: claim.to,
        subject: claim.subject,
        text: claim.text,
        html: claim.html ?? undefined,
        messageId: `<${claim.id}@${MESSAGE_ID_DOMAIN}>`,
        headers: { [MESSAGE_ID_HEADER]: claim.id },
      });
    } catch (error) {
      const failure = classifySmtpFailure(error);
      if (failure.kind === 'permanent') {
        await record('failed', claim, () => markFailed(db, claim, failure.reason));
      } else if (claim.attempt >= maxAttempts) {
        await record('failed', claim, () => markFailed(db, claim, `gave up after ${claim.attempt} tries; last: ${failure.reason}`));
      } else {
        const delay = retryDelayMs(claim.attempt, backoff);
        await record('retry', claim, () => markRetry(db, claim, delay, failure.reason));
      }
      return;
    }
    await record('sent', claim, () => markSent(db, claim));
  }

  async function pass(): Promise<number> {
    const claims = await claimDueMessages(db, { limit: batchSize, leaseMs, onlyFlightIds: opts.onlyFlightIds });
    for (const [i, claim] of claims.entries()) {
      if (stopRequested) {
        for (const rest of claims.slice(i)) await record('released', rest, () => releaseClaim(db, rest));
        break;
      }
      await deliver(claim);
    }
    return claims.length;
  }

  function schedule(ms: number): void {
    if (stopped) return;
    if (timer !== null) clearTimeout(timer);
    timer = setTimeout(tick, ms);
    // The worker never keeps the process alive by itself; the HTTP server or the test does.
    timer.unref();
  }

  function tick(): void {
    timer = null;
    if (stopped) return;
    if (running !== null) {
      lookAgain = true;
      return;
    }
    const current = pass().catch((error: unknown) => {
      log(`[outbox] pass failed: ${(error as Error).message}`);
      return 0;
    });
    running = current;
    void current.then((claimed) => {
      running = null;
      const more = lookAgain || claimed >= batchSize;
      lookAgain = false;
      schedule(more ? 0 : pollMs);
    });
  }

  function kick(): void {
    if (stopped) return;
    if (running !== null) lookAgain = true;
    else schedule(0);
  }

  return {
    start() {
      if (!stopped) return;
      stopped = false;
      stopRequested = false;
      unsubscribe = domainEventsOf(db).subscribe('mail-queued', kick);
      schedule(0);
    },
    kick,
    async stop() {
      stopped = true;
      stopRequested = true;
      unsubscribe?.();
      unsubscribe = null;
      if (timer !== null) clearTimeout(timer);
      timer = null;
      await running;
    },
    async runOnce() {
      return pass();
    },
  };
}

function sleep(ms: number): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, ms));
}
