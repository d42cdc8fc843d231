// Care owed while a denied passenger waits for the alternate, as data with the source beside each row.
import type { DistanceBand } from './eu-uk-rules';

export type CareKind = 'meal' | 'refreshment' | 'hotel' | 'transport' | 'communication';
export const CARE_KINDS: readonly CareKind[] = ['meal', 'refreshment', 'hotel', 'transport', 'communication'];

/** 'regulation': the rule's text says it; 'common-practice': a threshold the text leaves open, chosen and marked so. */
export type CareBasis = 'regulation' | 'common-practice';

export interface CareRuleRow {
  kind: CareKind;
  description: string;
  source: string;
  basis: CareBasis;
}

/**
 * EU/UK Art. 9. Art. 4(3) owes it to passengers denied against their will from the first minute; Art. 9(1)(a) sets no
 * hours ("in a reasonable relation to the waiting time"). The hours below for a full meal are borrowed from the
 * delay thresholds of Art. 6(1) (2 h / 3 h / 4 h by distance band): common practice, not the text for denials.
 */
export const EU_MEAL_AFTER_MINUTES: Readonly<Record<DistanceBand, number>> = { a: 120, b: 180, c: 240 };

export function euCareRows(instrument: string): Readonly<Record<CareKind, CareRuleRow>> {
  return {
    refreshment: { kind: 'refreshment', description: 'Refreshments for the wait', source: `${instrument} Art. 9(1)(a)`, basis: 'regulation' },
    meal: { kind: 'meal', description: 'A meal, in relation to the waiting time', source: `${instrument} Art. 9(1)(a); hours from Art. 6(1) (common practice)`, basis: 'common-practice' },
    hotel: { kind: 'hotel', description: 'Hotel accommodation for the night', source: `${instrument} Art. 9(1)(b)`, basis: 'regulation' },
    transport: { kind: 'transport', description: 'Transport between the airport and the hotel, both ways', source: `${instrument} Art. 9(1)(c)`, basis: 'regulation' },
    communication: { kind: 'communication', description: 'Two telephone calls or messages (e-mail or equivalent), free of charge', source: `${instrument} Art. 9(2)`, basis: 'regulation' },
  };
}

/**
 * Canada, SOR/2019-150 s. 14 as we read it (a secondary reading agrees; the section's own page was not at hand): once
 * the passenger has waited 2 hours after the departure time on the original ticket (the desk passes that time as
 * `waitFrom`), food and drink in reasonable quantities for the length of the wait, the time of day and the place, and a means of
 * communication (s. 14(1)); for an overnight wait, hotel or comparable accommodation and transport to it and back (s. 14(2)).
 */
export const APPR_CARE_AFTER_MINUTES = 120;

export const APPR_CARE_ROWS: Readonly<Record<Exclude<CareKind, 'refreshment'>, CareRuleRow>> = {
  meal: { kind: 'meal', description: 'Food and drink in reasonable quantities for the wait, the time of day and the place', source: 'SOR/2019-150 s. 14(1)(a)', basis: 'regulation' },
  communication: { kind: 'communication', description: 'Access to a means of communication', source: 'SOR/2019-150 s. 14(1)(b)', basis: 'regulation' },
  hotel: { kind: 'hotel', description: 'Hotel or comparable accommodation for the night, free of charge', source: 'SOR/2019-150 s. 14(2)', basis: 'regulation' },
  transport: { kind: 'transport', description: 'Free transport to the accommodation and back', source: 'SOR/2019-150 s. 14(2)', basis: 'regulation' },
};

/**
 * "A stay of one or more nights" (Art. 9(1)(b)) and "overnight" (s. 14(2)) are not defined in hours. Our policy,
 * marked common practice: a night counts when the wait covers the local hours from 01:00 to 05:00 at the airport.
 */
export const NIGHT_FROM = '01:00';
export const NIGHT_UNTIL = '05:00';

/** A further meal for each six hours of wait past the first: common practice, our policy. */
export const FURTHER_MEAL_EVERY_MINUTES = 360;
