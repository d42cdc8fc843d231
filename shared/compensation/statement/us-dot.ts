// The written statement of 14 CFR 250.9 in Bumpboard's own words, with the carrier's priorities inserted.
import { US_DBC_CAPS } from '../us-dot-rules';
import {
  alternateSection,
  cautionSection,
  compensationNotes,
  enforcementSection,
  money,
  prioritiesSection,
  subjectLine,
  yourCaseSection,
} from './common';
import type { StatementInput, WrittenStatement } from './types';

export function usDotStatement(input: StatementInput): WrittenStatement {
  const caps = US_DBC_CAPS.find((row) => row.effectiveFrom === input.compensation.rulesInForce.effectiveFrom) ?? US_DBC_CAPS[US_DBC_CAPS.length - 1];
  const cap200 = money(input, caps.domestic200CapMinor);
  const cap400 = money(input, caps.domestic400CapMinor);
  const cash = money(input, input.compensation.amountMinor);
  if (input.voucherOffer && input.voucherOffer.currency === 'USD' && input.voucherOffer.valueMinor < input.compensation.amountMinor) {
    throw new RangeError(`voucherOffer.valueMinor: a voucher must be worth at least the cash compensation of ${cash} (14 CFR 250.5(c))`);
  }
  if (input.voucherOffer && input.voucherOffer.currency !== 'USD') {
    throw new RangeError('voucherOffer.currency: expected USD for us-dot');
  }

  const sections = [
    {
      heading: 'Compensation for denied boarding',
      body: `${input.carrierName} could not give you the seat you reserved on this flight because it was oversold. When you are denied boarding against your will you are, in most cases, entitled to compensation in money. This notice explains the carrier's obligations and your rights.`,
    },
    yourCaseSection(input),
    prioritiesSection(input, 'Volunteers and boarding priorities'),
    {
      heading: 'Exceptions: when no compensation is due',
      body: [
        'No compensation is due (14 CFR 250.6) when:',
        "- you did not meet the carrier's requirements for ticketing, reconfirmation, check-in or acceptability for travel;",
        '- a smaller aircraft had to be substituted for operational or safety reasons, or, on an aircraft of 60 seats or fewer, weight or balance limits required it;',
        '- you are offered a seat in another section of the aircraft at no extra charge (a refund of the difference is due if that section costs less);',
        '- the alternate transportation arranged for you is planned to arrive not later than 1 hour after your original flight.',
      ].join('\n'),
    },
    {
      heading: 'Amount of compensation',
      body: [
        'Flights within the United States, judged on the planned arrival of your alternate transportation at your first stopover or, if none, your destination:',
        '- planned arrival not later than 1 hour after your original flight: no compensation;',
        `- more than 1 hour but less than 2 hours later: 200% of your one-way fare, at most ${cap200};`,
        `- 2 hours or more later, or no alternate offered: 400% of your one-way fare, at most ${cap400}.`,
        'Flights from the United States to another country: the same, with 4 hours in place of 2 hours.',
        'The fare is the one-way fare to your destination or first stopover, including mandatory taxes and fees. For a ticket issued without a fare, the lowest cash fare in the same class on this flight is used.',
        `Your compensation: ${cash}.`,
        ...compensationNotes(input),
      ].join('\n'),
    },
    alternateSection(input),
    {
      heading: 'Method of payment',
      body: [
        `The carrier pays in cash or by cheque, on the day and at the place of the denial; if your alternate flight leaves before payment can be made, it is sent within 24 hours (14 CFR 250.8). It may offer free or reduced-fare travel instead only if the offer is worth at least the cash amount, you are told the cash amount of ${cash}, and you may refuse the offer and take the money.`,
        input.voucherOffer
          ? `Offer made to you: a travel voucher worth ${money(input, input.voucherOffer.valueMinor)}${input.voucherOffer.restrictions ? ` (conditions: ${input.voucherOffer.restrictions})` : ''}. You may refuse it and receive ${cash}.`
          : 'No voucher has been offered in place of money.',
      ].join('\n'),
    },
    {
      heading: 'Your options',
      body: [
        'Accepting the compensation may settle any claim you have against the carrier for being denied boarding.',
        'You may decline it and seek more from the carrier, or pursue your claim in court or by other lawful means.',
      ].join('\n'),
    },
  ];
  if (input.enforcementBody) {
    sections.push(enforcementSection('Questions and complaints', input.enforcementBody, 'You may also contact:'));
  }
  sections.push(cautionSection());
  return { subject: subjectLine(input), sections };
}
