import { z } from 'zod';

const rate = (field: string) => z.number({ error: `${field} must be a number` }).min(0, `${field} must be within [0, 1]`).max(1, `${field} must be within [0, 1]`);

/**
 * How a station turns each booking into a chance of showing up. Booking-level rates by segment, the share of eventual
 * shows already checked in by minutes before departure, and the connection model.
 */
export const showUpProfileSchema = z.object({
  bookingRates: z.object({
    local: z.record(z.string().regex(/^[A-Z]$/, 'cabin must be one capital letter'), rate('bookingRates.local')),
    connecting: z.record(z.string().regex(/^[A-Z]$/, 'cabin must be one capital letter'), rate('bookingRates.connecting')),
  }),
  /** Multiplies the booking rate for flexible fares, which no-show more (they can rebook for free). */
  flexibleFareFactor: z.number().min(0.5, 'flexibleFareFactor must be at least 0.5').max(1.2, 'flexibleFareFactor must be at most 1.2'),
  checkedInShowRate: rate('checkedInShowRate'),
  checkInCurve: z
    .array(z.tuple([z.number().int().nonnegative(), rate('checkInCurve share')]))
    .min(2, 'checkInCurve needs at least two points')
    .refine((pts) => pts.every((p, i) => i === 0 || (p[0] < pts[i - 1][0] && p[1] >= pts[i - 1][1])), 'checkInCurve must list minutes before departure from most to fewest, with shares never falling'),
  checkInCloseMinutes: z.number().int().min(0).max(240, 'checkInCloseMinutes must be at most 240'),
  minimumConnectMinutes: z.number().int().min(0).max(240, 'minimumConnectMinutes must be at most 240'),
  /**
   * True for rates learned from closed flights, where a missed connection already counts as "did not show": the
   * inbound's news then moves a connecting passenger's chance only relative to an on-time inbound. Absent (hand-set
   * profiles): the rates are of passengers who made it, and the chance of making the connection multiplies them whole.
   */
  /**
   * Learned show rates per check-in segment, keyed horizon/state/connection/fare group/channel (see `liveSegment` in
   * shared/forecast): when the passenger's key is here, it is their rate, in place of the booking rate and curve.
   */
  segmentRates: z.record(z.string().regex(/^[a-zA-Z0-9-]+(\/[a-zA-Z0-9-]+){4}$/, 'segmentRates keys must be horizon/state/connection/fare/channel'), rate('segmentRates')).optional(),
  ratesIncludeUsualConnection: z.boolean({ error: 'ratesIncludeUsualConnection must be true or false' }).optional(),
});
export type ShowUpProfile = z.infer<typeof showUpProfileSchema>;

/** A station's starting point until its own history is learned: plausible figures of our own (common practice). */
export const DEFAULT_SHOW_UP_PROFILE: ShowUpProfile = {
  bookingRates: { local: { J: 0.92, Y: 0.9 }, connecting: { J: 0.9, Y: 0.88 } },
  flexibleFareFactor: 0.93,
  checkedInShowRate: 0.995,
  checkInCurve: [[1440, 0], [720, 0.3], [240, 0.5], [120, 0.68], [60, 0.87], [45, 0.96], [30, 1]],
  checkInCloseMinutes: 30,
  minimumConnectMinutes: 45,
};
