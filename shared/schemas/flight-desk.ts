import { z } from 'zod';
import { flightStateSchema } from './flights';

export const commonShockSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('beta-binomial'), rho: z.number().gt(0, 'rho must be above 0').lt(1, 'rho must be below 1') }),
  z.object({
    kind: z.literal('scenarios'),
    scenarios: z.array(z.object({ weight: z.number().gt(0).lte(1), probabilityFactor: z.number().gt(0).lte(2) })).min(1).max(8)
      .refine((s) => Math.abs(s.reduce((a, x) => a + x.weight, 0) - 1) < 1e-9, 'scenario weights must sum to 1'),
  }),
]);

export const setShockBodySchema = z.object({ shock: commonShockSchema.nullable(), reason: z.string().trim().min(3, 'reason must say why (at least 3 characters)').max(200) });

export const cabinCountsSchema = z.object({ cabin: z.string(), seats: z.number(), booked: z.number(), checkedIn: z.number(), boarded: z.number(), expectedShows: z.number(), pOversale: z.number() });

export const forecastSchema = z.object({
  computedAt: z.string(),
  capacity: z.number(),
  pmf: z.array(z.number()),
  pOversale: z.number(),
  pFullOrOver: z.number(),
  expectedDenied: z.number(),
  mean: z.number(),
  sd: z.number(),
  median: z.number(),
  volunteerTarget: z.number(),
  riskTolerance: z.number(),
  shock: commonShockSchema.nullable(),
});
export type Forecast = z.infer<typeof forecastSchema>;

/** The flight's forecast version the payload was built at: notices carry the next one (see shared/events). */
const versionField = z.number().int().min(0);

export const flightDeskSchema = z.object({
  version: versionField,
  flight: z.object({
    id: z.number(), carrierCode: z.string(), flightNumber: z.string(), serviceDate: z.string(), origin: z.string(), destination: z.string(),
    scheduledDeparture: z.string(), scheduledArrival: z.string(), gate: z.string().nullable(), state: flightStateSchema, aircraftType: z.string().nullable(),
    seatsByCabin: z.record(z.string(), z.number()),
    /** The zone of the destination airport: an arrival there is typed and shown on its clock. Null if unknown. */
    destinationTimeZone: z.string().nullable().optional(),
  }),
  station: z.object({ id: z.number(), iata: z.string(), name: z.string(), timeZone: z.string(), regime: z.string(), currency: z.string() }),
  cabins: z.array(cabinCountsSchema),
  totals: z.object({ seats: z.number(), booked: z.number(), checkedIn: z.number(), boarded: z.number() }),
  forecast: forecastSchema.nullable(),
});
export type FlightDesk = z.infer<typeof flightDeskSchema>;

export const deskPassengerSchema = z.object({
  id: z.number(), bookingId: z.number(), pnr: z.string(), pnrSequence: z.number(), partySize: z.number(),
  firstName: z.string(), lastName: z.string(), cabin: z.string(), fareMinor: z.number(), fareCurrency: z.string(), fareType: z.string(),
  ssrCodes: z.array(z.string()), frequentFlyerTier: z.string().nullable(), isChild: z.boolean(),
  inboundFlight: z.string().nullable(), inboundEstimatedArrival: z.string().nullable(),
  /** The booking's flights after this one, to the final destination on the ticket ("ZZ 450 BRU-HAM"). */
  onward: z.array(z.string()).optional(),
  status: z.enum(['booked', 'checked-in', 'boarded', 'offloaded', 'cancelled']), checkedInAt: z.string().nullable(), boardedAt: z.string().nullable(),
  showProbability: z.number(), why: z.string(),
  /** Assigned seat (14C), or null before the booking system or check-in gives one. */
  seat: z.string().nullable(),
});
export type DeskPassenger = z.infer<typeof deskPassengerSchema>;
export const deskPassengersSchema = z.object({ version: versionField, passengers: z.array(deskPassengerSchema) });

export const forecastPointSchema = z.object({ at: z.string(), pOversale: z.number(), expectedDenied: z.number(), checkedIn: z.number(), booked: z.number() });
export const forecastHistorySchema = z.object({ version: versionField, points: z.array(forecastPointSchema) });

export const flightEventRowSchema = z.object({ id: z.number(), eventId: z.string(), type: z.string(), occurredAt: z.string(), receivedAt: z.string(), status: z.string(), summary: z.string() });
export const flightEventTrailSchema = z.object({ version: versionField, events: z.array(flightEventRowSchema) });
