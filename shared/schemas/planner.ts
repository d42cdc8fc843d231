import { z } from 'zod';
import type { BookingLimitOptions } from '../forecast/types';
import { minorAmountSchema } from './money';

/** Largest cabin the planner accepts, and the booking search bound the forecast engine uses by default. */
export const PLANNER_MAX_CAPACITY = 1000;
export const maxBookingsLimit = (capacity: number): number => 2 * capacity + 50;

/** A number field whose messages say, in plain words, which rule failed. */
function numberField(field: string) {
  return z.number({
    error: (issue) => (issue.input === undefined ? `${field} is required` : `${field} must be a number`),
  });
}

const wholeAmountMinor = minorAmountSchema;

/** Inputs of the booking-limit planner; money in integer minor units of `currency`. */
export const plannerInputSchema = z
  .strictObject({
    capacity: numberField('capacity')
      .int({ error: 'capacity must be a whole number of seats' })
      .min(1, { error: 'capacity must be at least 1 seat' })
      .max(PLANNER_MAX_CAPACITY, { error: `capacity must be at most ${PLANNER_MAX_CAPACITY} seats` }),
    showProbability: numberField('showProbability')
      .gt(0, { error: 'showProbability must be greater than 0' })
      .max(1, { error: 'showProbability must be at most 1' }),
    revenuePerBookingMinor: wholeAmountMinor('revenuePerBookingMinor'),
    costPerDenialMinor: wholeAmountMinor('costPerDenialMinor'),
    currency: z
      .string({ error: (issue) => (issue.input === undefined ? 'currency is required' : 'currency must be text') })
      .regex(/^[A-Z]{3}$/, { error: 'currency must be a three-letter ISO 4217 code in capitals, such as EUR' }),
    maxBookings: numberField('maxBookings').int({ error: 'maxBookings must be a whole number of bookings' }).optional(),
    rho: numberField('rho')
      .gt(0, { error: 'rho (show-up correlation) must be greater than 0' })
      .lt(1, { error: 'rho (show-up correlation) must be less than 1' })
      .optional(),
  })
  .superRefine((input, ctx) => {
    // only meaningful once both numbers passed their own rules; otherwise those messages already say what is wrong
    const { capacity, maxBookings } = input;
    if (maxBookings === undefined || !Number.isInteger(capacity) || !Number.isInteger(maxBookings)) return;
    if (capacity < 1 || capacity > PLANNER_MAX_CAPACITY) return;
    if (maxBookings < capacity) {
      ctx.addIssue({ code: 'custom', path: ['maxBookings'], message: 'maxBookings must be at least the capacity' });
    } else if (maxBookings > maxBookingsLimit(capacity)) {
      ctx.addIssue({
        code: 'custom',
        path: ['maxBookings'],
        message: `maxBookings must be at most twice the capacity plus 50 (${maxBookingsLimit(capacity)})`,
      });
    }
  });

export type PlannerInput = z.infer<typeof plannerInputSchema>;

/** Parts of the full cost of one denied boarding, each in integer minor units; the planner adds them up. */
export const denialCostHelperSchema = z.strictObject({
  averageCompensationMinor: wholeAmountMinor('averageCompensationMinor'),
  rebookingCostMinor: wholeAmountMinor('rebookingCostMinor'),
  goodwillMinor: wholeAmountMinor('goodwillMinor'),
});

export type DenialCostHelper = z.infer<typeof denialCostHelperSchema>;

/** Cost of one denied boarding from its parts, for costPerDenialMinor. */
export function totalDenialCostMinor(parts: DenialCostHelper): number {
  return parts.averageCompensationMinor + parts.rebookingCostMinor + parts.goodwillMinor;
}

/** The forecast engine's options for validated planner inputs; rho becomes a beta-binomial common shock. */
export function toBookingLimitOptions(input: PlannerInput): BookingLimitOptions {
  return {
    capacity: input.capacity,
    showProbability: input.showProbability,
    revenuePerBooking: input.revenuePerBookingMinor,
    costPerDenial: input.costPerDenialMinor,
    ...(input.maxBookings === undefined ? {} : { maxBookings: input.maxBookings }),
    ...(input.rho === undefined ? {} : { shock: { kind: 'beta-binomial', rho: input.rho } }),
  };
}
