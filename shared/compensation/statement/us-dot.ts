// The written statement of 14 CFR 250.9: the text the rule prescribes, with the carrier's name, its boarding
// priorities and the caps in force inserted, followed by this passenger's own case.
import { describeRules } from '../../denial/describe';
import { groupThousands } from '../money';
import { US_DBC_CAPS } from '../us-dot-rules';
import { alternateSection, cautionSection, compensationNotes, enforcementSection, money, subjectLine, yourCaseSection } from './common';
import { prescribedSections } from './us-250-9-text';
import type { StatementInput, WrittenStatement } from './types';

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
  const caps = US_DBC_CAPS.find((row) => row.effectiveFrom === input.compensation.rulesInForce.effectiveFrom) ?? US_DBC_CAPS[US_DBC_CAPS.length - 1];
  const cash = money(input, input.compensation.amountMinor);
  if (input.voucherOffer && input.voucherOffer.currency === 'USD' && input.voucherOffer.valueMinor < input.compensation.amountMinor) {
    throw new RangeError(`voucherOffer.valueMinor: a voucher must be worth at least the cash compensation of ${cash} (14 CFR 250.5(c))`);
  }
  if (input.voucherOffer && input.voucherOffer.currency !== 'USD') {
    throw new RangeError('voucherOffer.currency: expected USD for us-dot');
  }

  const sections = [
    ...prescribedSections({ carrierName: input.carrierName, priorityLines: priorityLines(input), cap200: dollars(caps.domestic200CapMinor), cap400: dollars(caps.domestic400CapMinor) }),
    yourCaseSection(input),
    {
      heading: 'Your compensation',
      body: [
        `Your compensation: ${cash}.`,
        'The fare is the one-way fare to your destination or first stopover, including mandatory taxes and fees. For a ticket issued without a fare, the lowest cash fare in the same class on this flight is used.',
        ...compensationNotes(input),
        input.voucherOffer
          ? `Offer made to you: a travel voucher worth ${money(input, input.voucherOffer.valueMinor)}${input.voucherOffer.restrictions ? ` (conditions: ${input.voucherOffer.restrictions})` : ''}. You may refuse it and receive ${cash}.`
          : 'No voucher has been offered in place of money.',
      ].join('\n'),
    },
    alternateSection(input),
  ];
  if (input.enforcementBody) {
    sections.push(enforcementSection('Questions and complaints', input.enforcementBody, 'You may also contact:'));
  }
  sections.push(cautionSection());
  return { subject: subjectLine(input), sections };
}
