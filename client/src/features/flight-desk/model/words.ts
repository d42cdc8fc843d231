// Plain words for codes the feed sends, so an agent with a queue in front of them never has to decode anything.
import type { FlightState } from '@shared/schemas/flights';
import type { DeskPassenger } from '@shared/schemas/flight-desk';

export const FLIGHT_STATE_WORDS: Record<FlightState, string> = {
  scheduled: 'Scheduled',
  'check-in-open': 'Check-in open',
  boarding: 'Boarding',
  closed: 'Closed',
  departed: 'Departed',
  cancelled: 'Cancelled',
};

export type PassengerStatus = DeskPassenger['status'];

/** Each status has its own shape as well as words, so a column of them reads without colour. */
export const PASSENGER_STATUS: Record<PassengerStatus, { word: string; icon: string; cls: string }> = {
  booked: { word: 'Not checked in', icon: '○', cls: 'text-ink-soft' },
  'checked-in': { word: 'Checked in', icon: '◐', cls: 'text-harbour' },
  boarded: { word: 'Boarded', icon: '●', cls: 'text-calm' },
  offloaded: { word: 'Offloaded', icon: '✕', cls: 'text-alert' },
  cancelled: { word: 'Cancelled', icon: '–', cls: 'text-ink-soft line-through' },
};

// Common practice for cabin letters (carriers define their own booking classes; these are the usual cabin codes).
const CABIN_NAMES: Record<string, string> = { F: 'First', J: 'Business', W: 'Premium economy', Y: 'Economy' };

export function cabinName(cabin: string) {
  return CABIN_NAMES[cabin] ? `${CABIN_NAMES[cabin]} (${cabin})` : `Cabin ${cabin}`;
}

// Meanings of the standard four-letter special service request codes (IATA SSR codes, from memory).
const SSR_WORDS: Record<string, string> = {
  WCHR: 'Wheelchair to the aircraft door; can use stairs and walk in the cabin',
  WCHS: 'Wheelchair; cannot use stairs, can walk in the cabin',
  WCHC: 'Wheelchair all the way to the seat; cannot walk',
  BLND: 'Blind or low-vision passenger',
  DEAF: 'Deaf or hard-of-hearing passenger',
  DPNA: 'Passenger with an intellectual or developmental disability needing assistance',
  UMNR: 'Unaccompanied minor',
  INFT: 'Infant on lap',
  CHLD: 'Child',
  MEDA: 'Medical case',
  PETC: 'Pet in the cabin',
};

export function ssrWords(code: string) {
  return SSR_WORDS[code] ?? `Special service request ${code}`;
}

const EVENT_TYPE_WORDS: Record<string, string> = {
  'booking.added': 'Booking added',
  'booking.cancelled': 'Booking cancelled',
  'passenger.checked-in': 'Checked in',
  'check-in.cancelled': 'Check-in cancelled',
  'passenger.boarded': 'Boarded',
  'passenger.offloaded': 'Offloaded',
  'inbound.updated': 'Connection update',
  'forecast.shock-set': 'Odds setting changed',
};

export function eventTypeWords(type: string) {
  return EVENT_TYPE_WORDS[type] ?? type.replace(/[.-]/g, ' ').replace(/^./, (c) => c.toUpperCase());
}

const EVENT_STATUS_WORDS: Record<string, string> = {
  applied: 'Applied',
  duplicate: 'Repeat, ignored',
  superseded: 'Older than what we know, ignored',
  rejected: 'Rejected',
};

export function eventStatusWords(status: string) {
  return EVENT_STATUS_WORDS[status] ?? status;
}
