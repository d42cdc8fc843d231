// The dated days a weekly pattern stands for. Dates are calendar dates at the station (no zone arithmetic needed).
const DAY = 86_400_000;

/** ISO weekday of a calendar date: 1 = Monday ... 7 = Sunday. */
export function isoWeekday(date: string): number {
  const d = new Date(`${date}T00:00:00Z`).getUTCDay();
  return d === 0 ? 7 : d;
}

/** Every date from `from` to `to` (both included) that falls on one of the weekdays. */
export function scheduleDates(from: string, to: string, weekdays: readonly number[]): string[] {
  const out: string[] = [];
  const days = new Set(weekdays);
  for (let t = Date.parse(`${from}T00:00:00Z`), end = Date.parse(`${to}T00:00:00Z`); t <= end; t += DAY) {
    const date = new Date(t).toISOString().slice(0, 10);
    if (days.has(isoWeekday(date))) out.push(date);
  }
  return out;
}
