// The sections each rule's statement must carry, checked on the finished statement before anything is sent, so a
// statement missing one is refused with the section named rather than handed to a passenger.
import type { Regime } from '../types';
import type { SectionId, StatementInput, WrittenStatement } from './types';

/**
 * Reg. 261/2004 Art. 14(2): the rules for compensation and assistance (Art. 7, 8, 9) and the enforcement body's
 * contact; Art. 14(3) an alternative for blind and partially sighted passengers. SOR/2019-150 (from memory):
 * compensation and its payment, alternate travel or refund, standards of treatment, recourse. 14 CFR 250.9(b):
 * the prescribed text.
 */
export const REQUIRED_SECTIONS: Readonly<Record<Regime, readonly SectionId[]>> = {
  'eu-261': ['why', 'case', 'priorities', 'compensation', 'remedies', 'alternate', 'care-due', 'enforcement', 'accessible', 'caution'],
  'uk-261': ['why', 'case', 'priorities', 'compensation', 'remedies', 'alternate', 'care-due', 'enforcement', 'accessible', 'caution'],
  'ca-appr': ['why', 'case', 'priorities', 'compensation', 'payment', 'remedies', 'alternate', 'care-due', 'enforcement', 'accessible', 'caution'],
  'us-dot': ['us-250-9', 'case', 'compensation', 'alternate', 'caution'],
};

/** The six paragraphs §250.9(b) prescribes. */
const US_PRESCRIBED_PARAGRAPHS = 6;

export function assertStatementComplete(statement: WrittenStatement, input: StatementInput): void {
  const required: SectionId[] = [...REQUIRED_SECTIONS[statement.regime]];
  if (input.choice) required.push('choice');
  if (input.care && input.care.length > 0) required.push('care-given');
  for (const id of required) {
    const section = statement.sections.find((s) => s.id === id);
    if (!section || section.heading.trim() === '' || section.body.trim() === '') {
      throw new RangeError(`statement.sections.${id}: the ${statement.regime} statement must include this section`);
    }
  }
  if (statement.regime === 'us-dot' && statement.sections.filter((s) => s.id === 'us-250-9').length !== US_PRESCRIBED_PARAGRAPHS) {
    throw new RangeError('statement.sections.us-250-9: the statement must carry every paragraph 14 CFR 250.9(b) prescribes');
  }
  if (statement.subject.trim() === '') throw new RangeError('statement.subject: must not be blank');
}
