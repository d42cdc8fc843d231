export { rankDenialCandidates } from './rank';
export { describeRules } from './describe';
export { CHILD_SSR, DISABILITY_SSR, UNACCOMPANIED_MINOR_SSR } from './protections';
export { GROUP_POLICY, GROUP_WORDS, policyFor, type GroupPolicy, type PriorityGroup } from './priority-groups';
export {
  parsePriorityRules,
  priorityRuleSchema,
  priorityRulesSchema,
  type PriorityFactor,
  type PriorityRule,
  type PriorityRuleInput,
} from './priority-rules.schema';
export type {
  DenialContext,
  DenialPassenger,
  DenialRanking,
  ExcludedPassenger,
  ProtectionCode,
  RankedCandidate,
} from './types';
