// The show-up profile as the admin types it: every value kept as text, so a bad entry is never rewritten or lost,
// and checked with the same shared schema the server applies on save.
import { showUpProfileSchema, type ShowUpProfile } from '@shared/schemas/show-up-profile';

export interface RateRow {
  id: string;
  cabin: string;
  local: string;
  connecting: string;
}

export interface CurveRow {
  id: string;
  minutes: string;
  share: string;
}

export interface ProfileDraft {
  rates: RateRow[];
  flexibleFareFactor: string;
  checkedInShowRate: string;
  curve: CurveRow[];
  checkInCloseMinutes: string;
  minimumConnectMinutes: string;
}

/** Keyed as the server names fields in a 400 ("bookingRates.local.Y", "checkInCurve.2.1"), plus row keys of our own. */
export type DraftErrors = Record<string, string>;

export type DraftCheck = { ok: true; profile: ShowUpProfile } | { ok: false; errors: DraftErrors };

let nextId = 0;
export const rowId = () => `row-${++nextId}`;

const text = (n: number | undefined) => (n === undefined ? '' : String(n));

export function draftFromProfile(p: ShowUpProfile): ProfileDraft {
  const cabins = [...new Set([...Object.keys(p.bookingRates.local), ...Object.keys(p.bookingRates.connecting)])].sort();
  return {
    rates: cabins.map((cabin) => ({ id: rowId(), cabin, local: text(p.bookingRates.local[cabin]), connecting: text(p.bookingRates.connecting[cabin]) })),
    flexibleFareFactor: String(p.flexibleFareFactor),
    checkedInShowRate: String(p.checkedInShowRate),
    curve: p.checkInCurve.map(([m, s]) => ({ id: rowId(), minutes: String(m), share: String(s) })),
    checkInCloseMinutes: String(p.checkInCloseMinutes),
    minimumConnectMinutes: String(p.minimumConnectMinutes),
  };
}

/** "0.92", "0,92" and "92 %" all read as 0.92; anything else unreadable is null. */
export function readFraction(raw: string): number | null {
  const t = raw.trim().replace(',', '.');
  if (t === '') return null;
  const percent = t.endsWith('%');
  const n = Number(percent ? t.slice(0, -1).trim() : t);
  if (!Number.isFinite(n)) return null;
  return percent ? Math.round(n * 1e6) / 1e8 : n;
}

function readMinutes(raw: string): number | null {
  const t = raw.trim();
  return /^\d+$/.test(t) ? Number(t) : null;
}

export function checkDraft(d: ProfileDraft): DraftCheck {
  const errors: DraftErrors = {};
  const fraction = (raw: string, key: string, label: string) => {
    const n = readFraction(raw);
    if (n === null) errors[key] = `${label} must be a number`;
    return n ?? 0;
  };
  const minutes = (raw: string, key: string, label: string) => {
    const n = readMinutes(raw);
    if (n === null) errors[key] = `${label} must be a whole number of minutes`;
    return n ?? 0;
  };

  const local: Record<string, number> = {};
  const connecting: Record<string, number> = {};
  const seen = new Set<string>();
  d.rates.forEach((r, i) => {
    const cabin = r.cabin.trim().toUpperCase();
    if (!/^[A-Z]$/.test(cabin)) errors[`rates.${i}.cabin`] = 'cabin must be one letter';
    else if (seen.has(cabin)) errors[`rates.${i}.cabin`] = `cabin ${cabin} is listed twice`;
    seen.add(cabin);
    local[cabin] = fraction(r.local, `bookingRates.local.${cabin}`, 'bookingRates.local');
    connecting[cabin] = fraction(r.connecting, `bookingRates.connecting.${cabin}`, 'bookingRates.connecting');
  });
  if (d.rates.length === 0) errors.bookingRates = 'bookingRates needs at least one cabin';

  const candidate = {
    bookingRates: { local, connecting },
    flexibleFareFactor: fraction(d.flexibleFareFactor, 'flexibleFareFactor', 'flexibleFareFactor'),
    checkedInShowRate: fraction(d.checkedInShowRate, 'checkedInShowRate', 'checkedInShowRate'),
    checkInCurve: d.curve.map((c, i) => [minutes(c.minutes, `checkInCurve.${i}.0`, 'minutes before departure'), fraction(c.share, `checkInCurve.${i}.1`, 'checkInCurve share')]),
    checkInCloseMinutes: minutes(d.checkInCloseMinutes, 'checkInCloseMinutes', 'checkInCloseMinutes'),
    minimumConnectMinutes: minutes(d.minimumConnectMinutes, 'minimumConnectMinutes', 'minimumConnectMinutes'),
  };
  const parsed = showUpProfileSchema.safeParse(candidate);
  if (parsed.success && Object.keys(errors).length === 0) return { ok: true, profile: parsed.data };
  // An unreadable point stands in as 0, which would also break the curve's order: say only what is wrong with it.
  const unreadablePoint = Object.keys(errors).some((k) => k.startsWith('checkInCurve.'));
  for (const issue of parsed.success ? [] : parsed.error.issues) {
    const key = issue.path.length ? issue.path.join('.') : 'form';
    if (key === 'checkInCurve' && unreadablePoint) continue;
    errors[key] ??= issue.message;
  }
  return { ok: false, errors };
}

/** The curve's points that read as numbers, most minutes first, for the preview chart. */
export function curvePoints(d: ProfileDraft): { minutes: number; share: number }[] {
  return d.curve
    .map((c) => ({ minutes: readMinutes(c.minutes), share: readFraction(c.share) }))
    .filter((p): p is { minutes: number; share: number } => p.minutes !== null && p.share !== null)
    .sort((a, b) => b.minutes - a.minutes);
}
