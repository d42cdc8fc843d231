// The written notice of Art. 14(2) Reg. (EC) 261/2004 (and the UK's retained version): Art. 7, 8, 9
// and the enforcement body's contact details.
import { EU_STYLE_AMOUNTS, REDUCTION_MAX_DELAY_MINUTES, type EuStyleRegime } from '../eu-uk-rules';
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

/** The UK regulator as enforcement body (from memory; override with enforcementBody). */
export const UK_ENFORCEMENT_BODY: EnforcementBody = {
  name: 'UK Civil Aviation Authority (CAA)',
  website: 'www.caa.co.uk',
};

export function euStyleStatement(regime: EuStyleRegime, input: StatementInput): WrittenStatement {
  const enforcement = input.enforcementBody ?? (regime === 'uk-261' ? UK_ENFORCEMENT_BODY : undefined);
  if (!enforcement) {
    throw new RangeError('enforcementBody: required for eu-261; Art. 14(2) needs the national enforcement body\'s contact details');
  }
  const instrument = regime === 'eu-261' ? 'Regulation (EC) No 261/2004' : 'the retained UK version of Regulation 261/2004';
  const rows = EU_STYLE_AMOUNTS[regime];
  const row = rows.find((candidate) => candidate.effectiveFrom === input.compensation.rulesInForce.effectiveFrom) ?? rows[rows.length - 1];
  const internal = regime === 'eu-261' ? 'within the EU' : 'within the UK';
  const hours = (band: 'a' | 'b' | 'c') => REDUCTION_MAX_DELAY_MINUTES[band] / 60;

  const sections = [
    {
      heading: 'Why you received this notice',
      body: `You were denied boarding against your will on a flight of ${input.carrierName}. Under ${instrument} the carrier must give you this written notice of the rules on compensation and assistance (Article 14(2)).`,
    },
    yourCaseSection(input),
    prioritiesSection(input, 'Volunteers and boarding priorities'),
    {
      heading: 'Compensation (Article 7)',
      body: [
        'Compensation depends on the great-circle distance from your departure airport to your final destination:',
        `- ${money(input, row.bandAMinor)} for flights of 1,500 km or less;`,
        `- ${money(input, row.bandBMinor)} for flights ${internal} of more than 1,500 km, and for other flights between 1,500 and 3,500 km;`,
        `- ${money(input, row.bandCMinor)} for all other flights.`,
        `If you are re-routed and arrive not more than ${hours('a')} h (up to 1,500 km), ${hours('b')} h (the middle band) or ${hours('c')} h (other flights) after the scheduled arrival of your original flight, the carrier may reduce the compensation by half.`,
        'Compensation is paid in cash, by bank transfer or by cheque; travel vouchers only if you agree in writing.',
        `Your compensation: ${money(input, input.compensation.amountMinor)}.`,
      ].join('\n'),
    },
    {
      heading: 'Reimbursement or re-routing (Article 8)',
      body: [
        'You may choose one of:',
        '- reimbursement within seven days of the cost of your ticket for the parts not flown (and for parts flown if the journey no longer serves its purpose), with a return flight to your first point of departure where relevant;',
        '- re-routing to your final destination under comparable conditions at the earliest opportunity;',
        '- re-routing at a later date of your choice, subject to seat availability.',
      ].join('\n'),
    },
    alternateSection(input),
    {
      heading: 'Care while you wait (Article 9)',
      body: [
        'Free of charge, the carrier must offer you:',
        '- meals and refreshments in reasonable relation to the waiting time;',
        '- hotel accommodation when a stay of one or more nights becomes necessary, and transport between the airport and the accommodation;',
        '- two telephone calls, or two e-mails or other messages.',
      ].join('\n'),
    },
    enforcementSection(
      'Enforcement body',
      enforcement,
      'If you believe the carrier has not applied these rules, you may complain to the carrier and to the enforcement body:',
    ),
    cautionSection(),
  ];
  return { subject: subjectLine(input), sections };
}
