// How a ticket was paid for, which two rules read differently: the US rule prices a ticket bought without cash at the
// lowest cash fare in its class; the EU and UK rules leave out free and non-public reduced fares but keep frequent-flyer
// tickets in.

export type TicketKind = 'cash' | 'frequent-flyer' | 'free' | 'non-public-reduced';
export const TICKET_KINDS: readonly TicketKind[] = ['cash', 'frequent-flyer', 'free', 'non-public-reduced'];

/** The fare types a manifest or the feed may carry, and the kind of ticket each one is. Our own words. */
export const FARE_TYPES = {
  standard: 'cash',
  flex: 'cash',
  award: 'frequent-flyer',
  staff: 'non-public-reduced',
  free: 'free',
} as const satisfies Record<string, TicketKind>;
export type FareType = keyof typeof FARE_TYPES;
export const FARE_TYPE_NAMES = Object.keys(FARE_TYPES) as FareType[];

export function ticketKindOf(fareType: string): TicketKind {
  const kind = (FARE_TYPES as Record<string, TicketKind>)[fareType];
  if (!kind) throw new RangeError(`fareType: unknown fare type ${JSON.stringify(fareType)}; use one of ${FARE_TYPE_NAMES.join(', ')}`);
  return kind;
}

export function assertTicketKind(field: string, value: unknown): asserts value is TicketKind | undefined {
  if (value !== undefined && !TICKET_KINDS.includes(value as TicketKind)) {
    throw new RangeError(`${field}: expected one of ${TICKET_KINDS.join(', ')}, got ${JSON.stringify(value)}`);
  }
}

/** 14 CFR 250.1 "zero fare ticket": acquired without a substantial monetary payment, such as with frequent-flyer miles, or free. */
export const isZeroFareTicket = (kind: TicketKind | undefined, fareMinor: number) => kind === 'frequent-flyer' || kind === 'free' || fareMinor === 0;

export interface FareOnBoard {
  cabin: string;
  fareMinor: number;
  fareCurrency: string;
  fareType: string;
}

/**
 * The lowest fare paid in cash for the same cabin on the flight, from its bookings: the price 14 CFR 250.5 puts on a
 * zero-fare ticket. Null when no one in that cabin paid cash in that currency.
 */
export function lowestCashFare(onBoard: readonly FareOnBoard[], cabin: string, currency: string): number | null {
  let lowest: number | null = null;
  for (const p of onBoard) {
    if (p.cabin !== cabin || p.fareCurrency !== currency || p.fareMinor <= 0) continue;
    if ((FARE_TYPES as Record<string, TicketKind>)[p.fareType] !== 'cash') continue;
    if (lowest === null || p.fareMinor < lowest) lowest = p.fareMinor;
  }
  return lowest;
}
