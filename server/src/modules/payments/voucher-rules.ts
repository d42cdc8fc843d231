// When a travel voucher may stand in for money. The texts paraphrase the rules; the regulation decides.
import type { RegimeCode } from '@shared/schemas/common';

export interface VoucherRule {
  allowed: boolean;
  rule: string;
}

const INVOLUNTARY: Record<RegimeCode, VoucherRule> = {
  'us-dot': {
    allowed: true,
    rule: 'A voucher only if it is worth at least the cash amount, the passenger was told that amount and that they may refuse the voucher and take the money instead (14 CFR 250.5(c)).',
  },
  'eu-261': { allowed: true, rule: 'Travel vouchers only with the signed agreement of the passenger (Reg. (EC) 261/2004 Art. 7(3)).' },
  'uk-261': { allowed: true, rule: 'Travel vouchers only with the signed agreement of the passenger (retained Reg. 261/2004 (UK) Art. 7(3)).' },
  // APPR allows another form only when it is worth more than the money owed; Bumpboard's vouchers carry exactly
  // the cash amount, so they can never qualify.
  'ca-appr': {
    allowed: false,
    rule: 'Compensation in another form than money only if it is worth more than the money owed and the passenger confirms in writing (SOR/2019-150); Bumpboard vouchers equal the cash amount, so money is paid.',
  },
};

/** Volunteers agree their own benefits, so a voucher is theirs to choose anywhere (common practice). */
const VOLUNTEER: VoucherRule = { allowed: true, rule: 'A volunteer may take a travel voucher instead of money if they agree to it after being told the cash amount.' }; // common practice, no outside source

export function voucherRuleFor(regime: string, voluntary: boolean): VoucherRule {
  if (voluntary) return VOLUNTEER;
  return INVOLUNTARY[regime as RegimeCode] ?? { allowed: false, rule: `No voucher rule is known for regime ${regime}; money is paid.` };
}

/** The card a voucher becomes is limited to the carrier's own kind of merchant (Stripe Issuing spending category). */
export const VOUCHER_CATEGORIES = ['airlines_air_carriers'];
