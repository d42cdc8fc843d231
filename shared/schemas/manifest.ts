import { z } from 'zod';
import { FARE_TYPE_NAMES } from '../compensation/tickets';
import { apiErrorSchema } from './common';
import { ITINERARY_CELL_EXAMPLE, itineraryCellSchema } from './itinerary';
import { LANGUAGES } from '../i18n/languages';
import { BOOKING_CHANNELS, CHANNEL_RULE } from './booking-channel';
import { seatSchema } from './seat';
import { feeCurrencyProblem, OPTIONAL_FEE_KINDS, OPTIONAL_FEES_CELL_EXAMPLE, optionalFeesCellSchema } from './optional-fees';

/**
 * The manifest CSV a station exports from its booking system: one row per passenger, in our own column layout.
 * Columns may come in any order; every one must be present (an empty cell is fine where the column is optional).
 */
export const MANIFEST_COLUMNS = [
  'flight_carrier',
  'flight_number',
  'flight_date',
  'pnr',
  'sequence',
  'first_name',
  'last_name',
  'cabin',
  'fare_minor',
  'fare_currency',
  'fare_type',
  'ssr_codes',
  'frequent_flyer_tier',
  'is_child',
  'inbound_flight',
  'inbound_scheduled_arrival',
  'contact_email',
] as const;
/** Columns a file may leave out: older exports without them still import. */
export const MANIFEST_OPTIONAL_COLUMNS = ['itinerary', 'language', 'channel', 'seat', 'optional_fees'] as const;
export const MANIFEST_ALL_COLUMNS = [...MANIFEST_COLUMNS, ...MANIFEST_OPTIONAL_COLUMNS] as const;
export type ManifestColumn = (typeof MANIFEST_ALL_COLUMNS)[number];

/** What each column holds, shown beside the template download. */
export const MANIFEST_COLUMN_HELP: Record<ManifestColumn, string> = {
  flight_carrier: 'Airline designator, 2-3 letters or digits (ZZ).',
  flight_number: '1-4 digits, optionally a letter suffix (107).',
  flight_date: 'Local departure date at this station, YYYY-MM-DD.',
  pnr: 'Booking reference, 5-8 letters or digits.',
  sequence: "Passenger's position in the PNR, 1-9; stays the same across exports.",
  first_name: 'Given name.',
  last_name: 'Family name.',
  cabin: 'One capital letter that the flight has seats in (J, Y).',
  fare_minor: 'Fare paid in minor units, digits only (18950 = 189.50).',
  fare_currency: 'ISO 4217 code (USD, EUR, CAD).',
  fare_type: `${FARE_TYPE_NAMES.join(', ')}; empty means standard. award = bought with frequent-flyer points; staff = a reduced fare not sold to the public; free = no fare at all.`,
  ssr_codes: 'Special-service codes separated by spaces (WCHR CHLD); may be empty.',
  frequent_flyer_tier: 'Tier name, or empty.',
  is_child: 'true or false; empty means false.',
  inbound_flight: 'The connecting flight that brings the passenger (ZZ386), or empty for a local passenger.',
  inbound_scheduled_arrival: 'Scheduled arrival of the inbound flight, ISO 8601 with offset (2026-12-01T14:05:00-05:00).',
  contact_email: 'Booking contact e-mail, the same on every row of the PNR; may be empty.',
  seat: 'Optional. The seat assigned in advance, a row number and a letter (14C); empty keeps the seat check-in gave.',
  language: 'Optional. The language the passengers read: en, fr, es, de or it; empty when not known.',
  channel: `Optional. Where the booking was made: ${BOOKING_CHANNELS.join(', ')}; the same on every row of the PNR; empty when not known.`,
  optional_fees: `Optional. Extras paid on top of the fare, separated by ";", each kind:minor units:currency ("${OPTIONAL_FEES_CELL_EXAMPLE}"); kinds: ${OPTIONAL_FEE_KINDS.join(', ')}; in the fare's currency; empty when none.`,
  itinerary: `Optional. The flights after this one to the final destination on the ticket, separated by ";", each like "${ITINERARY_CELL_EXAMPLE}"; the same on every row of the PNR; empty when this flight ends the journey.`,
};

