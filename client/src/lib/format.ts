// Formatting happens only at the edge: money from integer minor units, times in the station's named zone.
// Money is formatted by the shared money module in the person's locale (lib/money.ts); re-exported for callers here.
export { formatMoney } from './money';

export function formatTime(iso: string, timeZone: string) {
  return new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(new Date(iso));
}

/** "21:05 EST" or "09:40 GMT+1": a time with its zone, for a time at an airport other than the station. */
export function formatTimeWithZone(iso: string, timeZone: string) {
  const zone = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' }).formatToParts(new Date(iso)).find((p) => p.type === 'timeZoneName')?.value;
  return `${formatTime(iso, timeZone)} ${zone ?? timeZone}`;
}

export function zoneLabel(timeZone: string, at = new Date()) {
  const name = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' }).formatToParts(at).find((p) => p.type === 'timeZoneName')?.value;
  return `${timeZone.replace(/_/g, ' ')}${name ? ` (${name})` : ''}`;
}

export function formatPercent(p: number) {
  if (p > 0 && p < 0.001) return '<0.1 %';
  if (p < 1 && p > 0.999) return '>99.9 %';
  return `${(p * 100).toFixed(p < 0.1 ? 1 : 0)} %`;
}
