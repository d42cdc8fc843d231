// writtenStatement: the notice a passenger denied boarding receives, per regime.
import { apprStatement } from './ca-appr';
import { checkStatementInput } from './common';
import { euStyleStatement } from './eu-uk';
import type { StatementInput, WrittenStatement } from './types';
import { usDotStatement } from './us-dot';

export function writtenStatement(input: StatementInput): WrittenStatement {
  checkStatementInput(input);
  switch (input.regime) {
    case 'us-dot':
      return usDotStatement(input);
    case 'eu-261':
    case 'uk-261':
      return euStyleStatement(input.regime, input);
    case 'ca-appr':
      return apprStatement(input);
  }
}

export { statementHtml, statementText, escapeHtml } from './render';
export { CAUTION_HEADING, CAUTION_TEXT } from './common';
export { UK_ENFORCEMENT_BODY } from './eu-uk';
export { CANADA_ENFORCEMENT_BODY } from './ca-appr';
export type * from './types';
