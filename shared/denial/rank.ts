// Orders the passengers who may be denied boarding involuntarily, by the carrier's own rules.
import { parsePriorityRules, type PriorityRuleInput } from './priority-rules.schema';
import { FACTOR_LABEL, evaluatorFor, type Unit } from './factors';
import { groupProtections, unitExclusions } from './protections';
import type { DenialContext, DenialPassenger, DenialRanking, ExcludedPassenger, RankedCandidate } from './types';
import { checkContext, checkPassengers, type CheckedPassenger } from './validate';

export function rankDenialCandidates(passengers: DenialPassenger[], rules: PriorityRuleInput[], context: DenialContext): DenialRanking {
  const parsedRules = parsePriorityRules(rules);
  const checked = checkContext(context);
  const needsSeatFlag = parsedRules.some((rule) => rule.factor === 'seat-assigned-before-gate');
  const list = checkPassengers(passengers, checked, needsSeatFlag);

  const excluded: ExcludedPassenger[] = [];
  const units: Unit[] = [];
  const bookedSizeNotes = new Map<string, string>();
  for (const [partyId, members] of groupByParty(list)) {
    const bookedSize = checkPartySize(members);
    if (bookedSize > members.length) bookedSizeNotes.set(partyId, `party of ${bookedSize} booked, ${members.length} on this flight`);
    const group = groupProtections(members, checked);
    if (group) {
      for (const member of members) {
        const protection = group.get(member.id);
        if (protection) excluded.push({ passengerId: member.id, name: member.name, partyId, ...protection });
      }
      continue;
    }
    const split = members.length > 1 && members.every((member) => member.partySplitAgreed === true);
    const partyUnits = split ? members.map((member) => [member]) : [members];
    for (const unitMembers of partyUnits) {
      const unitExcluded = unitExclusions(unitMembers, checked);
      if (unitExcluded.length > 0) {
        excluded.push(...unitExcluded);
      } else {
        units.push({ unitId: split ? `${partyId}/${unitMembers[0].id}` : partyId, partyId, members: unitMembers });
      }
    }
  }

  const evaluators = parsedRules.map((rule) => evaluatorFor(rule, checked));
  const scores = new Map(units.map((unit) => [unit, evaluators.map((evaluator) => evaluator.score(unit))]));
  const scoreOf = (unit: Unit) => scores.get(unit) ?? [];
  const ordered = [...units].sort((left, right) => compareUnits(scoreOf(left), scoreOf(right)) || tieBreak(left, right));

  const candidates: RankedCandidate[] = ordered.map((unit, index) => {
    const own = scoreOf(unit);
    const reasons = [unitDescription(unit, bookedSizeNotes.get(unit.partyId))];
    evaluators.forEach((evaluator, ruleIndex) => {
      let aheadOf = 0;
      let levelWith = 0;
      for (const other of units) {
        if (other === unit) continue;
        const otherScore = scoreOf(other)[ruleIndex];
        if (otherScore < own[ruleIndex]) aheadOf += 1;
        else if (otherScore === own[ruleIndex]) levelWith += 1;
      }
      reasons.push(`rule ${ruleIndex + 1}, ${FACTOR_LABEL[parsedRules[ruleIndex].factor]}: ${evaluator.explain(unit, aheadOf, levelWith)}`);
    });
    const fullTies = units.filter((other) => other !== unit && compareUnits(scoreOf(other), own) === 0).length;
    if (fullTies > 0) reasons.push(`level with ${fullTies} other${fullTies === 1 ? '' : 's'} on every rule: order among them by booking reference (PNR)`);
    return {
      position: index + 1,
      unitId: unit.unitId,
      partyId: unit.partyId,
      pnr: [...new Set(unit.members.map((member) => member.pnr))].join(', '),
      passengerIds: unit.members.map((member) => member.id),
      names: unit.members.map((member) => member.name),
      seatsFreed: unit.members.length,
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

function checkPartySize(members: CheckedPassenger[]): number {
  const declared = members.map((member) => member.partySize).filter((size): size is number => size !== undefined);
  const bookedSize = declared.length > 0 ? Math.max(...declared) : members.length;
  if (bookedSize < members.length) {
    throw new RangeError(`passengers: party ${members[0].partyId} lists ${members.length} travellers but partySize says ${bookedSize}`);
  }
  return bookedSize;
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
    : `travelling alone (PNR ${unit.members[0].pnr})`;
}
