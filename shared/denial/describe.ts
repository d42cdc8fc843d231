// The carrier's priority rules in the passenger's words (English when no language is given), for the written
// statement given to passengers and the desk's ranking explanation.
import type { Regime } from '../compensation/types';
import { translator, type Translator } from '../i18n/translate';
import type { Language } from '../i18n/languages';
import { CARRIER_RULES, policyFor, type PriorityGroup } from './priority-groups';
import { parsePriorityRules, type PriorityRule, type PriorityRuleInput } from './priority-rules.schema';

/** ICU select keys: one per factor and direction. */
function ruleKey(rule: PriorityRule): string {
  switch (rule.factor) {
    case 'check-in-time':
      return rule.direction === 'latest-first' ? 'checkInLatest' : 'checkInEarliest';
    case 'fare-paid':
      return rule.direction === 'lowest-first' ? 'fareLowest' : 'fareHighest';
    case 'frequent-flyer-tier':
      return 'tier';
    case 'seat-assigned-before-gate':
      return 'seat';
    case 'party-size':
      return rule.direction === 'smallest-first' ? 'partySmallest' : 'partyLargest';
  }
}

const GROUP_KEY: Record<PriorityGroup, string> = {
  'unaccompanied-minor': 'minor', 'disability-or-companion': 'disability', family: 'family', 'already-denied-on-ticket': 'denied',
};

function groupsSentence(tr: Translator, regime: Regime | undefined): string {
  const policy = policyFor(regime);
  if (policy.mode === 'never-selected') return tr.t('priorities.neverSelected');
  // Citations stay as written; "the carrier's own rules" is words, so it is translated.
  const sources = [...new Set(policy.order.map((group) => policy.sources[group]))].map((src) => (src === CARRIER_RULES ? tr.t('priorities.carrierRules') : src)).join('; ');
  const order = policy.order.map((group, index) => {
    const key = group === 'family' && policy.family === 'with-child' ? 'familyChildren' : GROUP_KEY[group];
    return `(${String.fromCharCode(97 + index)}) ${tr.t('priorities.group', { group: key })}`;
  }).join('; ');
  return tr.t('priorities.groups', { sources, order });
}

export function describeRules(rules: PriorityRuleInput[], regime?: Regime, language: Language = 'en'): string[] {
  const parsed = parsePriorityRules(rules);
  const tr = translator(language);
  return [
    tr.t('priorities.volunteersFirst'),
    tr.t('priorities.order'),
    ...parsed.map((rule, index) => `${index + 1}. ${tr.t('priorities.rule', { rule: ruleKey(rule) })}`),
    tr.t('priorities.tie'),
    tr.t('priorities.together'),
    tr.t('priorities.checkedIn'),
    groupsSentence(tr, regime),
  ];
}
