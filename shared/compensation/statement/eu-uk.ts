// The written notice of Art. 14(2) Reg. (EC) 261/2004 (and the UK's retained version): Art. 7, 8, 9
// and the enforcement body's contact details, in the passenger's language.
import { EU_STYLE_AMOUNTS, REDUCTION_MAX_DELAY_MINUTES, type EuStyleRegime } from '../eu-uk-rules';
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

/** The UK regulator as enforcement body (from memory; override with enforcementBody). */
export const UK_ENFORCEMENT_BODY: EnforcementBody = {
  name: 'UK Civil Aviation Authority (CAA)',
  website: 'www.caa.co.uk',
};

const list = (lead: string, items: string[]) => [lead, ...items.map((item) => `- ${item}`)].join('\n');

export function euStyleStatement(regime: EuStyleRegime, input: StatementInput): WrittenStatement {
  const enforcement = input.enforcementBody ?? (regime === 'uk-261' ? UK_ENFORCEMENT_BODY : undefined);
  if (!enforcement) {
    throw new RangeError('enforcementBody: required for eu-261; Art. 14(2) needs the national enforcement body\'s contact details');
  }
  const tr = translatorFor(input);
  const which = regime === 'eu-261' ? 'eu' : 'uk';
  const rows = EU_STYLE_AMOUNTS[regime];
  const row = rows.find((candidate) => candidate.effectiveFrom === input.compensation.rulesInForce.effectiveFrom) ?? rows[rows.length - 1];
  const hours = (band: 'a' | 'b' | 'c') => REDUCTION_MAX_DELAY_MINUTES[band] / 60;
  const amount = (minor: number) => money(tr, input, minor);

  const sections: StatementSection[] = [
    { id: 'why', heading: tr.t('statement.why.heading'), body: tr.t('statement.eu.why', { carrier: input.carrierName, regime: which }) },
    yourCaseSection(tr, input),
    prioritiesSection(tr, input),
    {
      id: 'compensation',
      heading: tr.t('statement.eu.art7.heading'),
      body: [
        list(tr.t('statement.eu.art7.lead'), [
          tr.t('statement.eu.art7.bandA', { amount: amount(row.bandAMinor), km: 1500 }),
          tr.t('statement.eu.art7.bandB', { amount: amount(row.bandBMinor), regime: which, km: 1500, km2: 3500 }),
          tr.t('statement.eu.art7.bandC', { amount: amount(row.bandCMinor) }),
        ]),
        tr.t('statement.eu.art7.reduction', { a: hours('a'), b: hours('b'), c: hours('c'), km: 1500 }),
        tr.t('statement.eu.art7.method'),
        tr.t('statement.yours', { amount: amount(input.compensation.amountMinor) }),
      ].join('\n'),
    },
    {
      id: 'remedies',
      heading: tr.t('statement.eu.art8.heading'),
      body: list(tr.t('statement.eu.art8.lead'), [tr.t('statement.eu.art8.refund'), tr.t('statement.eu.art8.earliest'), tr.t('statement.eu.art8.later')]),
    },
    alternateSection(tr, input),
    {
      id: 'care-due',
      heading: tr.t('statement.eu.art9.heading'),
      body: list(tr.t('statement.eu.art9.lead'), [tr.t('statement.eu.art9.meals'), tr.t('statement.eu.art9.hotel'), tr.t('statement.eu.art9.calls')]),
    },
    ...choiceAndCareSections(tr, input),
    enforcementSection(tr, tr.t('statement.eu.enforcement.heading'), enforcement, tr.t('statement.eu.enforcement.lead')),
    ...closingSections(tr),
  ];
  return { regime, language: tr.language, subject: subjectLine(tr, input), sections };
}
