// What a solicited volunteer must be told at the moment of the offer: whether they risk being denied boarding
// involuntarily, what they would then be owed under the station's rules, the cash alternative, and a voucher's
// restrictions. The texts paraphrase the rules; the amounts come from the same rules tables the computation uses,
// in force on the day of the offer; the applicable regulation decides.
import { APPR_DENIED_BOARDING_AMOUNTS, EU_STYLE_AMOUNTS, US_DBC_CAPS, formatMoney } from '@shared/compensation';
import { rowInForce } from '@shared/compensation/validation';
import type { RegimeCode } from '@shared/schemas/common';
import type { VolunteerPolicy } from '@shared/schemas/volunteers';

function involuntaryRule(regime: RegimeCode, on: string): string {
  const lead = 'If you are denied boarding against your will,';
  if (regime === 'us-dot') {
    const caps = rowInForce(US_DBC_CAPS, on, regime);
    const usd = (minor: number) => formatMoney(minor, 'USD');
    return `${lead} US rules (14 CFR 250.5) owe you 200 % of your one-way fare (at most ${usd(caps.domestic200CapMinor)}) when your new flight is planned to arrive more than 1 hour but less than 2 hours late (less than 4 hours on international trips), 400 % (at most ${usd(caps.domestic400CapMinor)}) when later or when no new flight is offered, and nothing when it arrives within 1 hour.`;
  }
  if (regime === 'eu-261' || regime === 'uk-261') {
    const row = rowInForce(EU_STYLE_AMOUNTS[regime], on, regime);
    const amounts = [row.bandAMinor, row.bandBMinor, row.bandCMinor].map((m) => formatMoney(m, row.currency));
    const name = regime === 'eu-261' ? 'EU Regulation 261/2004' : 'UK Regulation 261/2004 (as retained)';
    return `${lead} ${name} (Art. 4(3) and 7) owes you ${amounts[0]}, ${amounts[1]} or ${amounts[2]} depending on the flight distance, plus meals, refreshments and a hotel if needed (Art. 9), and a refund or rerouting (Art. 8).`;
  }
  const row = rowInForce(APPR_DENIED_BOARDING_AMOUNTS, on, regime);
  const cad = (minor: number) => formatMoney(minor, row.currency);
  return `${lead} the Canadian Air Passenger Protection Regulations owe you ${cad(row.under6hMinor)} when you arrive less than 6 hours late, ${cad(row.from6hUnder9hMinor)} for 6 to 9 hours, ${cad(row.atLeast9hMinor)} for 9 hours or more.`;
}

/** What a volunteer keeps whatever they agree: Art. 4(1) of the EU and UK rules gives them Art. 8 assistance. */
const VOLUNTEER_RIGHTS: Partial<Record<RegimeCode, string>> = {
  'eu-261': 'As a volunteer you also keep the right to a refund or rerouting (EU Regulation 261/2004 Art. 4(1) and 8).',
  'uk-261': 'As a volunteer you also keep the right to a refund or rerouting (UK Regulation 261/2004 Art. 4(1) and 8).',
};

const CASH_ALTERNATIVE: Record<RegimeCode, string> = {
  'us-dot': 'Compensation is paid in cash or an equivalent you can spend at once. A travel voucher is only instead of cash if you agree after being told the cash amount; you may refuse it.',
  'eu-261': 'Compensation is paid in cash, by bank transfer or cheque; a travel voucher only with your signed agreement.',
  'uk-261': 'Compensation is paid in cash, by bank transfer or cheque; a travel voucher only with your signed agreement.',
  'ca-appr': 'Compensation is paid in money; another form only if it is worth more and you accept it in writing.',
};

export function volunteerDisclosure(regime: RegimeCode, policy: VolunteerPolicy, pOversale: number, on = new Date().toISOString().slice(0, 10)) {
  const volunteerRights = VOLUNTEER_RIGHTS[regime];
  return {
    // Tell people plainly when the odds say someone may be bumped: a conservative threshold of our own.
    mayBeDeniedInvoluntarily: pOversale >= 0.01,
    involuntaryRule: volunteerRights ? `${involuntaryRule(regime, on)} ${volunteerRights}` : involuntaryRule(regime, on),
    cashAlternative: CASH_ALTERNATIVE[regime],
    voucherRestrictions: policy.voucherRestrictions,
    ifTheOfferRises: policy.raisePolicy === 'lift-to-new-offer'
      ? 'If the gate raises the offer after you have accepted, you get the higher amount too.'
      : 'If the gate raises the offer after you have accepted, you keep the amount you agreed.',
  };
}
