// Group commit for the feed. A departure-control system sends at its own rate, often one event per POST; written one
// transaction per POST, every event would pay a commit (a log flush), the id look-up, the flight's look-up and the
// insert of its row on its own. Here a station's POSTs that arrive while its previous batch is being written wait for
// it and are then written together, as one batch: under load the batches grow by themselves, and a lone POST is
// written at once. Each POST still gets the answer for its own events only, in its own order.
import type { DataSource } from 'typeorm';
import type { EventResult } from '@shared/schemas/integration-events';
import { applyEventBatch } from './events.service';

export interface FeedAnswer {
  results: EventResult[];
}

interface Waiting {
  events: unknown[];
  resolve: (answer: FeedAnswer) => void;
  reject: (err: unknown) => void;
}

/** A batch stops taking POSTs at this many events (at least one POST always goes, however large). */
const MOST_EVENTS_PER_BATCH = 500;

class StationLine {
  private waiting: Waiting[] = [];
  private writing = false;

  constructor(private readonly db: DataSource, private readonly stationId: number) {}

  submit(events: unknown[]): Promise<FeedAnswer> {
    return new Promise((resolve, reject) => {
      this.waiting.push({ events, resolve, reject });
      if (!this.writing) void this.drain();
    });
  }

  private take(): Waiting[] {
    let count = 0;
    let n = 0;
    while (n < this.waiting.length && (n === 0 || count + this.waiting[n].events.length <= MOST_EVENTS_PER_BATCH)) count += this.waiting[n++].events.length;
    return this.waiting.splice(0, n);
  }

  private async drain() {
    this.writing = true;
    try {
      while (this.waiting.length > 0) {
        const group = this.take();
        try {
          this.answer(group, await applyEventBatch(this.db, this.stationId, group.flatMap((w) => w.events)));
        } catch (err) {
          if (group.length === 1) group[0].reject(err);
          // Whatever failed the batch (the database gone, a fault no event check foresaw) must not fail the POSTs
          // that only shared its transaction: each is written again alone and gets its own outcome.
          else for (const w of group) await applyEventBatch(this.db, this.stationId, w.events).then(w.resolve, w.reject);
        }
      }
    } finally {
      this.writing = false;
    }
  }

  private answer(group: Waiting[], batch: FeedAnswer) {
    let offset = 0;
    for (const w of group) {
      const results = batch.results.slice(offset, offset + w.events.length).map((r) => ({ ...r, index: r.index - offset }));
      offset += w.events.length;
      w.resolve({ results });
    }
  }
}

const lines = new WeakMap<DataSource, Map<number, StationLine>>();

/** Applies a POST's events in the station's next batch; resolves with this POST's own results. */
export function applyFeedEvents(db: DataSource, stationId: number, events: unknown[]): Promise<FeedAnswer> {
  let stations = lines.get(db);
  if (!stations) lines.set(db, (stations = new Map()));
  let line = stations.get(stationId);
  if (!line) stations.set(stationId, (line = new StationLine(db, stationId)));
  return line.submit(events);
}
