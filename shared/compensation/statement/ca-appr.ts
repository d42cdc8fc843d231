// Written information for denied boarding under Canada's Air Passenger Protection Regulations (SOR/2019-150):
// the reason, compensation and its payment, alternate travel or refund, standards of treatment and recourse.
import { APPR_DENIED_BOARDING_AMOUNTS, APPR_PAYMENT_HOURS } from '../ca-appr';
import {
  alternateSection,
  choiceAndCareSections,
  closingSections,
  enforcementSection,
  money,
  prioritiesSection,
  subjectLine,
  translatorFor,
  yourCaseSection,
} from './common';
import type { EnforcementBody, StatementInput, StatementSection, WrittenStatement } from './types';

/** Canada's regulator for air passenger complaints (from memory; override with enforcementBody). */
export const CANADA_ENFORCEMENT_BODY: EnforcementBody = {
  name: 'Canadian Transportation Agency',
  website: 'otc-cta.gc.ca',
};

const list = (lead: string, items: string[]) => [lead, ...items.map((item) => `- ${item}`)].join('\n');

export function apprStatement(input: StatementInput): WrittenStatement {
  const tr = translatorFor(input);
  const rows = APPR_DENIED_BOARDING_AMOUNTS;
  const row = rows.find((candidate) => candidate.effectiveFrom === input.compensation.rulesInForce.effectiveFrom) ?? rows[rows.length - 1];
  const amount = (minor: number) => money(tr, input, minor);
  const sections: StatementSection[] = [
    { id: 'why', heading: tr.t('statement.why.heading'), body: tr.t('statement.ca.why', { carrier: input.carrierName }) },
    yourCaseSection(tr, input),
    prioritiesSection(tr, input),
    {
      id: 'compensation',
      heading: tr.t('statement.ca.amounts.heading'),
      body: [
        list(tr.t('statement.ca.amounts.lead'), [
          tr.t('statement.ca.amounts.under6', { amount: amount(row.under6hMinor) }),
          tr.t('statement.ca.amounts.from6', { amount: amount(row.from6hUnder9hMinor) }),
          tr.t('statement.ca.amounts.over9', { amount: amount(row.atLeast9hMinor) }),
        ]),
        tr.t('statement.yours', { amount: amount(input.compensation.amountMinor) }),
      ].join('\n'),
    },
    {
      id: 'payment',
      heading: tr.t('statement.ca.payment.heading'),
      body: [tr.t('statement.ca.payment.when', { hours: APPR_PAYMENT_HOURS }), tr.t('statement.ca.payment.topUp'), tr.t('statement.ca.payment.form')].join('\n'),
    },
    {
      id: 'remedies',
      heading: tr.t('statement.ca.travel.heading'),
      body: list(tr.t('statement.ca.travel.lead'), [tr.t('statement.ca.travel.rebook'), tr.t('statement.ca.travel.refund')]),
    },
    alternateSection(tr, input),
    {
      id: 'care-due',
      heading: tr.t('statement.ca.care.heading'),
      body: list(tr.t('statement.ca.care.lead'), [tr.t('statement.ca.care.food'), tr.t('statement.ca.care.communication'), tr.t('statement.ca.care.hotel')]),
    },
    ...choiceAndCareSections(tr, input),
    enforcementSection(tr, tr.t('statement.ca.recourse.heading'), input.enforcementBody ?? CANADA_ENFORCEMENT_BODY, tr.t('statement.ca.recourse.lead')),
    ...closingSections(tr),
  ];
  return { regime: 'ca-appr', language: tr.language, subject: subjectLine(tr, input), sections };
}
