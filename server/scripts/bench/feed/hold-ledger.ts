// When each console first holds data that reflects each feed event: the figures a console holds carry the moment
// their recompute took its snapshot (forecast.computedAt, taken before it reads the passengers), so they reflect
// every event whose POST had been answered, hence committed, by then. An event committed between the snapshot and
// its answer counts towards the next figures: the error only ever makes a latency longer, never shorter.
import { percentile } from './stats';

interface Answered {
  sentAt: number;
  answeredAt: number;
}

export interface HoldFigures {
  /** Every (event, console) pair: from the event's POST to that console holding data that reflects it. */
  pairs: { count: number; p50: number; p95: number; p99: number; max: number };
  /** Pairs never reflected by the end of the drain (a console left behind, or figures that never came). */
  neverReflected: number;
  events: number;
}

class FlightHolds {
  answered: Answered[] = [];
  cursor = new Map<number, number>();
}

export class HoldLedger {
  private readonly flights = new Map<number, FlightHolds>();
  private readonly samples: number[] = [];
  private measuring = false;

  constructor(private readonly consolesOf: (flightId: number) => number[]) {}

  private flight(id: number): FlightHolds {
    let f = this.flights.get(id);
    if (!f) this.flights.set(id, (f = new FlightHolds()));
    return f;
  }

  start(): void {
    this.measuring = true;
  }

  /** An applied event of `flightId`, answered at `answeredAt`. */
  answered(flightId: number, sentAt: number, answeredAt: number): void {
    if (this.measuring) this.flight(flightId).answered.push({ sentAt, answeredAt });
  }

  /** Console `client` of `flightId` now holds figures computed at `computedAt`; it got them at `at`. */
  held(client: number, flightId: number, computedAt: number, at: number): void {
    if (!this.measuring) return;
    const f = this.flight(flightId);
    let k = f.cursor.get(client) ?? 0;
    // Answers arrive in time order, so the events a console has caught up with are a prefix of the list.
    while (k < f.answered.length && f.answered[k].answeredAt <= computedAt) this.samples.push(at - f.answered[k++].sentAt);
    f.cursor.set(client, k);
  }

  /** Pairs not reflected yet. */
  behind(): number {
    let n = 0;
    for (const [id, f] of this.flights) for (const c of this.consolesOf(id)) n += f.answered.length - (f.cursor.get(c) ?? 0);
    return n;
  }

  figures(): HoldFigures {
    const s = this.samples;
    let events = 0;
    for (const f of this.flights.values()) events += f.answered.length;
    return {
      pairs: { count: s.length, p50: percentile(s, 50), p95: percentile(s, 95), p99: percentile(s, 99), max: percentile(s, 100) },
      neverReflected: this.behind(),
      events,
    };
  }
}
