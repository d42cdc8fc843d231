// The conditions under which a travel credit or a prepaid card may stand in for money. Each unmet condition is
// returned in words, so the desk can say what is missing; an empty list means the medium may be issued.
import { isMedium, type Medium } from './media';
import { REGIMES, type Regime } from './types';
import { assertOptionalBoolean } from './validation';

export interface AlternativeConditions {
  /** 'at-least': value >= the cash amount; 'greater': value > the cash amount. */
  value: 'at-least' | 'greater' | 'any';
  writtenInformation: boolean;
  noExpiry: boolean;
  ruleRef: string;
}

export const ALTERNATIVE_CONDITIONS: Readonly<Record<Regime | 'volunteer', AlternativeConditions>> = {
  // 14 CFR 250.5(c): value equal to or greater than the cash; the passenger is told the cash amount and may decline.
  'us-dot': { value: 'at-least', writtenInformation: true, noExpiry: false, ruleRef: '14 CFR 250.5(c); 250.9(c)' },
  // Art. 7(3): the signed agreement of the passenger; the text sets no value condition.
  'eu-261': { value: 'any', writtenInformation: true, noExpiry: false, ruleRef: 'Reg. (EC) 261/2004 Art. 7(3)' },
  'uk-261': { value: 'any', writtenInformation: true, noExpiry: false, ruleRef: 'Retained Reg. 261/2004 (UK) Art. 7(3)' },
  // Greater monetary value, told in writing, no expiry, confirmed in writing: s. 21 as a secondary reading of the text
  // places these four conditions (the section's own page was not at hand; the regulator's guide agrees on the substance).
  'ca-appr': { value: 'greater', writtenInformation: true, noExpiry: true, ruleRef: 'SOR/2019-150 s. 21' },
  // Common practice, no outside source: a volunteer's credit is worth at least the cash they were offered.
  volunteer: { value: 'at-least', writtenInformation: true, noExpiry: false, ruleRef: 'Volunteer: benefits agreed with the carrier' },
};

export const AGREEMENT_MEDIA: readonly Medium[] = ['prepaid-card', 'travel-credit'];

export interface AlternativeCheckInput {
  regime: Regime;
  voluntary?: boolean;
  medium: Medium;
  cashAmountMinor: number;
  /** What the card or credit is worth to the passenger. */
  valueMinor: number;
  /** The passenger was shown the cash amount and the restrictions in writing. */
  toldInWriting: boolean;
  /** The passenger accepted (signature or phone), with the exact text recorded. */
  accepted: boolean;
  /** ISO date or date-time after which the credit cannot be used; null when it never expires. */
  expiresAt: string | null;
}

function assertMinor(field: string, value: unknown): asserts value is number {
  if (typeof value !== 'number' || !Number.isSafeInteger(value) || value < 0) {
    throw new RangeError(`${field}: expected whole minor units, 0 or more, got ${JSON.stringify(value)}`);
  }
}

/** What is still missing before the medium may be issued; [] when it may. Cash, cheque and transfer need nothing. */
export function missingForAlternative(input: AlternativeCheckInput): string[] {
  if (!REGIMES.includes(input.regime)) throw new RangeError(`regime: unknown regime ${JSON.stringify(input.regime)}`);
  if (!isMedium(input.medium)) throw new RangeError(`medium: unknown medium ${JSON.stringify(input.medium)}`);
  assertOptionalBoolean('voluntary', input.voluntary);
  assertMinor('cashAmountMinor', input.cashAmountMinor);
  assertMinor('valueMinor', input.valueMinor);
  if (!AGREEMENT_MEDIA.includes(input.medium)) return [];
  const rule = ALTERNATIVE_CONDITIONS[input.voluntary ? 'volunteer' : input.regime];
  const missing: string[] = [];
  if (rule.value === 'at-least' && input.valueMinor < input.cashAmountMinor) missing.push(`its value must be at least the cash amount (${rule.ruleRef})`);
  if (rule.value === 'greater' && input.valueMinor <= input.cashAmountMinor) missing.push(`its value must be greater than the cash amount (${rule.ruleRef})`);
  if (rule.writtenInformation && !input.toldInWriting) missing.push(`the passenger must first be shown the cash amount and the conditions in writing (${rule.ruleRef})`);
  if (rule.noExpiry && input.expiresAt !== null) missing.push(`it must not expire (${rule.ruleRef})`);
  if (!input.accepted) missing.push(`the passenger's recorded agreement (${rule.ruleRef})`);
  return missing;
}
