// A seat as printed on a boarding pass: the row number and the seat letter (14C, 3A). The letter range follows the
// common single- and twin-aisle layouts (A to K, I is usually skipped but accepted); common practice, no source.
import { z } from 'zod';

export const SEAT_PATTERN = /^[1-9]\d{0,2}[A-K]$/;

/** A seat, upper-cased, or null when none is assigned yet; the message names the field. */
export const seatSchema = (field: string) =>
  z.string().trim().transform((s) => s.toUpperCase())
    .pipe(z.union([z.literal('').transform(() => null), z.string().regex(SEAT_PATTERN, `${field} must be a row number and a seat letter A-K (14C), or empty`)]));
