// writtenStatement: the notice a passenger denied boarding receives, per regime, in the passenger's language.
import { apprStatement } from './ca-appr';
import { checkStatementInput } from './common';
import { assertStatementComplete } from './complete';
import { euStyleStatement } from './eu-uk';
import type { StatementInput, WrittenStatement } from './types';
import { usDotStatement } from './us-dot';

function build(input: StatementInput): WrittenStatement {
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

/** Checks the input's fields, builds the statement, and checks it carries every section its rule requires. */
export function writtenStatement(input: StatementInput): WrittenStatement {
  checkStatementInput(input);
  const statement = build(input);
  assertStatementComplete(statement, input);
  return statement;
}

export { statementHtml, statementText, escapeHtml, accessibleStatementPage } from './render';
export { CAUTION_HEADING, CAUTION_TEXT } from './common';
export { REQUIRED_SECTIONS, assertStatementComplete } from './complete';
export { UK_ENFORCEMENT_BODY } from './eu-uk';
export { CANADA_ENFORCEMENT_BODY } from './ca-appr';
export type * from './types';
