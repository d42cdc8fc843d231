// Checks each row against the shared row schema, then the rules that span rows: one row per passenger and one
// contact per PNR (a party holds at most nine, as sequence runs 1-9). Groups the good rows by flight and PNR for the database step.
import { manifestRowSchema, type ManifestProblem, type ManifestRow } from '@shared/schemas/manifest';
import { itineraryCell, type ItinerarySegment } from '@shared/schemas/itinerary';
import type { Language } from '@shared/i18n';
import type { BookingChannel } from '@shared/schemas/booking-channel';
import type { CsvRecord } from './manifest-csv';

export interface ManifestPassengerRow {
  line: number;
  sequence: number;
  row: ManifestRow;
}

export interface ManifestBookingGroup {
  pnr: string;
  firstLine: number;
  contactEmail: string | null;
  /** The first language given on the PNR's rows. */
  language: Language | null;
  /** Where the booking was made; the same on every row that names one. */
  channel: BookingChannel | null;
  /** Onward flights to the final destination; one journey per PNR. */
  itinerary: ItinerarySegment[];
  passengers: ManifestPassengerRow[];
}

export interface ManifestFlightGroup {
  carrier: string;
  number: string;
  date: string;
  firstLine: number;
  lines: number[];
  bookings: Map<string, ManifestBookingGroup>;
}

export const flightKey = (carrier: string, number: string, date: string) => `${carrier}|${number}|${date}`;

export function groupManifestRows(records: CsvRecord[]): { flights: Map<string, ManifestFlightGroup>; problems: ManifestProblem[] } {
  const problems: ManifestProblem[] = [];
  const flights = new Map<string, ManifestFlightGroup>();
  const seenPassenger = new Map<string, number>();

  for (const { line, cells } of records) {
    const parsed = manifestRowSchema.safeParse(cells);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) problems.push({ line, field: String(issue.path[0] ?? 'row'), rule: issue.message });
      continue;
    }
    const row = parsed.data;
    const fKey = flightKey(row.flight_carrier, row.flight_number, row.flight_date);
    const passengerKey = `${fKey}|${row.pnr}|${row.sequence}`;
    const earlier = seenPassenger.get(passengerKey);
    if (earlier !== undefined) {
      problems.push({ line, field: 'sequence', rule: `passenger ${row.pnr}/${row.sequence} on this flight already appears on line ${earlier}` });
      continue;
    }
    seenPassenger.set(passengerKey, line);

    let flight = flights.get(fKey);
    if (!flight) {
      flight = { carrier: row.flight_carrier, number: row.flight_number, date: row.flight_date, firstLine: line, lines: [], bookings: new Map() };
      flights.set(fKey, flight);
    }
    flight.lines.push(line);
    let booking = flight.bookings.get(row.pnr);
    if (!booking) {
      booking = { pnr: row.pnr, firstLine: line, contactEmail: null, language: null, channel: null, itinerary: row.itinerary, passengers: [] };
      flight.bookings.set(row.pnr, booking);
    }
    if (row.contact_email) {
      if (booking.contactEmail && booking.contactEmail.toLowerCase() !== row.contact_email.toLowerCase()) {
        problems.push({ line, field: 'contact_email', rule: `must be the same on every row of PNR ${row.pnr} (an earlier row has ${booking.contactEmail})` });
        continue;
      }
      booking.contactEmail = row.contact_email;
    }
    if (row.language && !booking.language) booking.language = row.language;
    if (row.channel) {
      if (booking.channel && booking.channel !== row.channel) {
        problems.push({ line, field: 'channel', rule: `must be the same on every row of PNR ${row.pnr} (an earlier row has ${booking.channel})` });
        continue;
      }
      booking.channel = row.channel;
    }
    if (itineraryCell(row.itinerary) !== itineraryCell(booking.itinerary)) {
      problems.push({ line, field: 'itinerary', rule: `must be the same on every row of PNR ${row.pnr} (line ${booking.firstLine} has "${itineraryCell(booking.itinerary) || 'none'}")` });
      continue;
    }
    booking.passengers.push({ line, sequence: row.sequence, row });
  }
  return { flights, problems };
}
