import { ID_PREFIX, newId } from '../ids.js';
import type { FakeStore } from '../store/store.js';
import type { DeliveryRecord, EventObject, WebhookEndpoint } from '../store/types.js';
import type { WebhookFaults } from '../faults/webhookFaults.js';
import { signPayload } from './signature.js';
import { sendOnce } from './sender.js';

export interface WebhookRetryPolicy {
  /** Attempts in total, first one included. */
  maxAttempts: number;
  baseDelayMs: number;
  maxDelayMs: number;
  /** A receiver that has not answered by then counts as a failed attempt. */
  requestTimeoutMs: number;
}

// Stripe's sandbox retries a failed delivery three times (docs.stripe.com/webhooks, "Automatic retries"),
// so four attempts in all; the delays are shortened to seconds for local use (common practice for fakes).
export const DEFAULT_RETRY_POLICY: WebhookRetryPolicy = {
  maxAttempts: 4,
  baseDelayMs: 1_000,
  maxDelayMs: 60_000,
  requestTimeoutMs: 10_000,
};

/** Exponential backoff: base, 2×base, 4×base, … capped. */
export function retryDelayMs(policy: WebhookRetryPolicy, attemptsSoFar: number): number {
  return Math.min(policy.baseDelayMs * 2 ** (attemptsSoFar - 1), policy.maxDelayMs);
}

/**
 * Delivers events to the configured endpoint at least once. One delivery at a time, earliest due first,
 * so ordering faults are observable; every state change is persisted, so pending deliveries survive a restart.
 */
export class WebhookDispatcher {
  private timer: NodeJS.Timeout | null = null;
  private readonly holdTimers = new Map<number, NodeJS.Timeout>();
  private readonly heldBatches = new Map<number, string[]>();
  private inFlight: { id: string; abort: AbortController; done: Promise<void> } | null = null;
  private closed = false;

  constructor(
    private readonly store: FakeStore,
    private readonly faults: WebhookFaults,
    private readonly policy: WebhookRetryPolicy,
    private readonly startupEndpoint: WebhookEndpoint | null,
    private readonly now: () => number,
  ) {}

  start(): void {
    // Batches held for reordering live only in memory; after a restart their events go out straight away.
    this.store.mutate((state) => {
      for (const delivery of state.deliveries.values()) {
        if (delivery.status === 'held') Object.assign(delivery, { status: 'pending', nextAttemptAtMs: this.now() });
      }
    });
    this.pump();
  }

  endpoint(): WebhookEndpoint | null {
    return this.store.state.webhookEndpoint ?? this.startupEndpoint;
  }

  setEndpoint(endpoint: WebhookEndpoint | null): void {
    this.store.mutate((state) => {
      state.webhookEndpoint = endpoint;
    });
  }

  /** Queues deliveries for a new event; call inside the store change that created the event. */
  enqueue(event: EventObject): void {
    const endpoint = this.endpoint();
    if (!endpoint) return;
    const plan = this.faults.plan();
    const now = this.now();
    event.pending_webhooks = plan.copies;
    const payload = JSON.stringify(event, null, 2);
    for (let copy = 0; copy < plan.copies; copy += 1) {
      const delivery: DeliveryRecord = {
        id: newId(ID_PREFIX.delivery),
        eventId: event.id,
        eventType: event.type,
        url: endpoint.url,
        secret: endpoint.secret,
        payload,
        status: plan.reorder ? 'held' : 'pending',
        attempts: 0,
        nextAttemptAtMs: plan.reorder ? null : now + plan.delayMs,
        createdAtMs: now,
        lastAttemptAtMs: null,
        lastStatusCode: null,
        lastError: null,
        duplicate: copy > 0,
      };
      this.store.state.deliveries.set(delivery.id, delivery);
      if (plan.reorder) this.hold(plan.reorder.id, delivery.id, plan.reorder.maxHoldMs);
    }
    if (plan.reorder?.complete) this.release(plan.reorder.id);
    queueMicrotask(() => this.pump());
  }

  deliveries(): DeliveryRecord[] {
    return [...this.store.state.deliveries.values()];
  }

