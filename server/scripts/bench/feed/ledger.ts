// Which feed events each "flight changed" message covers, and so the latency of every event to every console.
//
// Method. The server coalesces: it recomputes a dirty flight at most every 150 ms and then tells the flight's room
// once, so one message covers every event whose change had committed when that recompute read the passengers. The
// recompute stamps its figures with the moment it started (flight_forecasts.computed_at, before it reads), so:
//   an event is covered by update k of flight F when its POST had been answered (its transaction committed) no later
//   than computed_at of update k, and no earlier update covered it.
// On the first arrival of update k at any client, the bench reads computed_at of F (one primary-key SELECT). An event
// committed between computed_at and the actual read counts towards the next update: the error only ever makes a
// latency longer, never shorter. Each client receives F's updates in the order they were sent, so the n-th message a
// client gets for F is update n of F for every client of F. A read that returns the same computed_at as the read
// before it means a later recompute had already finished (the earlier update took events that were its own); such
// reads are counted as races and would shorten latencies, so a result with races is flagged.
import { percentile } from './stats';

interface SentEvent {
  sentAt: number;
  answeredAt: number | null;
}

interface UpdateRecord {
  receipts: number[];
  /** The events this update covers, once known. */
  covered: SentEvent[] | null;
  computedAt: number;
}

class FlightLedger {
  answered: SentEvent[] = [];
  inFlight = 0;
  updates: UpdateRecord[] = [];
  seenByClient = new Map<number, number>();
  lastComputedAt = -Infinity;
  lookups: Promise<void> = Promise.resolve();
}

export interface LatencyFigures {
  /** Every (event, console) delivery: from the event's POST to that console's message. */
  deliveries: { count: number; p50: number; p99: number; max: number };
  /** Per event, to the first and to the last console watching its flight. */
  firstConsole: { p50: number; p99: number };
  lastConsole: { p50: number; p99: number };
  /** Where the time goes, per event: from its POST's answer to the recompute's start (coalescing window and queue),
   * and from the recompute's start to the first console (the recompute itself, the emit and the delivery). */
  answerToRecompute: { p50: number; p99: number };
  recomputeToConsole: { p50: number; p99: number };
  eventsCovered: number;
  eventsNeverCovered: number;
  updates: number;
  races: number;
  /** Per flight, the fewest and most messages any of its consoles received: equal when no message was lost. */
  messagesPerConsole: { fewest: number; most: number; flightsWithGaps: number };
}

export class Ledger {
  private readonly flights = new Map<number, FlightLedger>();
  private races = 0;

  constructor(
    flightIds: number[],
    private readonly computedAt: (flightId: number) => Promise<number | null>,
  ) {
    for (const id of flightIds) this.flights.set(id, new FlightLedger());
  }

  private flight(id: number): FlightLedger {
    const f = this.flights.get(id);
    if (!f) throw new Error(`flight ${id} is not driven by this bench`);
    return f;
  }

  /** Forgets messages seen so far (start-up recomputes), so update numbering starts together for every console. */
  reset(): void {
    for (const [id, f] of this.flights) if (f.answered.length || f.inFlight) throw new Error(`flight ${id} has events in flight; reset only before the load`);
    for (const id of this.flights.keys()) this.flights.set(id, new FlightLedger());
    this.races = 0;
  }

  /** Records a POST about to go out; call the returned function with the outcome when it answers. */
  sent(flightId: number, sentAt: number): (applied: boolean, answeredAt: number) => void {
    const f = this.flight(flightId);
    const event: SentEvent = { sentAt, answeredAt: null };
    f.inFlight++;
    return (applied, answeredAt) => {
      f.inFlight--;
      // A rejected or failed event changed nothing, so no update will ever cover it: it is counted elsewhere.
      if (!applied) return;
      event.answeredAt = answeredAt;
      f.answered.push(event);
    };
  }

  received(client: number, flightId: number, receivedAt: number): void {
    const f = this.flight(flightId);
    const k = f.seenByClient.get(client) ?? 0;
    f.seenByClient.set(client, k + 1);
    let update = f.updates[k];
    if (!update) {
      update = { receipts: [], covered: null, computedAt: NaN };
      f.updates[k] = update;
      const record = update;
      // Lookups of one flight run one after another, so update k takes its events before update k + 1 does.
      f.lookups = f.lookups.then(async () => {
        const at = (await this.computedAt(flightId)) ?? -Infinity;
        if (at <= f.lastComputedAt) this.races++;
        f.lastComputedAt = Math.max(f.lastComputedAt, at);
        const covered = f.answered.filter((e) => (e.answeredAt ?? Infinity) <= at);
        f.answered = f.answered.filter((e) => (e.answeredAt ?? Infinity) > at);
        record.covered = covered;
        record.computedAt = at;
      });
    }
    update.receipts.push(receivedAt);
  }

  /** Events posted and applied that no update has covered yet (plus those whose POST has not answered). */
  uncovered(): number {
    let n = 0;
    for (const f of this.flights.values()) n += f.answered.length + f.inFlight;
    return n;
  }

  /** Waits for the computed_at look-ups already started. */
  async settle(): Promise<void> {
    await Promise.all([...this.flights.values()].map((f) => f.lookups));
  }

  figures(): LatencyFigures {
    const deliveries: number[] = [];
    const first: number[] = [];
    const last: number[] = [];
    const waits: number[] = [];
    const recomputes: number[] = [];
    let updates = 0;
    let fewest = Infinity;
    let most = 0;
    let flightsWithGaps = 0;
    for (const f of this.flights.values()) {
      updates += f.updates.length;
      const counts = [...f.seenByClient.values()];
      if (counts.length) {
        fewest = Math.min(fewest, ...counts);
        most = Math.max(most, ...counts);
        if (Math.min(...counts) !== Math.max(...counts)) flightsWithGaps++;
      }
      for (const u of f.updates) {
        if (!u.covered?.length) continue;
        const earliest = Math.min(...u.receipts);
        const latest = Math.max(...u.receipts);
        recomputes.push(earliest - u.computedAt);
        for (const e of u.covered) {
          first.push(earliest - e.sentAt);
          last.push(latest - e.sentAt);
          waits.push(u.computedAt - (e.answeredAt ?? NaN));
          for (const r of u.receipts) deliveries.push(r - e.sentAt);
        }
      }
    }
    return {
      deliveries: { count: deliveries.length, p50: percentile(deliveries, 50), p99: percentile(deliveries, 99), max: percentile(deliveries, 100) },
      firstConsole: { p50: percentile(first, 50), p99: percentile(first, 99) },
      lastConsole: { p50: percentile(last, 50), p99: percentile(last, 99) },
      answerToRecompute: { p50: percentile(waits, 50), p99: percentile(waits, 99) },
      recomputeToConsole: { p50: percentile(recomputes, 50), p99: percentile(recomputes, 99) },
      eventsCovered: first.length,
      eventsNeverCovered: this.uncovered(),
      updates,
      races: this.races,
      messagesPerConsole: { fewest: Number.isFinite(fewest) ? fewest : 0, most, flightsWithGaps },
    };
  }
}
