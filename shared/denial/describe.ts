// The carrier's priority rules in plain English, for the written statement given to passengers.
import type { Regime } from '../compensation/types';
import { GROUP_WORDS, policyFor } from './priority-groups';
import { parsePriorityRules, type PriorityRule, type PriorityRuleInput } from './priority-rules.schema';

function ruleSentence(rule: PriorityRule): string {
  switch (rule.factor) {
    case 'check-in-time':
      return rule.direction === 'latest-first'
        ? 'Check-in time: passengers who checked in latest are selected first.'
        : 'Check-in time: passengers who checked in earliest are selected first.';
    case 'fare-paid':
      return rule.direction === 'lowest-first'
        ? 'Fare paid: passengers who paid the lowest fare are selected first.'
        : 'Fare paid: passengers who paid the highest fare are selected first.';
    case 'frequent-flyer-tier':
      return 'Frequent-flyer status: passengers without status are selected first, then the lowest tiers.';
    case 'seat-assigned-before-gate':
      return 'Seat assignment: passengers without a seat assigned before reaching the gate are selected first.';
    case 'party-size':
      return rule.direction === 'smallest-first'
        ? 'Party size: passengers travelling alone and small parties are selected first.'
        : 'Party size: the largest parties are selected first.';
  }
}

function groupsSentence(regime: Regime | undefined): string {
  const policy = policyFor(regime);
  if (policy.mode === 'never-selected') {
    return 'Never selected: unaccompanied minors; passengers with a disability and the companions travelling with them; families travelling with children; anyone already denied boarding on the same ticket; anyone who has boarded with an accepted boarding pass.';
  }
  const sources = [...new Set(policy.order.map((group) => policy.sources[group]))].join('; ');
  const order = policy.order.map((group, index) => `(${String.fromCharCode(97 + index)}) ${GROUP_WORDS[group]}${policy.family === 'with-child' && group === 'family' ? ' with children' : ''}`).join('; ');
  return `Priority groups, selected only after everyone else and then from the last of this order upward (${sources}): ${order}. Never selected: anyone who has boarded with an accepted boarding pass.`;
}

export function describeRules(rules: PriorityRuleInput[], regime?: Regime): string[] {
  const parsed = parsePriorityRules(rules);
  return [
    'We first ask for volunteers. Passengers are denied boarding against their will only when too few volunteer.',
    'If we must deny boarding, we choose in this order:',
    ...parsed.map((rule, index) => `${index + 1}. ${ruleSentence(rule)}`),
    'Passengers still level after every rule are taken in order of booking reference.',
    'People travelling together are kept together and ranked as one, by the values of the member who would be chosen last, unless they chose to travel separately.',
    'Only passengers who checked in by the deadline and are at the gate can be selected; a passenger who did not check in in time is a no-show.',
    groupsSentence(regime),
  ];
}
