// Nothing lost: after the load, every flight's checked-in count must equal what the bench's own events imply, both as
// stored (SQL) and as the flight desk shows it (the figures of the last recompute, through the API).
import type { DataSource } from 'typeorm';
import { expectedCheckedIn, storedCheckedIn, type BenchFlight } from './fixture';

export interface CountCheck {
  exactStored: number;
  exactShown: number;
  firstMismatch: string | null;
  perFlight: { flight: string; expected: number; stored: number; shown: number | null }[];
}

async function shownCheckedIn(appUrl: string, cookie: string, flightId: number): Promise<number | null> {
  const res = await fetch(`${appUrl}/api/flights/${flightId}`, { headers: { Cookie: cookie }, signal: AbortSignal.timeout(10_000) });
  if (!res.ok) return null;
  const desk = (await res.json()) as { totals?: { checkedIn?: number } };
  return desk.totals?.checkedIn ?? null;
}

export async function verifyCounts(db: DataSource, appUrl: string, cookie: string, flights: BenchFlight[]): Promise<CountCheck> {
  const stored = await storedCheckedIn(db, flights.map((f) => f.id));
  const perFlight = [];
  for (const f of flights) {
    perFlight.push({
      flight: `${f.carrier}${f.number} ${f.date}`,
      expected: expectedCheckedIn(f),
      stored: stored.get(f.id) ?? 0,
      shown: await shownCheckedIn(appUrl, cookie, f.id),
    });
  }
  const wrong = perFlight.find((r) => r.stored !== r.expected || r.shown !== r.expected);
  return {
    exactStored: perFlight.filter((r) => r.stored === r.expected).length,
    exactShown: perFlight.filter((r) => r.shown === r.expected).length,
    firstMismatch: wrong ? `${wrong.flight}: expected ${wrong.expected}, stored ${wrong.stored}, shown ${wrong.shown ?? 'unavailable'}` : null,
    perFlight,
  };
}
