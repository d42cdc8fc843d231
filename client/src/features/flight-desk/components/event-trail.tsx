import type { z } from 'zod';
import type { flightEventRowSchema } from '@shared/schemas/flight-desk';
import { Panel } from '../../../components/ui/page';
import { formatClock } from '../model/time';
import { eventStatusWords, eventTypeWords } from '../model/words';

type FlightEventRow = z.infer<typeof flightEventRowSchema>;

/** How many trail entries the desk shows: enough for the last hour of a busy gate, short enough to scan. */
export const TRAIL_LENGTH = 50;

/** What happened to this flight, newest first, in plain words. */
export function EventTrail({ events, timeZone }: { events: FlightEventRow[] | undefined; timeZone: string }) {
  const latest = (events ?? []).slice(0, TRAIL_LENGTH);
  return (
    <Panel title="What happened">
      {events === undefined ? (
        <p className="text-ink-soft">Loading the event trail…</p>
      ) : latest.length === 0 ? (
        <p>Nothing has happened to this flight yet.</p>
      ) : (
        <ol className="max-h-[32rem] divide-y divide-line overflow-auto" aria-label={`Latest ${latest.length} events, newest first`} data-testid="event-trail">
          {latest.map((e) => {
            const ignored = e.status !== 'applied';
            return (
              <li key={e.id} className={`py-2 ${ignored ? 'text-ink-soft' : ''}`}>
                <p className="flex items-baseline gap-3">
                  <time dateTime={e.occurredAt} className="font-bold tabular-nums">
                    {formatClock(e.occurredAt, timeZone)}
                  </time>
                  <span className="font-bold">{eventTypeWords(e.type)}</span>
                  {ignored && <span className="rounded border border-line px-1.5 text-sm">{eventStatusWords(e.status)}</span>}
                </p>
                <p>{e.summary}</p>
              </li>
            );
          })}
        </ol>
      )}
    </Panel>
  );
}
