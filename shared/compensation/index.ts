// Passenger-rights compensation for denied boarding: one entry point over four regimes.
import { REGIMES, type CompensationInput, type CompensationResult, type Regime } from './types';
import { US_DBC_CAPS } from './us-dot-rules';
import { EU_STYLE_AMOUNTS } from './eu-uk-rules';
import { APPR_DENIED_BOARDING_AMOUNTS, apprCompensation } from './ca-appr';
import { euStyleCompensation } from './eu-uk';
import { usDotCompensation } from './us-dot';
import { assertOptionalBoolean, assertWholeMinutes, parseIsoDate, rowInForce } from './validation';
import { findExemption } from './exemptions';
import { assertTicketKind } from './tickets';

export type { CompensationInput, CompensationResult, Regime } from './types';
export { REGIMES } from './types';
export type { Money } from './money';
export { formatMoney } from './money';
export { greatCircleKm, bandEdgeWarning, type LatLon, type BandEdgeWarning } from './geodesic';
export { EXEMPTIONS, type ExemptionRule } from './exemptions';
export {
  journeyScope, plannedDelayAtMeasured, checkItinerary, isUsInterstate, US_INTERSTATE_COUNTRIES, US_STOPOVER_MINUTES, KEEPS_CONNECTION_MINUTES,
  type JourneyScope, type JourneySegment, type JourneyAirport, type AirportResolver,
} from './journey';
export { FARE_TYPES, FARE_TYPE_NAMES, TICKET_KINDS, ticketKindOf, lowestCashFare, isZeroFareTicket, type FareType, type TicketKind, type FareOnBoard } from './tickets';
export { MEDIA, isMedium, type Medium } from './media';
export {
  paymentTerms, PAYMENT_MEDIA_RULES, COUNTER_PREPARATION_MINUTES, US_MAILED_PAYMENT_HOURS, CA_PAYMENT_HOURS,
  type PaymentTerms, type PaymentTermsInput,
} from './payment-terms';
export { missingForAlternative, ALTERNATIVE_CONDITIONS, AGREEMENT_MEDIA, type AlternativeCheckInput, type AlternativeConditions } from './agreement-rules';
export { dueStatus, DUE_SOON_MINUTES, type DueStatus } from './due-status';
export { agreementText, type AgreementTextInput } from './agreement-text';
export { downgradeRefund, optionalFeeRefund, FEE_REFUND_RULES, type DowngradeInput, type Refund, type OptionalFee, type FeeRefund } from './refunds';
export { US_DBC_CAPS, US_DELAY_BANDS, CPI_U_AUGUST_2011, CPI_U_JULY, reviseUsCaps, type UsCapRow, type RevisedCaps } from './us-dot-rules';
export { EU_STYLE_AMOUNTS, EXACTLY_3500_KM_POLICY, REDUCTION_MAX_DELAY_MINUTES, type EuStyleAmountRow } from './eu-uk-rules';
export {
  APPR_DENIED_BOARDING_AMOUNTS,
  APPR_PAYMENT_HOURS,
  apprBandFor,
  apprPaymentDeadline,
  apprTopUp,
  type ApprBand,
  type ApprTopUp,
} from './ca-appr';

const REGIME_CURRENCY: Record<Regime, string> = { 'us-dot': 'USD', 'eu-261': 'EUR', 'uk-261': 'GBP', 'ca-appr': 'CAD' };

const VOLUNTEER_RULE: Record<Regime, string> = {
  'us-dot': '14 CFR 250.2b',
  'eu-261': 'Reg. (EC) 261/2004 Art. 4(1)',
  'uk-261': 'Retained Reg. 261/2004 (UK) Art. 4(1)',
  // The section of the volunteer provisions is not verified, so none is cited.
  'ca-appr': 'SOR/2019-150, volunteers before any denial of boarding',
};

export function compensationDue(input: CompensationInput): CompensationResult {
  if (typeof input !== 'object' || input === null) throw new RangeError('input: expected an object');
  if (!REGIMES.includes(input.regime)) {
    throw new RangeError(`regime: unknown regime ${JSON.stringify(input.regime)}; expected one of ${REGIMES.join(', ')}`);
  }
  const deniedOn = parseIsoDate('deniedOn', input.deniedOn);
  for (const flag of ['voluntary', 'international', 'intraCommunity', 'applyReroutingReduction'] as const) {
    assertOptionalBoolean(flag, input[flag]);
  }
  if (input.plannedArrivalDelayMinutes === undefined) {
    throw new RangeError('plannedArrivalDelayMinutes: required; use null when no alternate transportation was offered');
  }
  if (input.plannedArrivalDelayMinutes !== null) {
    assertWholeMinutes('plannedArrivalDelayMinutes', input.plannedArrivalDelayMinutes);
  }
  if (input.exemption !== undefined && typeof input.exemption !== 'string') {
    throw new RangeError(`exemption: expected a documented exemption code, got ${JSON.stringify(input.exemption)}`);
  }
  // Every input is checked before any rule decides scope: an unknown code is an error on any aircraft, any distance.
  if (input.exemption !== undefined) findExemption(input.regime, input.exemption);
  assertTicketKind('ticket', input.ticket);

  if (input.voluntary === true) return volunteerResult(input.regime, deniedOn, input.exemption);

  switch (input.regime) {
    case 'us-dot':
      return usDotCompensation(input, deniedOn);
    case 'eu-261':
    case 'uk-261':
      return euStyleCompensation(input.regime, input, deniedOn);
    case 'ca-appr':
      return apprCompensation(input, deniedOn);
  }
}

function volunteerResult(regime: Regime, deniedOn: string, exemption: string | undefined): CompensationResult {
  if (exemption !== undefined) {
    throw new RangeError('exemption: applies only to an involuntary denial; a volunteer agreed their own benefits');
  }
  const rows = regime === 'us-dot' ? US_DBC_CAPS : regime === 'ca-appr' ? APPR_DENIED_BOARDING_AMOUNTS : EU_STYLE_AMOUNTS[regime];
  const row = rowInForce<{ effectiveFrom: string; source: string }>(rows, deniedOn, regime);
  const notes = regime === 'eu-261' || regime === 'uk-261'
    // Art. 4(1): volunteers "shall be assisted in accordance with Article 8"; Art. 9 care is owed to those denied
    // against their will (Art. 4(3)), not to volunteers.
    ? ['Volunteers are owed the benefits they agreed and, under Art. 4(1), assistance in accordance with Art. 8: reimbursement or re-routing.']
    : [];
  return {
    amountMinor: 0,
    currency: REGIME_CURRENCY[regime],
    band: 'volunteer',
    ruleRef: VOLUNTEER_RULE[regime],
    explanation: 'Volunteer: volunteers agree their own benefits with the carrier; no regulated amount applies.',
    notes,
    reviewFlags: [],
    rulesInForce: { effectiveFrom: row.effectiveFrom, source: row.source },
  };
}
export {
  choicesFor, choiceOffer, apprRebookingCarriers, CHOICE_KINDS, CHOICE_OFFERS, APPR_OTHER_CARRIERS_AFTER_MINUTES,
  type ChoiceKind, type ChoiceOffer, type ChoiceEffects,
} from './choice';
export {
  careDue, nightsCovered, CARE_KINDS, EU_MEAL_AFTER_MINUTES, APPR_CARE_AFTER_MINUTES, NIGHT_FROM, NIGHT_UNTIL,
  type CareInput, type CareProposal, type CareDueItem, type CareKind, type CareBasis,
} from './care';
