// One place for wall-clock times and zones, on the Temporal polyfill: a time a person types belongs to the airport
// where it happens, and is read in that airport's IANA zone, never in the browser's or the server's.
import { Temporal } from '@js-temporal/polyfill';

const LOCAL_DATE_TIME = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/;

/** True for a zone name the runtime's time-zone database knows (America/New_York, Europe/Rome, UTC). */
export function isTimeZone(timeZone: unknown): timeZone is string {
  if (typeof timeZone !== 'string' || timeZone === '') return false;
  try {
    Temporal.Now.instant().toZonedDateTimeISO(timeZone);
    return true;
  } catch {
    return false;
  }
}

export function assertTimeZone(field: string, timeZone: unknown): asserts timeZone is string {
  if (!isTimeZone(timeZone)) {
    throw new RangeError(`${field}: expected an IANA time zone such as America/New_York, got ${JSON.stringify(timeZone)}`);
  }
}

function instantOf(field: string, at: Date | string): Temporal.Instant {
  try {
    return typeof at === 'string' ? Temporal.Instant.from(at) : Temporal.Instant.fromEpochMilliseconds(at.getTime());
  } catch {
    throw new RangeError(`${field}: expected an ISO 8601 date-time with an offset (2026-12-01T21:05:00Z), got ${JSON.stringify(at instanceof Date ? 'Invalid Date' : at)}`);
  }
}

/**
 * The instant (ISO 8601, UTC, milliseconds) of a wall-clock time "YYYY-MM-DDTHH:mm" typed for an airport in `timeZone`.
 * A time that the clocks skip (the spring change) does not exist there and is refused; a time the clocks pass twice
 * (the autumn change) is read as the first of the two, as a timetable printed before the change would mean it.
 */
export function localToInstant(field: string, local: string, timeZone: string): string {
  assertTimeZone(`${field} time zone`, timeZone);
  const m = LOCAL_DATE_TIME.exec(typeof local === 'string' ? local.trim() : '');
  if (!m) throw new RangeError(`${field}: expected a local date and time YYYY-MM-DDTHH:mm, got ${JSON.stringify(local)}`);
  let plain: Temporal.PlainDateTime;
  try {
    plain = Temporal.PlainDateTime.from({ year: +m[1], month: +m[2], day: +m[3], hour: +m[4], minute: +m[5] }, { overflow: 'reject' });
  } catch {
    throw new RangeError(`${field}: ${local} is not a calendar date and time`);
  }
  const earlier = plain.toZonedDateTime(timeZone, { disambiguation: 'earlier' });
  const later = plain.toZonedDateTime(timeZone, { disambiguation: 'later' });
  // In a gap the two readings land on different wall-clock times from the one typed.
  if (earlier.toPlainDateTime().toString() !== plain.toString() && later.toPlainDateTime().toString() !== plain.toString()) {
    throw new RangeError(`${field}: ${local} does not exist in ${timeZone} (the clocks skip it that day)`);
  }
  return earlier.toInstant().toString({ smallestUnit: 'millisecond' });
}

/** The wall-clock "YYYY-MM-DDTHH:mm" of an instant in a zone, for a date-time field. */
export function instantToLocal(at: Date | string, timeZone: string): string {
  assertTimeZone('timeZone', timeZone);
  return instantOf('at', at).toZonedDateTimeISO(timeZone).toPlainDateTime().toString({ smallestUnit: 'minute' });
}

/** The calendar date (YYYY-MM-DD) at an instant in a zone: a flight's service date is local to its origin. */
export function localDate(at: Date | string | number, timeZone: string): string {
  assertTimeZone('timeZone', timeZone);
  const instant = typeof at === 'number' ? Temporal.Instant.fromEpochMilliseconds(at) : instantOf('at', at);
  return instant.toZonedDateTimeISO(timeZone).toPlainDate().toString();
}

/** The UTC offset of a zone at an instant, "+01:00" or "-05:00". */
export function offsetAt(at: Date | string, timeZone: string): string {
  assertTimeZone('timeZone', timeZone);
  return instantOf('at', at).toZonedDateTimeISO(timeZone).offset;
}

/** Whole minutes from one instant to another (negative when `to` is earlier). */
export function minutesBetween(from: Date | string, to: Date | string): number {
  const ms = instantOf('to', to).epochMilliseconds - instantOf('from', from).epochMilliseconds;
  return Math.round(ms / 60_000);
}
