import { Trigger, type TriggerSpec } from './random.js';

export type WebhookFaultKind = 'duplicate' | 'delay' | 'reorder';

export interface WebhookFaultSpec extends TriggerSpec {
  kind: WebhookFaultKind;
  /** For `delay`: extra wait before the first attempt. */
  delayMs?: number;
  /** For `reorder`: the batch is released early if it has not filled up after this long. */
  maxHoldMs?: number;
}

export interface ReorderBatch {
  id: number;
  /** True for the last delivery of the batch: release the batch now. */
  complete: boolean;
  maxHoldMs: number;
}

/** How the next event's delivery should be disturbed. */
export interface DeliveryPlan {
  copies: number;
  delayMs: number;
  reorder: ReorderBatch | null;
}

interface TriggeredRule {
  id: number;
  kind: 'duplicate' | 'delay';
  delayMs: number;
  trigger: Trigger;
}

interface ReorderRule {
  id: number;
  size: number;
  taken: number;
  maxHoldMs: number;
}

const DEFAULT_DELAY_MS = 1_000;
const DEFAULT_MAX_HOLD_MS = 2_000;

/**
 * Disturbances Stripe documents for webhooks (events can arrive more than once and out of order),
 * made on demand. `reorder` with count N holds the next N events and sends them newest first.
 */
export class WebhookFaults {
  private triggered: TriggeredRule[] = [];
  private reorder: ReorderRule | null = null;
  private nextId = 1;

  add(spec: WebhookFaultSpec): { id: number } {
    const id = this.nextId++;
    if (spec.kind === 'reorder') {
      this.reorder = { id, size: Math.max(2, spec.count ?? 2), taken: 0, maxHoldMs: spec.maxHoldMs ?? DEFAULT_MAX_HOLD_MS };
    } else {
      this.triggered.push({ id, kind: spec.kind, delayMs: spec.delayMs ?? DEFAULT_DELAY_MS, trigger: new Trigger(spec) });
    }
    return { id };
  }

  plan(): DeliveryPlan {
    const plan: DeliveryPlan = { copies: 1, delayMs: 0, reorder: null };
    for (const rule of this.triggered) {
      if (!rule.trigger.fire()) continue;
      if (rule.kind === 'duplicate') plan.copies = 2;
      else plan.delayMs += rule.delayMs;
    }
    this.triggered = this.triggered.filter((rule) => !rule.trigger.exhausted);
    if (this.reorder) {
      const rule = this.reorder;
      rule.taken += 1;
      plan.reorder = { id: rule.id, complete: rule.taken >= rule.size, maxHoldMs: rule.maxHoldMs };
      if (plan.reorder.complete) this.reorder = null;
    }
    return plan;
  }

  clear(): void {
    this.triggered = [];
    this.reorder = null;
  }

  list(): unknown[] {
    const rules: unknown[] = this.triggered.map((rule) => ({
      id: rule.id,
      kind: rule.kind,
      delayMs: rule.kind === 'delay' ? rule.delayMs : undefined,
      ...rule.trigger.describe(),
    }));
    if (this.reorder) {
      rules.push({ id: this.reorder.id, kind: 'reorder', count: this.reorder.size, held: this.reorder.taken });
    }
    return rules;
  }
}
