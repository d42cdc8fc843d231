// What care a denied passenger is due while waiting for the alternate, from the wait at the airport.
import { instantToLocal, minutesBetween } from '../time';
import {
  APPR_CARE_AFTER_MINUTES, APPR_CARE_ROWS, EU_MEAL_AFTER_MINUTES, FURTHER_MEAL_EVERY_MINUTES, NIGHT_FROM, NIGHT_UNTIL, euCareRows,
  type CareBasis, type CareKind, type CareRuleRow,
} from './care-rules';
import { CHOICE_OFFERS, type ChoiceKind } from './choice-rules';
import { distanceBand } from './eu-uk-rules';
import { REGIMES, type Regime } from './types';
import { parseIsoDateTime } from './validation';

export { CARE_KINDS, EU_MEAL_AFTER_MINUTES, APPR_CARE_AFTER_MINUTES, NIGHT_FROM, NIGHT_UNTIL, type CareKind, type CareBasis } from './care-rules';

export interface CareInput {
  regime: Regime;
  voluntary: boolean;
  /** The passenger's recorded choice; null while none is recorded. */
  choice: ChoiceKind | null;
  /** When the wait starts: the denied flight's departure (ISO with offset). */
  waitFrom: string;
  /** The alternate's departure; null when no alternate is booked yet. */
  alternateDeparture: string | null;
  /** The airport's zone: nights are counted on its clock. */
  timeZone: string;
  /** eu-261 / uk-261: the distance that sets the band, and whether both ends are inside. */
  distanceKm?: number;
  intraCommunity?: boolean;
}

export interface CareDueItem {
  kind: CareKind;
  description: string;
  /** How many: meals by the wait, nights of hotel; 1 otherwise. */
  quantity: number;
  source: string;
  basis: CareBasis;
}

export interface CareProposal {
  waitMinutes: number | null;
  nights: number;
  items: CareDueItem[];
  notes: string[];
}

const item = (row: CareRuleRow, quantity = 1): CareDueItem => ({ kind: row.kind, description: row.description, quantity, source: row.source, basis: row.basis });

/** Nights the wait covers on the airport's clock, each counted when the wait spans NIGHT_FROM to NIGHT_UNTIL. */
export function nightsCovered(from: string, until: string, timeZone: string): number {
  const start = instantToLocal(from, timeZone);
  const end = instantToLocal(until, timeZone);
  let nights = 0;
  for (let day = start.slice(0, 10); day <= end.slice(0, 10); day = nextDay(day)) {
    if (start <= `${day}T${NIGHT_FROM}` && end >= `${day}T${NIGHT_UNTIL}`) nights += 1;
  }
  return nights;
}

function nextDay(day: string): string {
  const d = new Date(`${day}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + 1);
  return d.toISOString().slice(0, 10);
}

const meals = (wait: number, after: number) => 1 + Math.floor((wait - after) / FURTHER_MEAL_EVERY_MINUTES);

function euStyleCare(regime: 'eu-261' | 'uk-261', input: CareInput, wait: number | null, nights: number): CareProposal {
  const rows = euCareRows(regime === 'eu-261' ? 'Reg. (EC) 261/2004' : 'Retained Reg. 261/2004 (UK)');
  if (input.voluntary) {
    return { waitMinutes: wait, nights, items: [], notes: ['Volunteers are owed Art. 8 (refund or re-routing) and the benefits they agreed; Art. 9 care is owed to those denied against their will (Art. 4(1), 4(3)). A carrier may still offer it.'] };
  }
  if (wait === null) {
    return { waitMinutes: null, nights: 0, items: [item(rows.refreshment), item(rows.communication)], notes: ['No alternate is booked yet: refreshments and two calls now; meals and a hotel follow from the alternate’s departure.'] };
  }
  if (typeof input.distanceKm !== 'number' || !(input.distanceKm >= 0)) throw new RangeError(`distanceKm: required for ${regime} care, got ${JSON.stringify(input.distanceKm)}`);
  const after = EU_MEAL_AFTER_MINUTES[distanceBand(input.distanceKm, input.intraCommunity === true)];
  const items: CareDueItem[] = [];
  if (wait > 0) items.push(item(rows.refreshment));
  if (wait >= after) items.push(item(rows.meal, meals(wait, after)));
  if (nights > 0) items.push(item(rows.hotel, nights), item(rows.transport));
  if (wait > 0) items.push(item(rows.communication));
  return { waitMinutes: wait, nights, items, notes: [`A full meal from ${after / 60} h of waiting (the Art. 6(1) hours for this distance band; common practice).`] };
}

function apprCare(input: CareInput, wait: number | null, nights: number): CareProposal {
  const notes = input.voluntary ? ['Volunteers agreed their benefits; the standards of treatment are proposed to them too (our reading, check with compliance).'] : [];
  if (wait === null) return { waitMinutes: null, nights: 0, items: [], notes: [...notes, 'No alternate is booked yet: food, drink and a means of communication are due once the wait reaches 2 h.'] };
  const items: CareDueItem[] = [];
  if (wait >= APPR_CARE_AFTER_MINUTES) items.push(item(APPR_CARE_ROWS.meal, meals(wait, APPR_CARE_AFTER_MINUTES)), item(APPR_CARE_ROWS.communication));
  if (nights > 0) items.push(item(APPR_CARE_ROWS.hotel, nights), item(APPR_CARE_ROWS.transport));
  return { waitMinutes: wait, nights, items, notes };
}

/** The care the configured rule owes for this wait. Bad input is a RangeError naming the field. */
export function careDue(input: CareInput): CareProposal {
  if (!REGIMES.includes(input.regime)) throw new RangeError(`regime: unknown regime ${JSON.stringify(input.regime)}`);
  const from = parseIsoDateTime('waitFrom', input.waitFrom);
  let wait: number | null = null;
  let nights = 0;
  if (input.alternateDeparture !== null) {
    const to = parseIsoDateTime('alternateDeparture', input.alternateDeparture);
    if (to < from) throw new RangeError('alternateDeparture: must not be before the start of the wait');
    wait = minutesBetween(input.waitFrom, input.alternateDeparture);
    nights = nightsCovered(input.waitFrom, input.alternateDeparture, input.timeZone);
  }
  if (input.choice !== null) {
    const offer = CHOICE_OFFERS[input.regime].find((o) => o.kind === input.choice);
    if (!offer) throw new RangeError(`choice: ${JSON.stringify(input.choice)} is not a choice under ${input.regime}`);
    // Commission interpretative guidelines 2016/C 214/04 (from memory): care stops once the passenger takes the refund
    // or a later date of their own; we read Canada's rule the same way.
    if (!offer.effects.careContinues) return { waitMinutes: wait, nights, items: [], notes: [`The passenger chose: ${offer.label.toLowerCase()}. They are no longer waiting for the carrier, so no care is due from here.`] };
  }
  switch (input.regime) {
    case 'eu-261':
    case 'uk-261':
      return euStyleCare(input.regime, input, wait, nights);
    case 'ca-appr':
      return apprCare(input, wait, nights);
    case 'us-dot':
      return { waitMinutes: wait, nights, items: [], notes: ['14 CFR Part 250 sets no care while waiting; the carrier’s contract of carriage may.'] };
  }
}