export const MANIFEST_MAX_BYTES = 2 * 1024 * 1024;
/** Parties larger than nine are group bookings split across PNRs in most booking systems (common practice). */
export const MANIFEST_MAX_PARTY = 9;
/** The passengers table stores fares in a signed 32-bit column. */
const MAX_FARE_MINOR = 2_147_483_647;

const cell = z.string().trim();
const upper = cell.transform((s) => s.toUpperCase());
const required = (col: string, max: number) => cell.pipe(z.string().min(1, `${col} is required`).max(max, `${col} must be at most ${max} characters`));
const optional = (col: string, max: number) =>
  cell.pipe(z.string().max(max, `${col} must be at most ${max} characters`)).transform((s) => (s === '' ? null : s));

/** One CSV row as text cells in, typed passenger fields out; each message names its column. */
export const manifestRowSchema = z
  .object({
    flight_carrier: upper.pipe(z.string().regex(/^[A-Z0-9]{2,3}$/, 'flight_carrier must be a 2-3 character airline designator')),
    flight_number: upper.pipe(z.string().regex(/^\d{1,4}[A-Z]?$/, 'flight_number must be 1-4 digits, optionally a letter suffix')),
    flight_date: cell.pipe(z.iso.date({ error: 'flight_date must be a calendar date YYYY-MM-DD' })),
    pnr: upper.pipe(z.string().regex(/^[A-Z0-9]{5,8}$/, 'pnr must be 5-8 letters or digits')),
    sequence: cell.pipe(z.string().regex(/^[1-9]$/, `sequence must be a whole number from 1 to ${MANIFEST_MAX_PARTY}`)).transform(Number),
    first_name: required('first_name', 60),
    last_name: required('last_name', 60),
    cabin: upper.pipe(z.string().regex(/^[A-Z]$/, 'cabin must be one letter')),
    fare_minor: cell
      .pipe(z.string().regex(/^\d+$/, 'fare_minor must be whole minor units, digits only (18950 for 189.50)'))
      .transform(Number)
      .pipe(z.number().max(MAX_FARE_MINOR, 'fare_minor is too large')),
    fare_currency: upper.pipe(z.string().regex(/^[A-Z]{3}$/, 'fare_currency must be a three-letter ISO 4217 code')),
    fare_type: cell
      .transform((s) => s.toLowerCase() || 'standard')
      .pipe(z.enum(FARE_TYPE_NAMES, { error: `fare_type must be one of ${FARE_TYPE_NAMES.join(', ')}` })),
    ssr_codes: upper
      .transform((s) => (s === '' ? [] : s.split(/\s+/)))
      .pipe(z.array(z.string().regex(/^[A-Z]{4}$/, 'ssr_codes must be four-letter codes separated by spaces'))),
    frequent_flyer_tier: optional('frequent_flyer_tier', 16),
    is_child: cell
      .transform((s) => s.toLowerCase())
      .pipe(z.enum(['', 'true', 'false'], { error: 'is_child must be true or false' }))
      .transform((s) => s === 'true'),
    inbound_flight: upper.transform((s) => s.replace(/\s+/g, '')).pipe(z.string().max(10, 'inbound_flight must be at most 10 characters')).transform((s) => s || null),
    inbound_scheduled_arrival: cell.pipe(
      z.union([z.literal('').transform(() => null), z.iso.datetime({ offset: true, error: 'inbound_scheduled_arrival must be an ISO 8601 date-time with an offset' })]),
    ),
    contact_email: cell.pipe(z.union([z.literal('').transform(() => null), z.email({ error: 'contact_email must be an e-mail address' })])),
    itinerary: z.string().optional().transform((s) => s ?? '').pipe(itineraryCellSchema),
    seat: z.string().optional().transform((s) => s ?? '').pipe(seatSchema('seat')),
    language: z.string().optional().transform((s) => (s ?? '').trim().toLowerCase())
      .pipe(z.enum(['', ...LANGUAGES], { error: `language must be one of ${LANGUAGES.join(', ')}, or empty` })).transform((s) => s || null),
    channel: z.string().optional().transform((s) => (s ?? '').trim().toLowerCase())
      // One enum with '' in it rather than a union: a union's refusal reads "Invalid input" and names no rule.
      .pipe(z.enum(['', ...BOOKING_CHANNELS], { error: `${CHANNEL_RULE}, or empty` })).transform((s) => s || null),
    optional_fees: z.string().optional().transform((s) => s ?? '').pipe(optionalFeesCellSchema),
  })
  // Only once every cell passed: a broken cell above should not also raise this rule about the same row.
  .refine((row) => !(row.inbound_scheduled_arrival && !row.inbound_flight), {
    path: ['inbound_flight'],
    message: 'inbound_flight is required when inbound_scheduled_arrival is given',
    when: (payload) => payload.issues.length === 0,
  })
  .superRefine((row, ctx) => {
    // Another cell's problem already reported: the fees are checked against a fare currency that parsed.
    if (!Array.isArray(row.optional_fees) || typeof row.fare_currency !== 'string') return;
    const problem = feeCurrencyProblem(row.optional_fees, row.fare_currency);
    if (problem) ctx.addIssue({ code: 'custom', path: ['optional_fees'], message: `optional_fees ${problem.rule}` });
  });
