// What a solicited volunteer must be told at the moment of the offer: whether they risk being denied boarding
// involuntarily, what they would then be owed under the station's rules, the cash alternative, and a voucher's
// restrictions. The texts paraphrase the rules; the applicable regulation decides.
import type { RegimeCode } from '@shared/schemas/common';
import type { VolunteerPolicy } from '@shared/schemas/volunteers';

const INVOLUNTARY_RULE: Record<RegimeCode, string> = {
  'us-dot':
    'If you are denied boarding against your will, US rules (14 CFR 250.5) owe you 200 % of your one-way fare (at most $1,075) when your new flight is planned to arrive 1 to 2 hours late (1 to 4 hours on international trips), 400 % (at most $2,150) when later, and nothing when it arrives within 1 hour.',
  'eu-261':
    'If you are denied boarding against your will, EU Regulation 261/2004 (Art. 7) owes you EUR 250, 400 or 600 depending on the flight distance, plus meals, refreshments and hotel if needed (Art. 9), and a refund or rerouting (Art. 8).',
  'uk-261':
    'If you are denied boarding against your will, UK Regulation 261 owes you GBP 220, 350 or 520 depending on the flight distance, plus care and a refund or rerouting.',
  'ca-appr':
    'If you are denied boarding against your will, the Canadian Air Passenger Protection Regulations owe you CAD 900 when you arrive less than 6 hours late, CAD 1,800 for 6 to 9 hours, CAD 2,400 for 9 hours or more.',
};

const CASH_ALTERNATIVE: Record<RegimeCode, string> = {
  'us-dot': 'Compensation is paid in cash or an equivalent you can spend at once. A travel voucher is only instead of cash if you agree after being told the cash amount; you may refuse it.',
  'eu-261': 'Compensation is paid in cash, by bank transfer or cheque; a travel voucher only with your signed agreement.',
  'uk-261': 'Compensation is paid in cash, by bank transfer or cheque; a travel voucher only with your signed agreement.',
  'ca-appr': 'Compensation is paid in money; another form only if it is worth more and you accept it in writing.',
};

export function volunteerDisclosure(regime: RegimeCode, policy: VolunteerPolicy, pOversale: number) {
  return {
    // Tell people plainly when the odds say someone may be bumped: a conservative threshold of our own.
    mayBeDeniedInvoluntarily: pOversale >= 0.01,
    involuntaryRule: INVOLUNTARY_RULE[regime],
    cashAlternative: CASH_ALTERNATIVE[regime],
    voucherRestrictions: policy.voucherRestrictions,
    ifTheOfferRises: policy.raisePolicy === 'lift-to-new-offer'
      ? 'If the gate raises the offer after you have accepted, you get the higher amount too.'
      : 'If the gate raises the offer after you have accepted, you keep the amount you agreed.',
  };
}
