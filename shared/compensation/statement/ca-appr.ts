// Written information for denied boarding under Canada's Air Passenger Protection Regulations (SOR/2019-150).
import { APPR_DENIED_BOARDING_AMOUNTS, APPR_PAYMENT_HOURS } from '../ca-appr';
import {
  alternateSection,
  cautionSection,
  enforcementSection,
  money,
  prioritiesSection,
  subjectLine,
  yourCaseSection,
} from './common';
import type { EnforcementBody, StatementInput, WrittenStatement } from './types';

/** Canada's regulator for air passenger complaints (from memory; override with enforcementBody). */
export const CANADA_ENFORCEMENT_BODY: EnforcementBody = {
  name: 'Canadian Transportation Agency',
  website: 'otc-cta.gc.ca',
};

export function apprStatement(input: StatementInput): WrittenStatement {
  const rows = APPR_DENIED_BOARDING_AMOUNTS;
  const row = rows.find((candidate) => candidate.effectiveFrom === input.compensation.rulesInForce.effectiveFrom) ?? rows[rows.length - 1];
  const sections = [
    {
      heading: 'Why you received this notice',
      body: `${input.carrierName} denied you boarding for a reason within its control. Under the Air Passenger Protection Regulations you are owed compensation, alternate travel arrangements and care while you wait.`,
    },
    yourCaseSection(input),
    prioritiesSection(input, 'Volunteers and boarding priorities'),
    {
      heading: 'Compensation amounts',
      body: [
        'Compensation depends on how late you arrive at the destination on your ticket:',
        `- less than 6 hours late: ${money(input, row.under6hMinor)};`,
        `- 6 hours or more but less than 9 hours: ${money(input, row.from6hUnder9hMinor)};`,
        `- 9 hours or more: ${money(input, row.atLeast9hMinor)}.`,
        `Your compensation: ${money(input, input.compensation.amountMinor)}.`,
      ].join('\n'),
    },
    {
      heading: 'Payment and top-up',
      body: [
        `The carrier pays when it tells you of the denial or, at the latest, within ${APPR_PAYMENT_HOURS} hours; if payment comes later, you receive written confirmation of the amount.`,
        'If you arrive later than planned and the delay falls in a higher band, the carrier tops up the difference.',
        'Compensation is paid in money unless you choose another form, which must be worth more, and you are told its value in writing.',
      ].join('\n'),
    },
    alternateSection(input),
    enforcementSection(
      'Recourse',
      input.enforcementBody ?? CANADA_ENFORCEMENT_BODY,
      'If you disagree with the carrier\'s answer to your claim, you may file a complaint with:',
    ),
    cautionSection(),
  ];
  return { subject: subjectLine(input), sections };
}
