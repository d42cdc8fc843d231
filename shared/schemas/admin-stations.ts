// A station as an admin creates and edits it: code, name, rules regime, currency and the limits it works by. The
// time zone is never typed: it comes from the reference airport data for the code.
import { z } from 'zod';
import { currencySchema, iataAirportSchema, regimeSchema } from './common';

const nameSchema = z.string().trim().min(2, 'name must be at least 2 characters').max(120, 'name must be at most 120 characters');
/** Percent, as people type it: 5 means a 5 % chance of still being oversold after volunteers. */
const riskSchema = z.number({ error: 'riskTolerancePercent must be a number' }).min(0.1, 'riskTolerancePercent must be at least 0.1').max(50, 'riskTolerancePercent must be at most 50');
const graceSchema = z.number({ error: 'departureGraceMinutes must be a number' }).int('departureGraceMinutes must be whole minutes').min(0, 'departureGraceMinutes must be at least 0').max(180, 'departureGraceMinutes must be at most 180');
/** Percent of seats: 150 allows bookings up to 1.5 times capacity. */
const overbookingSchema = z.number({ error: 'maxOverbookingPercent must be a number' }).int('maxOverbookingPercent must be a whole number').min(100, 'maxOverbookingPercent must be at least 100').max(300, 'maxOverbookingPercent must be at most 300');

export const stationCreateBodySchema = z.object({
  iata: z.string().trim().toUpperCase().pipe(iataAirportSchema),
  name: nameSchema.optional(),
  regime: regimeSchema,
  currency: z.string().trim().toUpperCase().pipe(currencySchema),
  riskTolerancePercent: riskSchema.optional(),
  departureGraceMinutes: graceSchema.optional(),
  maxOverbookingPercent: overbookingSchema.optional(),
});
export type StationCreateBody = z.infer<typeof stationCreateBodySchema>;

export const stationUpdateBodySchema = z
  .object({ name: nameSchema, regime: regimeSchema, currency: z.string().trim().toUpperCase().pipe(currencySchema), riskTolerancePercent: riskSchema, departureGraceMinutes: graceSchema, maxOverbookingPercent: overbookingSchema })
  .partial()
  .refine((v) => Object.keys(v).length > 0, 'the body must change at least one field');
export type StationUpdateBody = z.infer<typeof stationUpdateBodySchema>;

export const stationSettingsSchema = z.object({
  id: z.number(),
  iata: z.string(),
  name: z.string(),
  timeZone: z.string(),
  regime: regimeSchema,
  currency: z.string(),
  riskTolerancePercent: z.number(),
  departureGraceMinutes: z.number(),
  maxOverbookingPercent: z.number(),
});
export type StationSettings = z.infer<typeof stationSettingsSchema>;
export const stationSettingsListSchema = z.object({ stations: z.array(stationSettingsSchema), viewer: z.object({ carrierWide: z.boolean() }) });

export const airportLookupSchema = z.object({ iata: z.string(), name: z.string(), city: z.string(), country: z.string(), timeZone: z.string().nullable() });
export type AirportLookup = z.infer<typeof airportLookupSchema>;
