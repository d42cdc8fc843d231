// Wall-clock times typed at the station ("2026-12-01T21:05" in New York) to an instant, and back.

function offsetMinutes(at: Date, timeZone: string) {
  const parts = new Intl.DateTimeFormat('en-US', { timeZone, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', second: '2-digit' }).formatToParts(at);
  const get = (type: string) => Number(parts.find((p) => p.type === type)?.value);
  const asUtc = Date.UTC(get('year'), get('month') - 1, get('day'), get('hour'), get('minute'), get('second'));
  return Math.round((asUtc - at.getTime()) / 60_000);
}

/**
 * The instant (ISO, UTC) of a local date-time "YYYY-MM-DDTHH:mm" in a named zone, or null when the text is not one.
 * Two passes settle the zone's offset even on the day the clocks change.
 */
export function zonedToIso(local: string, timeZone: string): string | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/.exec(local);
  if (!m) return null;
  const wall = Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]), Number(m[4]), Number(m[5]));
  let instant = wall - offsetMinutes(new Date(wall), timeZone) * 60_000;
  instant = wall - offsetMinutes(new Date(instant), timeZone) * 60_000;
  return new Date(instant).toISOString();
}

/** The local "YYYY-MM-DDTHH:mm" of an instant in a named zone, for a datetime-local field. */
export function isoToZoned(iso: string, timeZone: string) {
  const at = new Date(iso);
  const shifted = new Date(at.getTime() + offsetMinutes(at, timeZone) * 60_000);
  return shifted.toISOString().slice(0, 16);
}
