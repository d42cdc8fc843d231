// The passenger's choice after a denial of boarding, per regime, as data with the source beside each row.
import type { Regime } from './types';

/**
 * refund: the unused ticket is refunded; refund-and-return: refunded, with a flight back to the first point of
 * departure because the journey no longer serves its purpose; reroute-earliest: carried on at the earliest
 * opportunity; reroute-later: carried on at a later date the passenger chooses.
 */
export type ChoiceKind = 'refund' | 'refund-and-return' | 'reroute-earliest' | 'reroute-later';
export const CHOICE_KINDS: readonly ChoiceKind[] = ['refund', 'refund-and-return', 'reroute-earliest', 'reroute-later'];

export interface ChoiceEffects {
  /** The compensation's band is read from the alternate's planned arrival. */
  bandFromAlternate: boolean;
  /** EU/UK Art. 7(2): the carrier may halve only for a passenger it re-routes to arrive close to schedule. */
  reductionAllowed: boolean;
  /** A refund of the ticket is owed to the passenger. */
  refundOwed: boolean;
  /** A flight back to the first point of departure is owed as well. */
  returnFlightOwed: boolean;
  /** Care while waiting goes on: a passenger who takes the refund or a later date of their own is no longer waiting. */
  careContinues: boolean;
}

export interface ChoiceOffer {
  kind: ChoiceKind;
  /** Plain words for the desk and the passenger. */
  label: string;
  /** What the rule says follows, in one line. */
  detail: string;
  effects: ChoiceEffects;
  source: string;
  /** 'regulation': the rule's own text; 'our-reading' / 'common-practice': marked so, to be checked by compliance. */
  basis: 'regulation' | 'our-reading' | 'common-practice';
}

const REROUTED: ChoiceEffects = { bandFromAlternate: true, reductionAllowed: true, refundOwed: false, returnFlightOwed: false, careContinues: true };
const REFUNDED: ChoiceEffects = { bandFromAlternate: false, reductionAllowed: false, refundOwed: true, returnFlightOwed: false, careContinues: false };

function euStyle(instrument: string): readonly ChoiceOffer[] {
  return [
    {
      kind: 'refund', label: 'Refund of the ticket',
      detail: 'Full cost of the ticket for the parts not flown, refunded within seven days in money (Art. 7(3) means).',
      effects: REFUNDED, source: `${instrument} Art. 8(1)(a)`, basis: 'regulation',
    },
    {
      kind: 'refund-and-return', label: 'Refund and a flight back to where the journey began',
      detail: 'Refund also of the parts already flown, because the journey no longer serves its purpose, and a return flight to the first point of departure at the earliest opportunity.',
      effects: { ...REFUNDED, returnFlightOwed: true }, source: `${instrument} Art. 8(1)(a)`, basis: 'regulation',
    },
    {
      kind: 'reroute-earliest', label: 'Re-routing at the earliest opportunity',
      detail: 'Carried to the final destination under comparable conditions at the earliest opportunity; the Art. 7(2) reduction may apply when the new flight arrives close to schedule.',
      effects: REROUTED, source: `${instrument} Art. 8(1)(b), Art. 7(2)`, basis: 'regulation',
    },
    {
      // Art. 7(2) speaks of a re-routing offered by the carrier; a later date chosen by the passenger is read here as
      // not such an offer, so the full amount stands (our reading, to be confirmed by compliance staff).
      kind: 'reroute-later', label: 'Re-routing at a later date of the passenger’s choosing',
      detail: 'Carried to the final destination on a later date the passenger chooses, subject to seats; no reduction of the compensation.',
      effects: { ...REROUTED, bandFromAlternate: false, reductionAllowed: false, careContinues: false }, source: `${instrument} Art. 8(1)(c)`, basis: 'regulation',
    },
  ];
}

/**
 * SOR/2019-150: a denial of boarding within the carrier's control goes through s. 12(4)(c) to the rebooking
 * obligations of s. 17(1) (s. 17(1) names "12(2)(c), (3)(c) or (4)(c)"; s. 18 is the rule outside the carrier's
 * control). s. 17(2) refunds when the rebooking does not meet the passenger's needs, and, where travel no longer serves
 * a purpose, refunds and carries back to the point of origin (placement in s. 17(2) from a secondary reading: check
 * laws-lois.justice.gc.ca).
 */
const APPR: readonly ChoiceOffer[] = [
  {
    kind: 'reroute-earliest', label: 'Rebooking on the next available flight',
    detail: 'A confirmed seat on the next available flight of this carrier or a partner; when none leaves within 9 hours of the original departure, on any carrier flying a reasonable route.',
    effects: REROUTED, source: 'SOR/2019-150 s. 12(4)(c), s. 17(1)', basis: 'our-reading',
  },
  {
    kind: 'refund', label: 'Refund: the new flight does not meet the passenger’s needs',
    detail: 'Refund of the unused part of the ticket, and of optional services paid for and not used.',
    effects: REFUNDED, source: 'SOR/2019-150 s. 17(2)', basis: 'our-reading',
  },
  {
    kind: 'refund-and-return', label: 'Refund and a flight back: travel no longer serves a purpose',
    detail: 'Refund of the ticket and a confirmed seat back to the point of origin.',
    effects: { ...REFUNDED, returnFlightOwed: true }, source: 'SOR/2019-150 s. 17(2)', basis: 'our-reading',
  },
];

/** Part 250 regulates no choice: the amount is measured from the alternate offered (§250.5), refunds follow the contract. */
const US: readonly ChoiceOffer[] = [
  {
    kind: 'reroute-earliest', label: 'Alternate transportation',
    detail: 'Carried on the alternate flight the carrier arranged; its planned arrival sets the amount.',
    effects: { ...REROUTED, reductionAllowed: false }, source: '14 CFR 250.5(a)', basis: 'regulation',
  },
  {
    // Declining the alternate does not change the amount: §250.5 measures the alternate the carrier offered.
    kind: 'refund', label: 'Refund of the unused ticket',
    detail: 'The passenger declines the alternate; the unused ticket is refunded under the contract of carriage. The amount stays measured from the alternate offered.',
    effects: { ...REFUNDED, bandFromAlternate: true }, source: 'Contract of carriage; 14 CFR 250.5(a) for the amount', basis: 'common-practice',
  },
];

export const CHOICE_OFFERS: Readonly<Record<Regime, readonly ChoiceOffer[]>> = {
  'eu-261': euStyle('Reg. (EC) 261/2004'),
  'uk-261': euStyle('Retained Reg. 261/2004 (UK)'),
  'ca-appr': APPR,
  'us-dot': US,
};

/**
 * SOR/2019-150 s. 17(1)(a)(i)-(ii), large carriers: other carriers come in when neither this carrier nor a partner has a
 * flight leaving within 9 hours of the departure on the original ticket. Small carriers (s. 17(1)(b)) have no such step;
 * every station here is run as a large carrier.
 */
export const APPR_OTHER_CARRIERS_AFTER_MINUTES = 9 * 60;
