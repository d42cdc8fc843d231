// Input checks shared by the regimes: each failure is a RangeError that names the field and the rule.

const ISO_DATE_PREFIX = /^(\d{4})-(\d{2})-(\d{2})(?:$|T)/;
const ISO_DATE_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(?::\d{2}(?:\.\d{1,3})?)?(?:Z|[+-]\d{2}:\d{2})$/;

/**
 * Returns the calendar date (YYYY-MM-DD) as written. A date-time keeps the date written in it,
 * because rules change on the station's calendar day, not on the UTC day.
 */
export function parseIsoDate(field: string, value: unknown): string {
  if (typeof value !== 'string') {
    throw new RangeError(`${field}: expected an ISO 8601 date (YYYY-MM-DD), got ${JSON.stringify(value)}`);
  }
  const match = ISO_DATE_PREFIX.exec(value);
  if (!match || (value.length > 10 && !ISO_DATE_TIME.test(value))) {
    throw new RangeError(`${field}: expected an ISO 8601 date (YYYY-MM-DD), got ${JSON.stringify(value)}`);
  }
  const [, year, month, day] = match;
  const probe = new Date(Date.UTC(Number(year), Number(month) - 1, Number(day)));
  if (probe.getUTCFullYear() !== Number(year) || probe.getUTCMonth() + 1 !== Number(month) || probe.getUTCDate() !== Number(day)) {
    throw new RangeError(`${field}: ${value} is not a calendar date`);
  }
  return `${year}-${month}-${day}`;
}

/** Parses an ISO 8601 date-time that carries its offset (Z or ±hh:mm); returns epoch milliseconds. */
export function parseIsoDateTime(field: string, value: unknown): number {
  if (typeof value !== 'string' || !ISO_DATE_TIME.test(value)) {
    throw new RangeError(`${field}: expected an ISO 8601 date-time with offset (e.g. 2025-03-01T07:42:00Z), got ${JSON.stringify(value)}`);
  }
  parseIsoDate(field, value);
  const epochMs = Date.parse(value);
  if (Number.isNaN(epochMs)) {
    throw new RangeError(`${field}: ${value} is not a valid date-time`);
  }
  return epochMs;
}

export function assertOptionalBoolean(field: string, value: unknown): void {
  if (value !== undefined && typeof value !== 'boolean') {
    throw new RangeError(`${field}: expected true or false, got ${JSON.stringify(value)}`);
  }
}

export function assertWholeMinutes(field: string, value: unknown): asserts value is number {
  if (typeof value !== 'number' || !Number.isSafeInteger(value) || value < 0) {
    throw new RangeError(`${field}: expected a whole number of minutes, 0 or more, got ${JSON.stringify(value)}`);
  }
}

export function assertDistanceKm(field: string, value: unknown): asserts value is number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
    throw new RangeError(`${field}: expected a distance in km, 0 or more, got ${JSON.stringify(value)}`);
  }
}

/** Picks the last row whose effectiveFrom is on or before the date: rows are sorted oldest first. */
export function rowInForce<Row extends { effectiveFrom: string }>(rows: readonly Row[], date: string, what: string): Row {
  let chosen: Row | undefined;
  for (const row of rows) {
    if (row.effectiveFrom <= date) chosen = row;
  }
  if (!chosen) {
    throw new RangeError(`deniedOn: ${date} is before the first ${what} rules in this table (${rows[0]?.effectiveFrom ?? 'none'})`);
  }
  return chosen;
}

/** "1 h 30 min" */
export function formatMinutes(minutes: number): string {
  const hours = Math.floor(minutes / 60);
  const rest = minutes % 60;
  if (hours === 0) return `${rest} min`;
  return rest === 0 ? `${hours} h` : `${hours} h ${rest} min`;
}
