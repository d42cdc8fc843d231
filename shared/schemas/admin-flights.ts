// Flights and weekly schedules as an admin creates, edits and cancels them from the screens.
import { z } from 'zod';
import { iataAirportSchema } from './common';
import { cabinSeatsSchema, flightStateSchema } from './flights';

const carrierSchema = z.string().trim().toUpperCase().regex(/^[A-Z0-9]{2,3}$/, 'carrierCode must be a 2-3 character airline designator');
const flightNumberSchema = z.string().trim().toUpperCase().regex(/^\d{1,4}[A-Z]?$/, 'flightNumber must be 1-4 digits, optionally a letter suffix');
const dateSchema = (field: string) => z.iso.date({ error: `${field} must be a calendar date YYYY-MM-DD` });
const clockSchema = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'departureTime must be a 24-hour clock time HH:mm');
/** Shortest and longest scheduled block times accepted (20 min to 20 h covers every passenger sector flown; common practice). */
const blockSchema = z.number({ error: 'blockMinutes must be a number' }).int('blockMinutes must be whole minutes').min(20, 'blockMinutes must be at least 20').max(1200, 'blockMinutes must be at most 1200');
const seatsSchema = cabinSeatsSchema
  .refine((s) => Object.keys(s).length > 0, 'seatsByCabin must name at least one cabin')
  .refine((s) => Object.values(s).every((n) => n <= 900), 'seatsByCabin: a cabin may have at most 900 seats')
  .refine((s) => Object.values(s).some((n) => n > 0), 'seatsByCabin must hold at least one seat');
const optionalText = (field: string, max: number) => z.string().trim().max(max, `${field} must be at most ${max} characters`).nullable().optional();

export const flightCreateBodySchema = z.object({
  carrierCode: carrierSchema,
  flightNumber: flightNumberSchema,
  serviceDate: dateSchema('serviceDate'),
  /** Local clock time at the departure station. */
  departureTime: clockSchema,
  blockMinutes: blockSchema,
  destination: iataAirportSchema,
  seatsByCabin: seatsSchema,
  aircraftType: optionalText('aircraftType', 8),
  gate: optionalText('gate', 8),
});
export type FlightCreateBody = z.infer<typeof flightCreateBodySchema>;

export const flightUpdateBodySchema = z
  .object({ departureTime: clockSchema, blockMinutes: blockSchema, seatsByCabin: seatsSchema, aircraftType: optionalText('aircraftType', 8), gate: optionalText('gate', 8) })
  .partial()
  .refine((v) => Object.keys(v).length > 0, 'the body must change at least one field');
export type FlightUpdateBody = z.infer<typeof flightUpdateBodySchema>;

export const flightCancelBodySchema = z.object({
  reason: z.string().trim().min(3, 'reason must say why, in at least 3 characters').max(300, 'reason must be at most 300 characters'),
});

export const adminFlightsQuerySchema = z
  .object({ from: dateSchema('from'), to: dateSchema('to') })
  .refine((q) => q.from <= q.to, { path: ['to'], message: 'to must not be before from' })
  .refine((q) => (Date.parse(q.to) - Date.parse(q.from)) / 86_400_000 <= 62, { path: ['to'], message: 'to must be at most 62 days after from' });

export const adminFlightSchema = z.object({
  id: z.number(),
  carrierCode: z.string(),
  flightNumber: z.string(),
  serviceDate: z.string(),
  origin: z.string(),
  destination: z.string(),
  /** Local wall-clock times at the station, and the instants. */
  departureTime: z.string(),
  blockMinutes: z.number(),
  scheduledDeparture: z.string(),
  scheduledArrival: z.string(),
  seatsByCabin: cabinSeatsSchema,
  aircraftType: z.string().nullable(),
  gate: z.string().nullable(),
  state: flightStateSchema,
  scheduleId: z.number().nullable(),
  bookings: z.number(),
});
export type AdminFlight = z.infer<typeof adminFlightSchema>;
export const adminFlightListSchema = z.object({ timeZone: z.string(), flights: z.array(adminFlightSchema) });

/** ISO weekdays, 1 = Monday ... 7 = Sunday. */
export const WEEKDAYS = [1, 2, 3, 4, 5, 6, 7] as const;
export const WEEKDAY_NAMES = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'] as const;
const weekdaysSchema = z
  .array(z.number().int().min(1, 'weekdays are 1 (Monday) to 7 (Sunday)').max(7, 'weekdays are 1 (Monday) to 7 (Sunday)'))
  .min(1, 'weekdays must name at least one day')
  .refine((d) => new Set(d).size === d.length, 'weekdays must not repeat a day');

/** A schedule generates at most this many days of flights at once (a season is about 26 weeks; common practice). */
export const SCHEDULE_MAX_DAYS = 190;

const scheduleFields = {
  departureTime: clockSchema,
  blockMinutes: blockSchema,
  seatsByCabin: seatsSchema,
  aircraftType: optionalText('aircraftType', 8),
  weekdays: weekdaysSchema,
  validFrom: dateSchema('validFrom'),
  validTo: dateSchema('validTo'),
};
const rangeRule = (v: { validFrom?: string; validTo?: string }) => !v.validFrom || !v.validTo || v.validFrom <= v.validTo;
const lengthRule = (v: { validFrom?: string; validTo?: string }) => !v.validFrom || !v.validTo || (Date.parse(v.validTo) - Date.parse(v.validFrom)) / 86_400_000 < SCHEDULE_MAX_DAYS;

export const scheduleCreateBodySchema = z
  .object({ carrierCode: carrierSchema, flightNumber: flightNumberSchema, destination: iataAirportSchema, ...scheduleFields })
  .refine(rangeRule, { path: ['validTo'], message: 'validTo must not be before validFrom' })
  .refine(lengthRule, { path: ['validTo'], message: `validTo must be less than ${SCHEDULE_MAX_DAYS} days after validFrom` });
export type ScheduleCreateBody = z.infer<typeof scheduleCreateBodySchema>;

export const scheduleUpdateBodySchema = z
  .object(scheduleFields)
  .partial()
  .refine((v) => Object.keys(v).length > 0, 'the body must change at least one field')
  .refine(rangeRule, { path: ['validTo'], message: 'validTo must not be before validFrom' })
  .refine(lengthRule, { path: ['validTo'], message: `validTo must be less than ${SCHEDULE_MAX_DAYS} days after validFrom` });
export type ScheduleUpdateBody = z.infer<typeof scheduleUpdateBodySchema>;

export const scheduleSchema = z.object({
  id: z.number(),
  carrierCode: z.string(),
  flightNumber: z.string(),
  origin: z.string(),
  destination: z.string(),
  departureTime: z.string(),
  blockMinutes: z.number(),
  seatsByCabin: cabinSeatsSchema,
  aircraftType: z.string().nullable(),
  weekdays: z.array(z.number()),
  validFrom: z.string(),
  validTo: z.string(),
  cancelled: z.boolean(),
  /** Flights this schedule generated that still fly (not cancelled). */
  flights: z.number(),
});
export type Schedule = z.infer<typeof scheduleSchema>;
export const scheduleListSchema = z.object({ schedules: z.array(scheduleSchema) });

/** What saving a schedule did to its dated flights. */
export const scheduleResultSchema = z.object({
  schedule: scheduleSchema,
  created: z.number(),
  updated: z.number(),
  cancelled: z.number(),
  /** Dates skipped because a flight with that number already flies that day, or has passengers and was left alone. */
  skipped: z.array(z.object({ date: z.string(), reason: z.string() })),
});
export type ScheduleResult = z.infer<typeof scheduleResultSchema>;
