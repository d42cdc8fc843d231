// Which check-in segment a booking belongs to at a moment before departure, read only from what is known then.
// Training and the live forecast use these same functions, so a rate is always applied to the segment it was learned on.

/** The moments at which a booking's check-in state is read, in minutes before departure: T−24 h, T−3 h, T−1 h. */
export const CHECK_IN_WINDOWS = [
  { horizon: 'T-24h', minutes: 1440 },
  { horizon: 'T-3h', minutes: 180 },
  { horizon: 'T-1h', minutes: 60 },
] as const;

/**
 * 'booked': before T−24 h, nothing about check-in is known yet (state 'any'); a window's name: the state read at that
 * moment; 'closed': check-in has closed, so the state is the final one (checked in at all, or never).
 */
export const HORIZONS = ['booked', 'T-24h', 'T-3h', 'T-1h', 'closed'] as const;
export type Horizon = (typeof HORIZONS)[number];
export const CHECK_IN_STATES = ['any', 'checked-in', 'not-checked-in'] as const;
export type CheckInState = (typeof CHECK_IN_STATES)[number];

export interface CheckInSegment {
  horizon: Horizon;
  state: CheckInState;
}

/** Every horizon with the states it has: what a booking is counted under in training, once per horizon. */
export const HORIZON_STATES: ReadonlyArray<CheckInSegment> = [
  { horizon: 'booked', state: 'any' },
  ...(['T-24h', 'T-3h', 'T-1h', 'closed'] as const).flatMap((horizon) => (['checked-in', 'not-checked-in'] as const).map((state) => ({ horizon, state }))),
];

const MINUTE = 60_000;

/**
 * A closed flight's booking under each horizon, from when it checked in (null: never). Every booking is counted once
 * per horizon, so the rates of one horizon are learned apart from the others'.
 */
export function trainingSegments(checkedInAt: Date | null, departure: Date): CheckInSegment[] {
  const by = (minutes: number) => checkedInAt !== null && checkedInAt.getTime() <= departure.getTime() - minutes * MINUTE;
  return [
    { horizon: 'booked', state: 'any' },
    ...CHECK_IN_WINDOWS.map((w) => ({ horizon: w.horizon, state: by(w.minutes) ? 'checked-in' as const : 'not-checked-in' as const })),
    { horizon: 'closed', state: checkedInAt !== null ? 'checked-in' : 'not-checked-in' },
  ];
}

/**
 * The segment a passenger belongs to now, `minutesBefore` departure. The horizon is the latest window already
 * reached ('closed' once check-in has closed, 'booked' before T−24 h):
 *  - not checked in now: not checked in at that horizon ('any' before T−24 h);
 *  - checked in by the horizon's moment: checked in at that horizon;
 *  - checked in since (or before T−24 h): checked in at the next window not yet reached, which they are sure to be
 *    in, else 'closed'. Their state at the horizon itself (not checked in) would ignore the check-in seen since.
 */
export function liveSegment(minutesBefore: number, checkInCloseMinutes: number, checkedInAt: Date | null, departure: Date): CheckInSegment {
  const reached = CHECK_IN_WINDOWS.filter((w) => w.minutes >= minutesBefore);
  const latest = reached[reached.length - 1];
  const closed = minutesBefore <= checkInCloseMinutes;
  if (checkedInAt === null) {
    if (closed) return { horizon: 'closed', state: 'not-checked-in' };
    return latest ? { horizon: latest.horizon, state: 'not-checked-in' } : { horizon: 'booked', state: 'any' };
  }
  if (latest && checkedInAt.getTime() <= departure.getTime() - latest.minutes * MINUTE) return { horizon: latest.horizon, state: 'checked-in' };
  const next = CHECK_IN_WINDOWS.find((w) => w.minutes < minutesBefore);
  return next ? { horizon: next.horizon, state: 'checked-in' } : { horizon: 'closed', state: 'checked-in' };
}

/** Key of a segment rate in a profile: horizon/state/connection/fare group/channel. */
export const segmentRateKey = (s: CheckInSegment, connection: string, fareGroup: string, channel: string) =>
  `${s.horizon}/${s.state}/${connection}/${fareGroup}/${channel}`;
