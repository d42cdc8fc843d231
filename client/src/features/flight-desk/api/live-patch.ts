// What a flight notice does to the desk's cache. Each list holds the version it was built at; a notice for the next
// version patches it in place, a notice further ahead (a missed one) refetches it, an older one changes nothing.
import type { QueryClient } from '@tanstack/react-query';
import { expandForecast, type ChangedPayload } from '@shared/events';
import type { DeskPassenger, FlightDesk } from '@shared/schemas/flight-desk';
import { flightKeys } from './flight-desk';

/** Rows the event trail keeps, as the server sends it. */
const TRAIL_ROWS = 200;

type Step = 'patch' | 'refetch' | 'skip';

/** Where a list at `held` stands against a notice that brings `next`. */
export function stepFor(held: number | undefined, next: number): Step {
  if (held === undefined) return 'skip'; // nothing shown yet: the list's own first fetch brings the latest
  if (next === held + 1) return 'patch';
  return next > held + 1 ? 'refetch' : 'skip';
}

/** Rows changed or added, in place; the list's order (by name) is kept, a new passenger lands where the name sorts. */
export function mergePassengers(held: DeskPassenger[], changed: DeskPassenger[]): DeskPassenger[] {
  const byId = new Map(changed.map((p) => [p.id, p]));
  const next = held.map((p) => byId.get(p.id) ?? p);
  const known = new Set(held.map((p) => p.id));
  const added = changed.filter((p) => !known.has(p.id));
  if (!added.length) return next;
  const byName = (a: DeskPassenger, b: DeskPassenger) => a.lastName.localeCompare(b.lastName) || a.firstName.localeCompare(b.firstName) || a.id - b.id;
  return [...next, ...added].sort(byName);
}

/** Applies one notice; returns the keys that must be fetched again. */
export function applyFlightNotice(qc: QueryClient, flightId: number, p: ChangedPayload): readonly unknown[][] {
  // A notice without a version says something else moved (rounds, denials): the recompute that follows brings ours.
  if (p.version === undefined) return [];
  const version = p.version;
  const refetch: unknown[][] = [];
  const each = <T extends { version: number }>(key: readonly unknown[], patch: ((held: T) => T) | null) => {
    const held = qc.getQueryData<T>(key);
    const step = stepFor(held?.version, version);
    if (step === 'skip' || !held) return;
    if (step === 'refetch' || !patch) refetch.push([...key]);
    else qc.setQueryData<T>(key, { ...patch(held), version });
  };

  const desk = p.desk;
  each(flightKeys.detail(flightId), desk ? (held: FlightDesk) => ({
    ...held, flight: desk.flight, cabins: desk.cabins, totals: desk.totals, forecast: desk.forecast && expandForecast(desk.forecast), version,
  }) : null);
  const passengers = p.passengers;
  each(flightKeys.passengers(flightId), passengers ? (held: { version: number; passengers: DeskPassenger[] }) => ({ ...held, passengers: mergePassengers(held.passengers, passengers) }) : null);
  const events = p.events;
  each(flightKeys.events(flightId), events ? (held: { version: number; events: { id: number }[] }) => {
    const seen = new Set(events.map((e) => e.id));
    return { ...held, events: [...events, ...held.events.filter((e) => !seen.has(e.id))].slice(0, TRAIL_ROWS) };
  } : null);
  const point = p.point;
  each(flightKeys.forecastHistory(flightId), (held: { version: number; points: { at: string }[] }) => ({
    ...held, points: point && !held.points.some((x) => x.at === point.at) ? [...held.points, point] : held.points,
  }));
  return refetch;
}
