/** A date and time in the station's zone, as the station reads it: "1 Dec 2026, 19:05". */
export function formatStationDateTime(iso: string, timeZone: string): string {
  return new Intl.DateTimeFormat('en-GB', { timeZone, day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(new Date(iso));
}
