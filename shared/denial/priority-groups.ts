// Which passengers the rule in force protects, and how: never selected, or selected only after everyone else in a
// fixed order. A table per regime so the ranking, the written statement and the screens read one source.
import type { Regime } from '../compensation/types';

export type PriorityGroup = 'unaccompanied-minor' | 'disability-or-companion' | 'family' | 'already-denied-on-ticket';

export interface GroupPolicy {
  /** never-selected: the group is outside the ranking; selected-last: ranked after everyone outside the groups. */
  mode: 'never-selected' | 'selected-last';
  /** Highest priority (kept on board longest) first. */
  order: PriorityGroup[];
  /** with-child: a party with a child; any-member: a party of relatives, children or not. */
  family: 'with-child' | 'any-member';
  /** Where each group's place comes from, in the words a passenger can check. */
  sources: Record<PriorityGroup, string>;
}

const ORDER: PriorityGroup[] = ['unaccompanied-minor', 'disability-or-companion', 'family', 'already-denied-on-ticket'];
/** The source named when a group's place is the carrier's own choice, not a regulation's. */
export const CARRIER_RULES = 'the carrier\'s own priority rules';
const CARRIER = CARRIER_RULES;

export const GROUP_POLICY: Record<Regime | 'default', GroupPolicy> = {
  // 14 CFR 250.3 leaves the boarding priorities to the carrier's written rules; this carrier never selects these groups.
  'us-dot': { mode: 'never-selected', order: ORDER, family: 'with-child', sources: { 'unaccompanied-minor': CARRIER, 'disability-or-companion': CARRIER, family: CARRIER, 'already-denied-on-ticket': CARRIER } },
  // Art. 11(1): priority for persons with reduced mobility, their companions and unaccompanied children. A priority,
  // not an exemption: they are the last to be selected. Families and repeat denials follow the carrier's rules.
  'eu-261': {
    mode: 'selected-last', order: ORDER, family: 'with-child',
    sources: { 'unaccompanied-minor': 'Regulation (EC) 261/2004 Art. 11(1)', 'disability-or-companion': 'Regulation (EC) 261/2004 Art. 11(1)', family: CARRIER, 'already-denied-on-ticket': CARRIER },
  },
  'uk-261': {
    mode: 'selected-last', order: ORDER, family: 'with-child',
    sources: { 'unaccompanied-minor': 'retained Regulation 261 Art. 11(1)', 'disability-or-companion': 'retained Regulation 261 Art. 11(1)', family: CARRIER, 'already-denied-on-ticket': CARRIER },
  },
  // SOR/2019-150 s.15: an order of priority (unaccompanied minor; person with a disability and their support person;
  // passenger travelling with family members; passenger already denied on the same ticket), not an exclusion.
  'ca-appr': {
    mode: 'selected-last', order: ORDER, family: 'any-member',
    sources: { 'unaccompanied-minor': 'SOR/2019-150 s.15', 'disability-or-companion': 'SOR/2019-150 s.15', family: 'SOR/2019-150 s.15', 'already-denied-on-ticket': 'SOR/2019-150 s.15' },
  },
  default: { mode: 'never-selected', order: ORDER, family: 'with-child', sources: { 'unaccompanied-minor': CARRIER, 'disability-or-companion': CARRIER, family: CARRIER, 'already-denied-on-ticket': CARRIER } },
};

export const policyFor = (regime: Regime | undefined): GroupPolicy => GROUP_POLICY[regime ?? 'default'];

/** 0 for a passenger outside every group; otherwise higher is kept longer (selected later). */
export function groupTier(policy: GroupPolicy, group: PriorityGroup | null): number {
  if (group === null) return 0;
  return policy.order.length - policy.order.indexOf(group);
}

export const GROUP_WORDS: Record<PriorityGroup, string> = {
  'unaccompanied-minor': 'unaccompanied minors',
  'disability-or-companion': 'passengers with a disability and their support person or companion',
  family: 'passengers travelling with family members',
  'already-denied-on-ticket': 'passengers already denied boarding on the same ticket',
};
