// What the passenger list can be narrowed to. Kept apart from the table so the rules are tested on their own.
import type { DeskPassenger } from '@shared/schemas/flight-desk';

export type StatusFilter = 'all' | DeskPassenger['status'] | 'not-boarded';
export type ConnectionFilter = 'all' | 'connecting' | 'local';
/** 'all', 'any' (has at least one SSR), or one SSR code. */
export type SsrFilter = string;

export interface PassengerFilters {
  status: StatusFilter;
  cabin: string;
  connection: ConnectionFilter;
  ssr: SsrFilter;
}

export const NO_FILTERS: PassengerFilters = { status: 'all', cabin: 'all', connection: 'all', ssr: 'all' };

export function matchesStatus(p: DeskPassenger, f: StatusFilter) {
  if (f === 'all') return true;
  // Still expected at the gate: booked or checked in, not yet on board and not gone from the flight.
  if (f === 'not-boarded') return p.status === 'booked' || p.status === 'checked-in';
  return p.status === f;
}

export function matchesCabin(p: DeskPassenger, cabin: string) {
  return cabin === 'all' || p.cabin === cabin;
}

export function matchesConnection(p: DeskPassenger, f: ConnectionFilter) {
  if (f === 'all') return true;
  return f === 'connecting' ? p.inboundFlight !== null : p.inboundFlight === null;
}

export function matchesSsr(p: DeskPassenger, f: SsrFilter) {
  if (f === 'all') return true;
  if (f === 'any') return p.ssrCodes.length > 0;
  return p.ssrCodes.includes(f);
}

/**
 * Name in either order, the PNR or the seat; case and accents do not matter, so "Muller" finds "Müller" and "14c"
 * finds seat 14C.
 */
export function matchesSearch(p: DeskPassenger, query: string) {
  const q = fold(query.trim());
  if (!q) return true;
  const haystack = fold(`${p.firstName} ${p.lastName} ${p.lastName} ${p.firstName} ${p.lastName}/${p.firstName} ${p.pnr} ${p.seat ?? ''}`);
  return q.split(/\s+/).every((word) => haystack.includes(word));
}

function fold(s: string) {
  return s.normalize('NFD').replace(/\p{Diacritic}/gu, '').toLowerCase();
}

/** The choices offered in the cabin and SSR filters: only what is on this flight. */
export function filterChoices(passengers: readonly DeskPassenger[]) {
  const cabins = [...new Set(passengers.map((p) => p.cabin))].sort();
  const ssrCodes = [...new Set(passengers.flatMap((p) => p.ssrCodes))].sort();
  return { cabins, ssrCodes };
}