  /** Makes every pending delivery due now (tests use it instead of waiting out a backoff). */
  flush(): void {
    const now = this.now();
    this.store.mutate((state) => {
      for (const delivery of state.deliveries.values()) {
        if (delivery.status === 'pending') delivery.nextAttemptAtMs = now;
      }
    });
    this.pump();
  }

  /** Forgets in-memory holds after a store reset. */
  resetMemory(): void {
    for (const timer of this.holdTimers.values()) clearTimeout(timer);
    this.holdTimers.clear();
    this.heldBatches.clear();
  }

  async close(): Promise<void> {
    this.closed = true;
    if (this.timer) clearTimeout(this.timer);
    this.resetMemory();
    if (this.inFlight) {
      this.inFlight.abort.abort();
      await this.inFlight.done;
    }
  }

  private hold(batchId: number, deliveryId: string, maxHoldMs: number): void {
    const batch = this.heldBatches.get(batchId) ?? [];
    batch.push(deliveryId);
    this.heldBatches.set(batchId, batch);
    if (!this.holdTimers.has(batchId)) {
      const timer = setTimeout(() => this.release(batchId), maxHoldMs);
      timer.unref();
      this.holdTimers.set(batchId, timer);
    }
  }

  /** Sends a held batch newest first: later events get earlier slots. */
  private release(batchId: number): void {
    const ids = this.heldBatches.get(batchId) ?? [];
    this.heldBatches.delete(batchId);
    const timer = this.holdTimers.get(batchId);
    if (timer) clearTimeout(timer);
    this.holdTimers.delete(batchId);
    const now = this.now();
    this.store.mutate((state) => {
      [...ids].reverse().forEach((id, slot) => {
        const delivery = state.deliveries.get(id);
        if (delivery?.status === 'held') Object.assign(delivery, { status: 'pending', nextAttemptAtMs: now + slot });
      });
    });
    queueMicrotask(() => this.pump());
  }

  private nextDue(): DeliveryRecord | null {
    let best: DeliveryRecord | null = null;
    for (const delivery of this.store.state.deliveries.values()) {
      if (delivery.status !== 'pending' || delivery.nextAttemptAtMs === null) continue;
      if (!best || delivery.nextAttemptAtMs < (best.nextAttemptAtMs ?? Infinity)) best = delivery;
    }
    return best;
  }

  private pump(): void {
    if (this.closed || this.inFlight) return;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    const next = this.nextDue();
    if (!next || next.nextAttemptAtMs === null) return;
    const wait = next.nextAttemptAtMs - this.now();
    if (wait > 0) {
      this.timer = setTimeout(() => this.pump(), wait);
      this.timer.unref();
      return;
    }
    const abort = new AbortController();
    const done = this.attempt(next, abort.signal).finally(() => {
      this.inFlight = null;
      this.pump();
    });
    this.inFlight = { id: next.id, abort, done };
  }

  private async attempt(delivery: DeliveryRecord, closing: AbortSignal): Promise<void> {
    const signature = signPayload(delivery.payload, delivery.secret, Math.floor(this.now() / 1000));
    const outcome = await sendOnce(delivery.url, delivery.payload, signature, this.policy.requestTimeoutMs, closing);
    // An attempt cut short by shutdown is not counted: the delivery stays due and is sent after restart.
    if (closing.aborted) return;
    const now = this.now();
    this.store.mutate(() => {
      delivery.attempts += 1;
      delivery.lastAttemptAtMs = now;
      delivery.lastStatusCode = outcome.statusCode;
      delivery.lastError = outcome.error;
      if (outcome.ok) {
        delivery.status = 'delivered';
        delivery.nextAttemptAtMs = null;
      } else if (delivery.attempts >= this.policy.maxAttempts) {
        delivery.status = 'failed';
        delivery.nextAttemptAtMs = null;
      } else {
        delivery.nextAttemptAtMs = now + retryDelayMs(this.policy, delivery.attempts);
      }
      this.refreshPendingCount(delivery.eventId);
    });
  }

  /** `pending_webhooks` on the stored event, as `GET /v1/events/:id` reports it. */
  private refreshPendingCount(eventId: string): void {
    const event = this.store.state.events.get(eventId);
    if (!event) return;
    event.pending_webhooks = [...this.store.state.deliveries.values()].filter(
      (d) => d.eventId === eventId && (d.status === 'pending' || d.status === 'held'),
    ).length;
  }
}
