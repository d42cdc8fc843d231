// Clock and countdown words, always in the station's zone: the gate works on the station's clock.

export function formatClock(at: string | number, timeZone: string) {
  return new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit', second: '2-digit', hourCycle: 'h23' }).format(new Date(at));
}

/** "in 1 h 40 min", "in 5 min", "now", "12 min ago": whole minutes, rounded towards the departure. */
export function describeCountdown(departureIso: string, now: number) {
  const minutes = (new Date(departureIso).getTime() - now) / 60_000;
  if (minutes >= 1) return `in ${spell(Math.floor(minutes))}`;
  if (minutes > -1) return 'now';
  return `${spell(Math.floor(-minutes))} ago`;
}

function spell(totalMinutes: number) {
  const h = Math.floor(totalMinutes / 60);
  const m = totalMinutes % 60;
  if (h === 0) return `${m} min`;
  return m === 0 ? `${h} h` : `${h} h ${m} min`;
}

/** Minutes from an inbound connection's arrival to our departure; negative when it lands after we leave. */
export function connectionMinutes(inboundArrivalIso: string, departureIso: string) {
  return Math.round((new Date(departureIso).getTime() - new Date(inboundArrivalIso).getTime()) / 60_000);
}
