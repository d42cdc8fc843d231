import { z } from 'zod';
import { seatSchema } from './seat';
import { minorAmountSchema } from './money';
import { FARE_TYPE_NAMES } from '../compensation/tickets';
import { onwardItinerarySchema } from './itinerary';
import { LANGUAGES } from '../i18n/languages';
import { bookingChannelSchema } from './booking-channel';
import { feeCurrencyProblem, optionalFeesSchema } from './optional-fees';

/** The booking's language for notices, statements and the passenger page; null when the booking system has none. */
export const bookingLanguageSchema = z.enum(LANGUAGES, { error: `language must be one of ${LANGUAGES.join(', ')}` });

const flightRef = z.object({
  carrier: z.string().regex(/^[A-Z0-9]{2,3}$/, 'carrier must be a 2-3 character airline designator'),
  number: z.string().regex(/^\d{1,4}[A-Z]?$/, 'number must be 1-4 digits, optionally a letter suffix'),
  date: z.iso.date({ error: 'date must be a calendar date YYYY-MM-DD (local to the origin)' }),
});

const base = {
  id: z.string().min(1, 'id is required').max(64, 'id must be at most 64 characters'),
  occurredAt: z.iso.datetime({ offset: true, error: 'occurredAt must be an ISO 8601 date-time with a zone' }),
  flight: flightRef,
};

const pnr = z.string().regex(/^[A-Z0-9]{5,8}$/, 'pnr must be 5-8 capital letters or digits');
/** Omitted: the event applies to everyone on the PNR (a party checking in together). */
const sequence = z.number().int().positive('sequence must be a positive whole number').optional();

export const bookingPassengerSchema = z.object({
  firstName: z.string().trim().min(1, 'firstName is required').max(60),
  lastName: z.string().trim().min(1, 'lastName is required').max(60),
  cabin: z.string().regex(/^[A-Z]$/, 'cabin must be one capital letter'),
  fareMinor: minorAmountSchema('fareMinor'),
  fareCurrency: z.string().regex(/^[A-Z]{3}$/, 'fareCurrency must be an ISO 4217 code'),
  fareType: z.enum(FARE_TYPE_NAMES, { error: `fareType must be one of ${FARE_TYPE_NAMES.join(', ')}` }).default('standard'),
  ssrCodes: z.array(z.string().regex(/^[A-Z]{4}$/, 'each SSR code must be four capital letters')).default([]),
  frequentFlyerTier: z.string().max(16).nullable().default(null),
  isChild: z.boolean().default(false),
  inboundFlight: z.string().max(10).nullable().default(null),
  inboundScheduledArrival: z.iso.datetime({ offset: true }).nullable().default(null),
  /** Extras paid on top of the fare, each in the fare's currency. */
  optionalFees: optionalFeesSchema.default([]),
}).superRefine((p, ctx) => {
  const problem = feeCurrencyProblem(p.optionalFees, p.fareCurrency);
  if (problem) ctx.addIssue({ code: 'custom', path: ['optionalFees', problem.index, 'currency'], message: `currency ${problem.rule}` });
});

export const integrationEventSchema = z.discriminatedUnion('type', [
  z.object({ ...base, type: z.literal('booking.added'), pnr, contactEmail: z.email().nullable().default(null), language: bookingLanguageSchema.nullable().default(null),
    channel: bookingChannelSchema.nullable().default(null),
    passengers: z.array(bookingPassengerSchema).min(1).max(9), itinerary: onwardItinerarySchema.default([]) }),
  z.object({ ...base, type: z.literal('booking.cancelled'), pnr }),
  z.object({ ...base, type: z.literal('passenger.checked-in'), pnr, sequence,
    /** The seat check-in gave; only with a sequence, since a seat belongs to one passenger. */
    seat: seatSchema('seat').optional() }).refine((e) => !e.seat || e.sequence !== undefined, { path: ['seat'], message: 'seat needs the passenger\'s sequence' }),
  z.object({ ...base, type: z.literal('check-in.cancelled'), pnr, sequence }),
  z.object({ ...base, type: z.literal('passenger.boarded'), pnr, sequence }),
  z.object({ ...base, type: z.literal('passenger.offloaded'), pnr, sequence }),
  z.object({ ...base, type: z.literal('inbound.updated'), inboundFlight: z.string().min(2).max(10), estimatedArrival: z.iso.datetime({ offset: true }) }),
], { error: 'type must be one of booking.added, booking.cancelled, passenger.checked-in, check-in.cancelled, passenger.boarded, passenger.offloaded, inbound.updated' });
export type IntegrationEvent = z.infer<typeof integrationEventSchema>;
export const INTEGRATION_EVENT_TYPES = ['booking.added', 'booking.cancelled', 'passenger.checked-in', 'check-in.cancelled', 'passenger.boarded', 'passenger.offloaded', 'inbound.updated'] as const;

/** The batch is checked loosely so that one bad event never hides the results of the good ones. */
export const eventBatchSchema = z.object({
  events: z.array(z.unknown(), { error: 'events must be an array' }).min(1, 'events must hold at least one event').max(500, 'events may hold at most 500 events'),
});

export const eventResultSchema = z.object({
  index: z.number(),
  id: z.string().nullable(),
  status: z.enum(['applied', 'duplicate', 'superseded', 'rejected']),
  message: z.string().optional(),
  details: z.array(z.object({ field: z.string(), rule: z.string() })).optional(),
});
export type EventResult = z.infer<typeof eventResultSchema>;
export const eventBatchResponseSchema = z.object({ results: z.array(eventResultSchema), applied: z.number(), rejected: z.number() });

export const integrationKeySchema = z.object({ id: z.number(), stationId: z.number(), name: z.string(), prefix: z.string(), createdAt: z.string(), revokedAt: z.string().nullable(), lastUsedAt: z.string().nullable() });
export const integrationKeyListSchema = z.object({ keys: z.array(integrationKeySchema) });
export const createIntegrationKeyBodySchema = z.object({ name: z.string().trim().min(1, 'name is required').max(60, 'name must be at most 60 characters') });
export const createdIntegrationKeySchema = integrationKeySchema.extend({ key: z.string() });
