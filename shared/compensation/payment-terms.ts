// How and by when a denied passenger is paid: the media each rule allows (lawful default first), which of them need
// the passenger's agreement, and the payment deadline. The rows paraphrase the rules; the regulation decides.
import type { Medium } from './media';
import { REGIMES, type Regime } from './types';
import { assertOptionalBoolean, parseIsoDateTime } from './validation';

export interface PaymentTermsInput {
  regime: Regime;
  /** The moment of the denial, ISO 8601 with its offset (the station's offset sets "the day of the denial"). */
  deniedAt: string;
  voluntary?: boolean;
  /** When the alternate transportation departs, ISO 8601 with offset. */
  alternateDepartsAt?: string;
}

export interface PaymentTerms {
  /** Allowed, lawful default first. */
  media: Medium[];
  /** The media that may be used only with the passenger's recorded agreement. */
  needsAgreement: Medium[];
  /** ISO 8601 UTC instant, or null when the rule sets no period. */
  dueBy: string | null;
  ruleRef: string;
}

interface MediaRow {
  media: Medium[];
  needsAgreement: Medium[];
  ruleRef: string;
  /** Where the row comes from, for the people who maintain it. */
  source: string;
}

/**
 * Minutes a counter needs to prepare a cash or cheque payment. When the alternate departs sooner, 14 CFR 250.8(b)
 * applies: the payment is sent within 24 h. Common practice, no outside source.
 */
export const COUNTER_PREPARATION_MINUTES = 30;
export const US_MAILED_PAYMENT_HOURS = 24;
export const CA_PAYMENT_HOURS = 48;

const ALTERNATIVES: Medium[] = ['prepaid-card', 'travel-credit'];

export const PAYMENT_MEDIA_RULES: Readonly<Record<Regime | 'us-dot-mailed' | 'volunteer', MediaRow>> = {
  'us-dot': {
    media: ['cash', 'cheque', 'prepaid-card', 'travel-credit'],
    needsAgreement: ALTERNATIVES,
    ruleRef: '14 CFR 250.8(a); 250.5(c)',
    source: '14 CFR 250.8(a): cash or an immediately negotiable check, on the day and at the place of the denial; 250.5(c): free or reduced-rate transportation only if worth at least the cash amount and the passenger, told the cash amount, may decline it. A prepaid card is not in 250.8\'s list: offered only as an agreed alternative, our reading.',
  },
  'us-dot-mailed': {
    media: ['cheque', 'bank-transfer', 'prepaid-card', 'travel-credit'],
    needsAgreement: ALTERNATIVES,
    ruleRef: '14 CFR 250.8(b); 250.5(c)',
    source: '14 CFR 250.8(b): when the alternate departs before payment can be prepared, tender by mail or other means within 24 hours after the denial. A prepaid card as "other means" only with the passenger\'s agreement: our reading.',
  },
  'eu-261': {
    media: ['cash', 'bank-transfer', 'cheque', 'prepaid-card', 'travel-credit'],
    needsAgreement: ALTERNATIVES,
    ruleRef: 'Reg. (EC) 261/2004 Art. 7(3); Art. 4(3)',
    source: 'Art. 7(3): cash, electronic bank transfer, bank orders or bank cheques or, with the signed agreement of the passenger, travel vouchers and/or other services. Art. 4(3): compensate immediately (no period in hours). A prepaid card is not in the list: treated as "other services".',
  },
  'uk-261': {
    media: ['cash', 'bank-transfer', 'cheque', 'prepaid-card', 'travel-credit'],
    needsAgreement: ALTERNATIVES,
    ruleRef: 'Retained Reg. 261/2004 (UK) Art. 7(3); Art. 4(3)',
    source: 'Same text as the EU Art. 7(3) and 4(3) in the retained regulation (from memory; check legislation.gov.uk).',
  },
  'ca-appr': {
    media: ['cash', 'bank-transfer', 'cheque', 'prepaid-card', 'travel-credit'],
    needsAgreement: ALTERNATIVES,
    ruleRef: 'SOR/2019-150 s. 20',
    source: 'Money when the passenger is informed of the denial or no later than 48 h after it, adjusted if the arrival is later (regulator\'s guide and secondary sources; subsection numbers not verified). Another form only if of greater value, told in writing, no expiry, confirmed in writing (s. 21, secondary reading).',
  },
  volunteer: {
    // The volunteer accepted the round's offer, paid by prepaid card, in writing: that acceptance is their agreement
    // to the card. A travel credit instead is a new agreement. Common practice, no outside source.
    media: ['prepaid-card', 'cash', 'cheque', 'bank-transfer', 'travel-credit'],
    needsAgreement: ['travel-credit'],
    ruleRef: 'Volunteer: benefits agreed with the carrier',
    // Common practice, no outside source: the rules leave a volunteer's benefits to the agreement, so no deadline.
    source: 'Volunteers agree their own benefits (14 CFR 250.2b; Reg. 261/2004 Art. 4(1); SOR/2019-150).',
  },
};

/** The last millisecond of the calendar day of `iso`, in the offset written in `iso`, as a UTC instant. */
function endOfWrittenDay(iso: string): string {
  const offset = /(Z|[+-]\d{2}:\d{2})$/.exec(iso)![1];
  return new Date(Date.parse(`${iso.slice(0, 10)}T23:59:59.999${offset}`)).toISOString();
}

export function paymentTerms(input: PaymentTermsInput): PaymentTerms {
  if (typeof input !== 'object' || input === null) throw new RangeError('input: expected an object');
  if (!REGIMES.includes(input.regime)) {
    throw new RangeError(`regime: unknown regime ${JSON.stringify(input.regime)}; expected one of ${REGIMES.join(', ')}`);
  }
  const deniedMs = parseIsoDateTime('deniedAt', input.deniedAt);
  assertOptionalBoolean('voluntary', input.voluntary);
  const departsMs = input.alternateDepartsAt === undefined ? undefined : parseIsoDateTime('alternateDepartsAt', input.alternateDepartsAt);
  if (departsMs !== undefined && departsMs < deniedMs) {
    throw new RangeError('alternateDepartsAt: the alternate cannot depart before the denial');
  }
  const copy = (row: MediaRow, dueBy: string | null): PaymentTerms => ({ media: [...row.media], needsAgreement: [...row.needsAgreement], dueBy, ruleRef: row.ruleRef });

  if (input.voluntary === true) return copy(PAYMENT_MEDIA_RULES.volunteer, null);
  switch (input.regime) {
    case 'us-dot': {
      const tooSoon = departsMs !== undefined && departsMs - deniedMs < COUNTER_PREPARATION_MINUTES * 60_000;
      if (tooSoon) return copy(PAYMENT_MEDIA_RULES['us-dot-mailed'], new Date(deniedMs + US_MAILED_PAYMENT_HOURS * 3_600_000).toISOString());
      // On the day of the denial, and before the passenger leaves on the alternate.
      const endOfDay = endOfWrittenDay(input.deniedAt);
      const dueBy = departsMs !== undefined && departsMs < Date.parse(endOfDay) ? new Date(departsMs).toISOString() : endOfDay;
      return copy(PAYMENT_MEDIA_RULES['us-dot'], dueBy);
    }
    case 'eu-261':
    case 'uk-261':
      return copy(PAYMENT_MEDIA_RULES[input.regime], null);
    case 'ca-appr':
      return copy(PAYMENT_MEDIA_RULES['ca-appr'], new Date(deniedMs + CA_PAYMENT_HOURS * 3_600_000).toISOString());
  }
}
