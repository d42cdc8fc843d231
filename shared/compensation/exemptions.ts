// Documented reasons that remove the entitlement, per regime. Codes are Bumpboard's own.
import type { Regime } from './types';

export interface ExemptionRule {
  code: string;
  summary: string;
  ruleRef: string;
}

const EU_STYLE = (prefix: 'eu' | 'uk', instrument: string): ExemptionRule[] => [
  {
    code: `${prefix}-reasonable-grounds`,
    summary: 'boarding refused on reasonable grounds such as health, safety or security, or inadequate travel documents (not "denied boarding" under the Regulation)',
    ruleRef: `${instrument} Art. 2(j)`,
  },
  {
    code: `${prefix}-no-checkin`,
    summary: 'did not present for check-in as stipulated and at the time indicated (or, if none, 45 minutes before the published departure)',
    ruleRef: `${instrument} Art. 3(2)(a)`,
  },
  {
    code: `${prefix}-free-or-non-public-fare`,
    summary: 'travelling free of charge or at a reduced fare not available directly or indirectly to the public',
    ruleRef: `${instrument} Art. 3(3)`,
  },
];

export const EXEMPTIONS: Readonly<Record<Regime, readonly ExemptionRule[]>> = {
  'us-dot': [
    {
      code: 'us-ticketing-checkin-acceptability',
      summary: "did not comply with the carrier's ticketing, reconfirmation, check-in or acceptability requirements",
      ruleRef: '14 CFR 250.6(a)',
    },
    {
      code: 'us-smaller-aircraft',
      summary: 'an aircraft of lesser capacity was substituted for operational or safety reasons',
      ruleRef: '14 CFR 250.6(b)',
    },
    {
      code: 'us-weight-balance',
      summary: 'weight/balance restrictions for operational or safety reasons on an aircraft of 60 seats or fewer',
      ruleRef: '14 CFR 250.6(b)',
    },
    {
      code: 'us-other-section',
      summary: 'seated in another section of the aircraft at no extra charge (a refund is due if that section is sold at a lower fare)',
      ruleRef: '14 CFR 250.6(c)',
    },
    {
      code: 'us-alternate-within-1h',
      summary: 'comparable alternate transportation planned to arrive not later than 1 hour after the original flight',
      ruleRef: '14 CFR 250.6(d)',
    },
  ],
  'eu-261': EU_STYLE('eu', 'Reg. (EC) 261/2004'),
  'uk-261': EU_STYLE('uk', 'Retained Reg. 261/2004 (UK)'),
  'ca-appr': [
    {
      code: 'ca-outside-carrier-control',
      summary: "denial of boarding due to a situation outside the carrier's control",
      ruleRef: 'SOR/2019-150 s. 10', // section number from memory
    },
    {
      code: 'ca-required-for-safety',
      summary: "within the carrier's control but required for safety purposes",
      ruleRef: 'SOR/2019-150 s. 11', // section number from memory
    },
  ],
};

export function findExemption(regime: Regime, code: string): ExemptionRule {
  const rule = EXEMPTIONS[regime].find((candidate) => candidate.code === code);
  if (!rule) {
    const known = EXEMPTIONS[regime].map((candidate) => candidate.code).join(', ');
    throw new RangeError(`exemption: unknown code ${JSON.stringify(code)} for ${regime}; documented codes: ${known}`);
  }
  return rule;
}