export type ManifestRow = z.infer<typeof manifestRowSchema>;

/** A problem in the file: the line as an editor shows it (header = line 1), the column, and the rule broken. */
export const manifestProblemSchema = z.object({ line: z.number().int(), field: z.string(), rule: z.string() });
export type ManifestProblem = z.infer<typeof manifestProblemSchema>;

/** What an import would change on one flight, passenger by passenger. */
export const manifestFlightDiffSchema = z.object({
  added: z.number().int(),
  changed: z.number().int(),
  /** Travelling now and missing from the file: the import cancels them, so it needs a confirmation. */
  removed: z.number().int(),
  unchanged: z.number().int(),
  addedNames: z.array(z.string()),
  changedNames: z.array(z.string()),
  removedNames: z.array(z.string()),
});
export type ManifestFlightDiff = z.infer<typeof manifestFlightDiffSchema>;

export const manifestFlightPreviewSchema = z.object({
  carrier: z.string(),
  number: z.string(),
  date: z.string(),
  found: z.boolean(),
  /** Bookings and passengers the file holds for this flight. */
  bookings: z.number().int(),
  passengers: z.number().int(),
  /** Passengers stored now and missing from the file: an import marks them cancelled. */
  willCancel: z.number().int(),
  /** Seats on the flight and the most bookings the station allows on it; null when the flight was not found. */
  seats: z.number().int().nullable(),
  bookingLimit: z.number().int().nullable(),
  diff: manifestFlightDiffSchema.nullable(),
});
export type ManifestFlightPreview = z.infer<typeof manifestFlightPreviewSchema>;

/** The multipart field that confirms an import which cancels passengers, sent after the preview listed them. */
export const MANIFEST_CONFIRM_FIELD = 'confirmRemovals';

export const manifestPreviewSchema = z.object({
  rows: z.number().int(),
  /** True when the import would cancel anyone: it then needs confirmRemovals=true. */
  needsConfirmation: z.boolean(),
  flights: z.array(manifestFlightPreviewSchema),
  errors: z.array(manifestProblemSchema),
});
export type ManifestPreview = z.infer<typeof manifestPreviewSchema>;

export const manifestImportCountsSchema = z.object({
  bookingsCreated: z.number().int(),
  bookingsUpdated: z.number().int(),
  bookingsCancelled: z.number().int(),
  passengersCreated: z.number().int(),
  passengersUpdated: z.number().int(),
  passengersCancelled: z.number().int(),
});
export type ManifestImportCounts = z.infer<typeof manifestImportCountsSchema>;

export const manifestImportResultSchema = z.object({
  rows: z.number().int(),
  flights: z.array(z.object({ flightId: z.number().int(), carrier: z.string(), number: z.string(), date: z.string(), counts: manifestImportCountsSchema })),
  totals: manifestImportCountsSchema,
});
export type ManifestImportResult = z.infer<typeof manifestImportResultSchema>;

/** The 400 of an import that found problems: the usual error shape plus every problem with its line. */
export const manifestRejectedSchema = apiErrorSchema.extend({ errors: z.array(manifestProblemSchema) });
export type ManifestRejected = z.infer<typeof manifestRejectedSchema>;
