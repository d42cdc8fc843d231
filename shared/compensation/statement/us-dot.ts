// The written statement of 14 CFR 250.9: the text the rule prescribes (in English, as prescribed), with the
// carrier's name, its boarding priorities and the caps in force inserted, followed by this passenger's own case in
// the passenger's language.
import { describeRules } from '../../denial/describe';
import { groupThousands } from '../money';
import { US_DBC_CAPS } from '../us-dot-rules';
import { alternateSection, choiceAndCareSections, closingSections, compensationNotes, enforcementSection, money, subjectLine, translatorFor, yourCaseSection } from './common';
import { prescribedSections } from './us-250-9-text';
import type { StatementInput, StatementSection, WrittenStatement } from './types';

/** "$1,075": the caps are whole dollars (§250.5(e) rounds them to $25), written as the rule writes them. */
function dollars(minor: number): string {
  if (minor % 100 !== 0) throw new RangeError(`cap: expected whole dollars, got ${minor} cents`);
  return `$${groupThousands(minor / 100)}`;
}

/** The carrier's boarding priority rules, as lines to insert where §250.9(b) leaves the space for them. */
function priorityLines(input: StatementInput): string[] {
  // The first line of describeRules restates the call for volunteers, which the prescribed text already makes.
  const [, ...rest] = describeRules(input.priorityRules);
  return rest.map((line) => (/^\d+\. /.test(line) ? `- ${line}` : line));
}

export function usDotStatement(input: StatementInput): WrittenStatement {
  const tr = translatorFor(input);
  const caps = US_DBC_CAPS.find((row) => row.effectiveFrom === input.compensation.rulesInForce.effectiveFrom) ?? US_DBC_CAPS[US_DBC_CAPS.length - 1];
  const cash = money(tr, input, input.compensation.amountMinor);
  if (input.voucherOffer && input.voucherOffer.currency === 'USD' && input.voucherOffer.valueMinor < input.compensation.amountMinor) {
    throw new RangeError(`voucherOffer.valueMinor: a voucher must be worth at least the cash compensation of ${cash} (14 CFR 250.5(c))`);
  }
  if (input.voucherOffer && input.voucherOffer.currency !== 'USD') {
    throw new RangeError('voucherOffer.currency: expected USD for us-dot');
  }
  const voucher = input.voucherOffer;
  const voucherLine = !voucher
    ? tr.t('statement.us.noVoucher')
    : voucher.restrictions
      ? tr.t('statement.us.voucherConditions', { value: money(tr, input, voucher.valueMinor), conditions: voucher.restrictions, cash })
      : tr.t('statement.us.voucher', { value: money(tr, input, voucher.valueMinor), cash });

  const sections: StatementSection[] = [
    // The rule prescribes English words; a passenger reading another language is told so first.
    ...(tr.language === 'en' ? [] : [{ id: 'about' as const, heading: tr.t('statement.us.prescribed.heading'), body: tr.t('statement.us.prescribed.body') }]),
    ...prescribedSections({ carrierName: input.carrierName, priorityLines: priorityLines(input), cap200: dollars(caps.domestic200CapMinor), cap400: dollars(caps.domestic400CapMinor) }),
    yourCaseSection(tr, input),
    {
      id: 'compensation',
      heading: tr.t('statement.us.yours.heading'),
      body: [tr.t('statement.yours', { amount: cash }), tr.t('statement.us.fare'), ...compensationNotes(tr, input), voucherLine].join('\n'),
    },
    alternateSection(tr, input),
    ...choiceAndCareSections(tr, input),
  ];
  if (input.enforcementBody) {
    sections.push(enforcementSection(tr, tr.t('statement.us.questions.heading'), input.enforcementBody, tr.t('statement.us.questions.lead')));
  }
  sections.push(...closingSections(tr));
  return { regime: 'us-dot', language: tr.language, subject: subjectLine(tr, input), sections };
}
