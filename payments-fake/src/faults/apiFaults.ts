import { Trigger, type TriggerSpec } from './random.js';

export type ApiFaultKind = 'error500' | 'timeout' | 'drop';
/** `before`: the request never reaches the endpoint. `after`: the endpoint runs (and its result is saved), then delivery fails. */
export type ApiFaultPhase = 'before' | 'after';

export interface ApiFaultSpec extends TriggerSpec {
  kind: ApiFaultKind;
  phase?: ApiFaultPhase;
  /** For `timeout`: how long the response is held. */
  holdMs?: number;
  method?: string;
  /** Only requests whose path starts with this, e.g. `/v1/issuing/cards`. */
  pathPrefix?: string;
}

export interface ApiFault {
  id: number;
  kind: ApiFaultKind;
  phase: ApiFaultPhase;
  holdMs: number;
}

interface Rule extends ApiFault {
  method: string | null;
  pathPrefix: string | null;
  trigger: Trigger;
}

const DEFAULT_HOLD_MS = 5_000;

/**
 * 500s and dropped connections default to `before` (a front-end failure, nothing applied);
 * timeouts default to `after` (the work is done but the answer arrives too late), the case idempotency keys exist for.
 */
function defaultPhase(kind: ApiFaultKind): ApiFaultPhase {
  return kind === 'timeout' ? 'after' : 'before';
}

export class ApiFaults {
  private rules: Rule[] = [];
  private nextId = 1;

  add(spec: ApiFaultSpec): ApiFault {
    const rule: Rule = {
      id: this.nextId++,
      kind: spec.kind,
      phase: spec.phase ?? defaultPhase(spec.kind),
      holdMs: spec.holdMs ?? DEFAULT_HOLD_MS,
      method: spec.method?.toUpperCase() ?? null,
      pathPrefix: spec.pathPrefix ?? null,
      trigger: new Trigger(spec),
    };
    this.rules.push(rule);
    return { id: rule.id, kind: rule.kind, phase: rule.phase, holdMs: rule.holdMs };
  }

  /** Picks the fault for one API request (at most one), consuming it. */
  take(method: string, path: string): ApiFault | null {
    for (const rule of this.rules) {
      if (rule.method && rule.method !== method) continue;
      if (rule.pathPrefix && !path.startsWith(rule.pathPrefix)) continue;
      if (!rule.trigger.fire()) continue;
      this.rules = this.rules.filter((r) => !r.trigger.exhausted);
      return { id: rule.id, kind: rule.kind, phase: rule.phase, holdMs: rule.holdMs };
    }
    return null;
  }

  clear(): void {
    this.rules = [];
  }

  list(): Array<ApiFault & { method: string | null; pathPrefix: string | null; remaining: number | null; probability: number | null }> {
    return this.rules.map((rule) => ({
      id: rule.id,
      kind: rule.kind,
      phase: rule.phase,
      holdMs: rule.holdMs,
      method: rule.method,
      pathPrefix: rule.pathPrefix,
      ...rule.trigger.describe(),
    }));
  }
}
