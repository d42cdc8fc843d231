import { bookingLimitCurve, optimalBookingLimit, type BookingLimitOptimum, type BookingLimitPoint } from '@shared/forecast';
import { toBookingLimitOptions, type PlannerInput } from '@shared/schemas/planner';

export interface PlannerResult {
  best: BookingLimitOptimum;
  /** The point at the optimum, for its oversale risk and expected denials. */
  bestPoint: BookingLimitPoint;
  /** Selling exactly the seats: the baseline the optimum is compared with. */
  atCapacity: BookingLimitPoint;
  /** What the chart draws: from the seat count to a little past the optimum, where the net has clearly turned. */
  chart: BookingLimitPoint[];
  /** What the table lists: the chart's points, or the capacity row and the stretch around the optimum when long. */
  table: BookingLimitPoint[];
}

/** Rows either side of the optimum in a long table: enough to see the net rise, peak and fall. */
const TABLE_HALF_WIDTH = 20;

/** Runs the shared engine in the browser; the server runs the same on save, so both agree on the optimum. */
export function computePlan(input: PlannerInput): PlannerResult {
  const options = toBookingLimitOptions(input);
  const best = optimalBookingLimit(options);
  const curve = bookingLimitCurve(options);
  const overbooked = best.bookings - input.capacity;
  const last = Math.min(curve[curve.length - 1].bookings, best.bookings + Math.max(10, Math.ceil(overbooked / 2)));
  const chart = curve.filter((p) => p.bookings <= last);
  const near = chart.filter((p) => Math.abs(p.bookings - best.bookings) <= TABLE_HALF_WIDTH);
  const table = chart.length <= 2 * TABLE_HALF_WIDTH + 1 || near[0].bookings === input.capacity ? chart : [chart[0], ...near];
  const bestPoint = curve.find((p) => p.bookings === best.bookings) ?? curve[0];
  return { best, bestPoint, atCapacity: curve[0], chart, table };
}
