import { z } from 'zod';

/** An onward flight of the ticket after the one at this station; times are ISO 8601 with their offset. */
export const itinerarySegmentSchema = z.object({
  carrier: z.string().regex(/^[A-Z0-9]{2,3}$/, 'carrier must be a 2-3 character airline designator'),
  number: z.string().regex(/^\d{1,4}[A-Z]?$/, 'number must be 1-4 digits, optionally a letter suffix'),
  origin: z.string().regex(/^[A-Z]{3}$/, 'origin must be a three-letter IATA airport code'),
  destination: z.string().regex(/^[A-Z]{3}$/, 'destination must be a three-letter IATA airport code'),
  departure: z.iso.datetime({ offset: true, error: 'departure must be an ISO 8601 date-time with an offset' }),
  arrival: z.iso.datetime({ offset: true, error: 'arrival must be an ISO 8601 date-time with an offset' }),
});
export type ItinerarySegment = z.infer<typeof itinerarySegmentSchema>;

/** A ticket rarely has more than a handful of onward flights; the cap keeps a bad feed from storing thousands. */
export const MAX_ONWARD_SEGMENTS = 6;
export const onwardItinerarySchema = z.array(itinerarySegmentSchema).max(MAX_ONWARD_SEGMENTS, `at most ${MAX_ONWARD_SEGMENTS} onward flights`);

/**
 * The manifest's `itinerary` cell: onward flights separated by ";", each "ZZ450 FRA-JFK <departure> <arrival>"
 * (our own layout). Empty means this flight ends the journey.
 */
export const ITINERARY_CELL_EXAMPLE = 'ZZ450 BRU-HAM 2027-01-15T11:30+01:00 2027-01-15T12:40+01:00';
const SEGMENT_TEXT = /^([A-Z0-9]{2,3}?)(\d{1,4}[A-Z]?)\s+([A-Z]{3})-([A-Z]{3})\s+(\S+)\s+(\S+)$/;

/** "2027-01-15T11:30+01:00" is fine to type; the schema wants seconds. */
const withSeconds = (t: string) => t.replace(/T(\d{2}:\d{2})(?=[+\-Z])/, 'T$1:00');

export const itineraryCellSchema = z
  .string()
  .trim()
  .transform((text, ctx) => {
    if (text === '') return [];
    const segments: ItinerarySegment[] = [];
    for (const [i, part] of text.split(';').map((p) => p.trim().toUpperCase()).entries()) {
      const m = SEGMENT_TEXT.exec(part);
      if (!m) {
        ctx.addIssue({ code: 'custom', message: `itinerary flight ${i + 1} must read like "${ITINERARY_CELL_EXAMPLE}"` });
        return z.NEVER;
      }
      const parsed = itinerarySegmentSchema.safeParse({ carrier: m[1], number: m[2], origin: m[3], destination: m[4], departure: withSeconds(m[5]), arrival: withSeconds(m[6]) });
      if (!parsed.success) {
        ctx.addIssue({ code: 'custom', message: `itinerary flight ${i + 1}: ${parsed.error.issues[0].message}` });
        return z.NEVER;
      }
      segments.push(parsed.data);
    }
    return segments;
  })
  .pipe(onwardItinerarySchema);

/** The cell text of an itinerary, the inverse of itineraryCellSchema. */
export function itineraryCell(segments: readonly ItinerarySegment[] | null | undefined): string {
  return (segments ?? []).map((s) => `${s.carrier}${s.number} ${s.origin}-${s.destination} ${s.departure} ${s.arrival}`).join('; ');
}
