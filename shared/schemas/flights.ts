import { z } from 'zod';

export const FLIGHT_STATES = ['scheduled', 'check-in-open', 'boarding', 'closed', 'departed', 'cancelled'] as const;
export const flightStateSchema = z.enum(FLIGHT_STATES);
export type FlightState = z.infer<typeof flightStateSchema>;

export const cabinSeatsSchema = z.record(z.string().regex(/^[A-Z]$/, 'cabin must be one capital letter'), z.number().int().nonnegative());

export const departuresQuerySchema = z.object({
  stationId: z.coerce.number({ error: 'stationId must be a number' }).int().positive('stationId must be positive'),
});

export const departureRowSchema = z.object({
  id: z.number(),
  carrierCode: z.string(),
  flightNumber: z.string(),
  origin: z.string(),
  destination: z.string(),
  scheduledDeparture: z.string(),
  scheduledArrival: z.string(),
  gate: z.string().nullable(),
  state: flightStateSchema,
  seats: z.number(),
  seatsByCabin: cabinSeatsSchema,
  bookings: z.number(),
  checkedIn: z.number(),
  boarded: z.number(),
  pOversale: z.number().nullable(),
  expectedDenied: z.number().nullable(),
});
export type DepartureRow = z.infer<typeof departureRowSchema>;
export const departuresResponseSchema = z.object({
  station: z.object({ id: z.number(), iata: z.string(), name: z.string(), timeZone: z.string() }),
  flights: z.array(departureRowSchema),
});
export type DeparturesResponse = z.infer<typeof departuresResponseSchema>;
