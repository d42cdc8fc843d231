// Each priority factor as a score (higher is selected earlier) plus the plain words that explain it.
import { formatMoney } from '../compensation/money';
import type { PriorityRule } from './priority-rules.schema';
import { formatClock, type CheckedContext, type CheckedPassenger } from './validate';

export interface Unit {
  unitId: string;
  partyId: string;
  members: CheckedPassenger[];
}

export interface FactorEvaluator {
  /** A party counts with its most protected member, so the unit score is the lowest member score. */
  score(unit: Unit): number;
  /** Plain words for the unit's value and how many other candidates it is ahead of. */
  explain(unit: Unit, aheadOf: number, levelWith: number): string;
}

const others = (count: number) => `${count} other${count === 1 ? '' : 's'}`;
const level = (count: number) => (count > 0 ? `; level with ${others(count)}` : '');

function decisiveMember(unit: Unit, memberScore: (member: CheckedPassenger) => number): CheckedPassenger {
  return unit.members.reduce((best, member) => (memberScore(member) < memberScore(best) ? member : best));
}

function memberBased(
  memberScore: (member: CheckedPassenger) => number,
  describe: (member: CheckedPassenger, unit: Unit) => string,
  comparative: string,
): FactorEvaluator {
  return {
    score: (unit) => Math.min(...unit.members.map(memberScore)),
    explain: (unit, aheadOf, levelWith) => `${describe(decisiveMember(unit, memberScore), unit)}, ${comparative} ${others(aheadOf)}${level(levelWith)}`,
  };
}

export function evaluatorFor(rule: PriorityRule, checked: CheckedContext): FactorEvaluator {
  switch (rule.factor) {
    case 'check-in-time': {
      // Not checked in counts as the latest possible check-in.
      const time = (member: CheckedPassenger) => member.checkedInMs ?? Number.POSITIVE_INFINITY;
      const describe = (member: CheckedPassenger, unit: Unit) => member.checkedInMs === null
        ? 'not checked in'
        : `${unit.members.length > 1 ? (rule.direction === 'latest-first' ? 'earliest check-in in the party' : 'latest check-in in the party') : 'checked in'} ${formatClock(member.checkedInMs, checked.timeZone)}`;
      return rule.direction === 'latest-first'
        ? memberBased(time, describe, 'later than')
        : memberBased((member) => -time(member), describe, 'earlier than');
    }
    case 'fare-paid': {
      const describe = (member: CheckedPassenger, unit: Unit) => {
        const money = formatMoney(member.fareMinor, checked.currency);
        if (unit.members.length === 1) return `fare paid ${money}`;
        return `${rule.direction === 'lowest-first' ? 'highest' : 'lowest'} fare in the party: ${money}`;
      };
      return rule.direction === 'lowest-first'
        ? memberBased((member) => -member.fareMinor, describe, 'lower than')
        : memberBased((member) => member.fareMinor, describe, 'higher than');
    }
    case 'frequent-flyer-tier': {
      const rank = (member: CheckedPassenger) => (member.frequentFlyerTier === null ? 0 : checked.tierRank.get(member.frequentFlyerTier) ?? 0);
      const describe = (member: CheckedPassenger, unit: Unit) => {
        const party = unit.members.length > 1;
        if (member.frequentFlyerTier === null) return party ? 'no frequent-flyer tier in the party' : 'no frequent-flyer tier';
        return party ? `highest frequent-flyer tier in the party: ${member.frequentFlyerTier}` : `frequent-flyer tier ${member.frequentFlyerTier}`;
      };
      return memberBased((member) => -rank(member), describe, 'lower status than');
    }
    case 'seat-assigned-before-gate': {
      const unassigned = (member: CheckedPassenger) => (member.seatAssignedBeforeGate === true ? 0 : 1);
      const describe = (member: CheckedPassenger) => (member.seatAssignedBeforeGate === true ? 'seat assigned before the gate' : 'no seat assigned before the gate');
      return memberBased(unassigned, describe, 'ahead of');
    }
    case 'party-size': {
      const sign = rule.direction === 'smallest-first' ? -1 : 1;
      return {
        score: (unit) => sign * unit.members.length,
        explain: (unit, aheadOf, levelWith) =>
          `${unit.members.length === 1 ? 'travelling alone' : `party of ${unit.members.length}`}, ${rule.direction === 'smallest-first' ? 'smaller than' : 'larger than'} ${others(aheadOf)}${level(levelWith)}`,
      };
    }
  }
}

export const FACTOR_LABEL: Record<PriorityRule['factor'], string> = {
  'check-in-time': 'check-in time',
  'fare-paid': 'fare paid',
  'frequent-flyer-tier': 'frequent-flyer tier',
  'seat-assigned-before-gate': 'seat assigned before the gate',
  'party-size': 'party size',
};
