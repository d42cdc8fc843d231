// Orders the passengers who may be denied boarding involuntarily, by the carrier's own rules.
import { parsePriorityRules, type PriorityRuleInput } from './priority-rules.schema';
import { FACTOR_LABEL, evaluatorFor, type Unit } from './factors';
import { groupTier, policyFor, type GroupPolicy } from './priority-groups';
import { absence, groupProtections, repeatDenialGroup, unitExclusions, type GroupProtection } from './protections';
import type { DenialContext, DenialPassenger, DenialRanking, ExcludedPassenger, RankedCandidate } from './types';
import { checkContext, checkPassengers, type CheckedPassenger } from './validate';

export function rankDenialCandidates(passengers: DenialPassenger[], rules: PriorityRuleInput[], context: DenialContext): DenialRanking {
  const parsedRules = parsePriorityRules(rules);
  const checked = checkContext(context);
  const policy = policyFor(context.regime);
  const needsSeatFlag = parsedRules.some((rule) => rule.factor === 'seat-assigned-before-gate');
  const list = checkPassengers(passengers, checked, needsSeatFlag);
  const excluded: ExcludedPassenger[] = [];
  const units: Unit[] = [];
  const groupOf = new Map<Unit, GroupProtection | null>();
  const bookedSizeNotes = new Map<string, string>();
  // Only people who are there can be denied boarding: the absent are set aside before parties are formed.
  const present = list.filter((passenger) => {
    const away = absence(passenger, checked);
    if (away) excluded.push({ passengerId: passenger.id, name: passenger.name, partyId: passenger.partyId, ...away });
    return away === null;
  });
  for (const [partyId, members] of groupByParty(present)) {
    const bookedSize = checkPartySize(members, list);
    if (bookedSize > members.length) bookedSizeNotes.set(partyId, `party of ${bookedSize} booked, ${members.length} present on this flight`);
    const group = groupProtections(members, checked, policy);
    if (group && policy.mode === 'never-selected') {
      for (const member of members) {
        const protection = group.get(member.id);
        if (protection) excluded.push({ passengerId: member.id, name: member.name, partyId, protection: protection.protection, reason: protection.reason });
      }
      continue;
    }
    // A protected party stays together even if it chose to split: the protection is the party's.
    const split = group === null && members.length > 1 && members.every((member) => member.partySplitAgreed === true);
    const partyUnits = split ? members.map((member) => [member]) : [members];
    for (const unitMembers of partyUnits) {
      const unitExcluded = unitExclusions(unitMembers, checked, policy);
      if (unitExcluded.length > 0) {
        excluded.push(...unitExcluded);
        continue;
      }
      const unit = { unitId: split ? `${partyId}/${unitMembers[0].id}` : partyId, partyId, members: unitMembers };
      units.push(unit);
      groupOf.set(unit, strongest(policy, [...(group?.values() ?? []), repeatDenialGroup(unitMembers, policy)]));
    }
  }
  const tierOf = (unit: Unit) => groupTier(policy, groupOf.get(unit)?.group ?? null);
  const evaluators = parsedRules.map((rule) => evaluatorFor(rule, checked));
  const scores = new Map(units.map((unit) => [unit, evaluators.map((evaluator) => evaluator.score(unit))]));
  const scoreOf = (unit: Unit) => scores.get(unit) ?? [];
  const ordered = [...units].sort((left, right) => tierOf(left) - tierOf(right) || compareUnits(scoreOf(left), scoreOf(right)) || tieBreak(left, right));

  const candidates: RankedCandidate[] = ordered.map((unit, index) => {
    const own = scoreOf(unit);
    const reasons = [unitDescription(unit, bookedSizeNotes.get(unit.partyId))];
    const group = groupOf.get(unit) ?? null;
    if (group) reasons.push(group.reason);
    evaluators.forEach((evaluator, ruleIndex) => {
      let aheadOf = 0;
      let levelWith = 0;
      for (const other of units) {
        if (other === unit || tierOf(other) !== tierOf(unit)) continue;
        const otherScore = scoreOf(other)[ruleIndex];
        if (otherScore < own[ruleIndex]) aheadOf += 1;
        else if (otherScore === own[ruleIndex]) levelWith += 1;
      }
      reasons.push(`rule ${ruleIndex + 1}, ${FACTOR_LABEL[parsedRules[ruleIndex].factor]}: ${evaluator.explain(unit, aheadOf, levelWith)}`);
    });
    const fullTies = units.filter((other) => other !== unit && tierOf(other) === tierOf(unit) && compareUnits(scoreOf(other), own) === 0).length;
    if (fullTies > 0) reasons.push(`level with ${fullTies} other${fullTies === 1 ? '' : 's'} on every rule: order among them by booking reference (PNR)`);
    return {
      position: index + 1,
      unitId: unit.unitId,
      partyId: unit.partyId,
      pnr: [...new Set(unit.members.map((member) => member.pnr))].join(', '),
      passengerIds: unit.members.map((member) => member.id),
      names: unit.members.map((member) => member.name),
      seatsFreed: unit.members.length,
      priorityGroup: group?.group ?? null,
      reasons,
    };
  });
  return { candidates, excluded };
}

function groupByParty(list: CheckedPassenger[]): Map<string, CheckedPassenger[]> {
  const parties = new Map<string, CheckedPassenger[]>();
  for (const passenger of list) {
    const members = parties.get(passenger.partyId) ?? [];
    members.push(passenger);
    parties.set(passenger.partyId, members);
  }
  return parties;
}

function checkPartySize(members: CheckedPassenger[], all: CheckedPassenger[]): number {
  const listed = all.filter((passenger) => passenger.partyId === members[0].partyId).length;
  const declared = members.map((member) => member.partySize).filter((size): size is number => size !== undefined);
  const bookedSize = declared.length > 0 ? Math.max(...declared) : listed;
  if (bookedSize < listed) {
    throw new RangeError(`passengers: party ${members[0].partyId} lists ${listed} travellers but partySize says ${bookedSize}`);
  }
  return bookedSize;
}

/** The group that keeps a unit longest decides its place. */
function strongest(policy: GroupPolicy, groups: (GroupProtection | null)[]): GroupProtection | null {
  return groups.reduce<GroupProtection | null>((best, next) => (next && groupTier(policy, next.group) > groupTier(policy, best?.group ?? null) ? next : best), null);
}

/** Higher score is selected first, rule by rule. */
function compareUnits(left: number[], right: number[]): number {
  for (let index = 0; index < left.length; index += 1) {
    if (left[index] > right[index]) return -1;
    if (left[index] < right[index]) return 1;
  }
  return 0;
}

/** Last resort so the order never depends on the input order: booking reference, then unit id. */
function tieBreak(left: Unit, right: Unit): number {
  const leftKey = `${left.members[0].pnr}\u0000${left.unitId}`;
  const rightKey = `${right.members[0].pnr}\u0000${right.unitId}`;
  return leftKey < rightKey ? -1 : leftKey > rightKey ? 1 : 0;
}

function unitDescription(unit: Unit, bookedNote: string | undefined): string {
  const note = bookedNote ? ` (${bookedNote})` : '';
  if (unit.members.length > 1) {
    return `party of ${unit.members.length} (PNR ${unit.members[0].pnr})${note}, kept together and ranked as one by its most protected member's values`;
  }
  return unit.unitId.includes('/')
    ? `party member who chose to travel separately (PNR ${unit.members[0].pnr}), ranked alone`
    : `travelling alone (PNR ${unit.members[0].pnr})${note}`;
}
