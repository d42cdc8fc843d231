// Passengers accommodated in another cabin than the one booked: recorded at the desk with the fare difference.
import { z } from 'zod';

export const CABIN_CODES = ['F', 'J', 'W', 'Y'] as const;
export const CABIN_LABELS: Record<(typeof CABIN_CODES)[number], string> = { F: 'First', J: 'Business', W: 'Premium economy', Y: 'Economy' };
/** Higher is the better cabin. */
export const CABIN_RANK: Record<(typeof CABIN_CODES)[number], number> = { F: 4, J: 3, W: 2, Y: 1 };

const cabin = (field: string) => z.enum(CABIN_CODES, { error: `${field} must be one of ${CABIN_CODES.join(', ')}` });

export const recordCabinChangeBodySchema = z.object({
    passengerId: z.number({ error: 'passengerId must be a number' }).int('passengerId must be a whole number').positive('passengerId must be positive'),
    flownCabin: cabin('flownCabin'),
    /** The difference between the fares of the two cabins for the same journey, in minor units. */
    fareDifferenceMinor: z
      .number({ error: 'fareDifferenceMinor must be a number of minor units' })
      .int('fareDifferenceMinor must be a whole number of minor units')
      .nonnegative('fareDifferenceMinor must not be negative: give the difference between the two fares'),
  reason: z.string({ error: 'reason is required' }).trim().min(3, 'reason must say why, in at least 3 characters').max(200, 'reason must be at most 200 characters'),
});
export type RecordCabinChangeBody = z.infer<typeof recordCabinChangeBodySchema>;

export const cabinChangeViewSchema = z.object({
  id: z.number(),
  flightId: z.number(),
  passengerId: z.number(),
  passengerName: z.string(),
  bookedCabin: z.string(),
  flownCabin: z.string(),
  direction: z.enum(['upgrade', 'downgrade']),
  fareDifferenceMinor: z.number(),
  currency: z.string(),
  owedMinor: z.number(),
  owedRule: z.string(),
  reason: z.string(),
  createdAt: z.string(),
});
export type CabinChangeView = z.infer<typeof cabinChangeViewSchema>;

export const cabinChangesResponseSchema = z.object({ cabinChanges: z.array(cabinChangeViewSchema) });
export const cabinChangeResponseSchema = z.object({ cabinChange: cabinChangeViewSchema });
