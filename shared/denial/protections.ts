// Who is protected, and why. A protected member protects the unit they travel in. Whether a protection keeps a
// passenger out of the ranking or only puts them last is the regime's policy (priority-groups.ts).
import { GROUP_WORDS, type GroupPolicy, type PriorityGroup } from './priority-groups';
import type { DenialContext, ExcludedPassenger, ProtectionCode } from './types';
import { formatClock, type CheckedContext, type CheckedPassenger } from './validate';

export const UNACCOMPANIED_MINOR_SSR = ['UMNR'] as const;

/** IATA SSR codes for wheelchairs, sight, hearing, intellectual or developmental disability, animals, medical needs (common practice). */
export const DISABILITY_SSR = [
  'WCHR', 'WCHS', 'WCHC', 'WCBD', 'WCBW', 'WCMP', 'WCLB', 'WCOB',
  'BLND', 'DEAF', 'DPNA', 'SVAN', 'ESAN', 'MEDA', 'STCR', 'OXYG',
] as const;

export const CHILD_SSR = ['CHLD', 'INFT'] as const;

export interface Protection {
  protection: ProtectionCode;
  reason: string;
}

export interface GroupProtection extends Protection {
  group: PriorityGroup;
}

function disabilityCodes(context: DenialContext): Set<string> {
  return new Set([...DISABILITY_SSR, ...(context.extraDisabilitySsrCodes ?? []).map((code) => code.toUpperCase())]);
}

function matching(passenger: CheckedPassenger, codes: Iterable<string>): string[] {
  return [...codes].filter((code) => passenger.ssr.has(code));
}

function childEvidence(passenger: CheckedPassenger, childAgeUnder: number): string | null {
  const codes = matching(passenger, CHILD_SSR);
  if (codes.length > 0) return `SSR ${codes.join('/')}`;
  if (passenger.isChild === true) return 'marked as a child';
  if (typeof passenger.age === 'number' && passenger.age < childAgeUnder) return `age ${passenger.age}`;
  return null;
}

const familyNameOf = (p: CheckedPassenger) => (p.familyName ?? p.name.trim().split(/\s+/).at(-1) ?? '').trim().toUpperCase();

/**
 * Relatives travelling together: the booking names no relationship, so members of one booking who share a family
 * name count as family (common practice, an assumption the reason states so a supervisor can correct it).
 */
function relatives(member: CheckedPassenger, members: CheckedPassenger[]): CheckedPassenger[] {
  const name = familyNameOf(member);
  return name === '' ? [] : members.filter((other) => other.id !== member.id && familyNameOf(other) === name);
}

function outcome(policy: GroupPolicy, group: PriorityGroup): string {
  return policy.mode === 'never-selected'
    ? 'never selected'
    : `priority group under ${policy.sources[group]}: selected only after everyone outside the priority groups`;
}

/**
 * Protections that cover the whole party whatever it chose: unaccompanied minors, passengers with a disability and
 * their companions, and families, who are kept together.
 */
export function groupProtections(members: CheckedPassenger[], checked: CheckedContext, policy: GroupPolicy): Map<string, GroupProtection> | null {
  const disability = disabilityCodes(checked.context);
  const familyCode: ProtectionCode = policy.family === 'any-member' ? 'travelling-with-family' : 'family-with-child';
  const own = new Map<string, GroupProtection>();
  for (const member of members) {
    const minorCodes = matching(member, UNACCOMPANIED_MINOR_SSR);
    const disabilityFound = matching(member, disability);
    const child = childEvidence(member, checked.childAgeUnder);
    const kin = policy.family === 'any-member' && members.length > 1 ? relatives(member, members) : [];
    if (minorCodes.length > 0) {
      own.set(member.id, { group: 'unaccompanied-minor', protection: 'unaccompanied-minor', reason: `unaccompanied minor (SSR UMNR): ${outcome(policy, 'unaccompanied-minor')}` });
    } else if (disabilityFound.length > 0) {
      own.set(member.id, { group: 'disability-or-companion', protection: 'disability-or-companion', reason: `passenger with a disability or needing assistance (SSR ${disabilityFound.join('/')}): ${outcome(policy, 'disability-or-companion')}` });
    } else if (child && (policy.family === 'with-child' || members.length > 1)) {
      own.set(member.id, { group: 'family', protection: familyCode, reason: `child travelling with family (${child}): the family is kept together; ${outcome(policy, 'family')}` });
    } else if (kin.length > 0) {
      own.set(member.id, {
        group: 'family', protection: familyCode,
        reason: `travelling with family members (${kin.map((k) => k.name).join(', ')}: same booking and family name): kept together; ${outcome(policy, 'family')}`,
      });
    }
  }
  if (own.size === 0) return null;
  const result = new Map(own);
  const holders = (group: PriorityGroup) => members.filter((member) => own.get(member.id)?.group === group).map((member) => member.name);
  for (const member of members) {
    if (result.has(member.id)) continue;
    const withDisability = holders('disability-or-companion');
    const family = holders('family');
    if (withDisability.length > 0) {
      result.set(member.id, { group: 'disability-or-companion', protection: 'disability-or-companion', reason: `companion in the same party as ${withDisability.join(', ')}, who has a disability or needs assistance: ${outcome(policy, 'disability-or-companion')}` });
    } else if (family.length > 0) {
      result.set(member.id, { group: 'family', protection: familyCode, reason: `travelling with family (${family.join(', ')}): kept together; ${outcome(policy, 'family')}` });
    } else {
      result.set(member.id, { group: 'unaccompanied-minor', protection: 'kept-with-party', reason: `travelling with ${holders('unaccompanied-minor').join(', ')}, an unaccompanied minor: kept together; ${outcome(policy, 'unaccompanied-minor')}` });
    }
  }
  return result;
}

type PersonalCode = 'boarded' | 'already-denied-on-ticket' | 'volunteered';

/** Protections of one traveller that hold back the rest of a unit kept together. */
export function personalProtection(passenger: CheckedPassenger, checked: CheckedContext, policy: GroupPolicy): (Protection & { protection: PersonalCode }) | null {
  if (passenger.boardedMs !== null) {
    const reference = checked.context.regime === 'us-dot' ? ' (14 CFR 250.7)' : '';
    return {
      protection: 'boarded',
      reason: `boarded with an accepted boarding pass at ${formatClock(passenger.boardedMs, checked.timeZone)}: not removed for an oversale${reference}`,
    };
  }
  if (passenger.alreadyDeniedOnTicket && policy.mode === 'never-selected') {
    return { protection: 'already-denied-on-ticket', reason: 'already denied boarding once on this ticket: not selected again' };
  }
  if (passenger.volunteered) {
    return { protection: 'volunteered', reason: 'volunteered: handled in the volunteer round with agreed benefits, not involuntarily' };
  }
  return null;
}

const PLAIN_WORDS: Record<PersonalCode, string> = {
  boarded: 'who has boarded',
  'already-denied-on-ticket': 'who was already denied once on this ticket',
  volunteered: 'who volunteered',
};

export function unitExclusions(unit: CheckedPassenger[], checked: CheckedContext, policy: GroupPolicy): ExcludedPassenger[] {
  const own = new Map<string, Protection & { protection: PersonalCode }>();
  for (const member of unit) {
    const protection = personalProtection(member, checked, policy);
    if (protection) own.set(member.id, protection);
  }
  if (own.size === 0) return [];
  const holders = unit.flatMap((member) => {
    const protection = own.get(member.id);
    return protection ? [`${member.name}, ${PLAIN_WORDS[protection.protection]}`] : [];
  });
  return unit.map((member) => {
    const protection: Protection = own.get(member.id) ?? {
      protection: 'kept-with-party',
      reason: `kept together with ${holders.join('; ')}: the party is not split`,
    };
    return { passengerId: member.id, name: member.name, partyId: member.partyId, ...protection };
  });
}

/** Under a selected-last policy, a repeat denial is a priority group of its own (the last in the order). */
export function repeatDenialGroup(unit: CheckedPassenger[], policy: GroupPolicy): GroupProtection | null {
  if (policy.mode !== 'selected-last') return null;
  const again = unit.filter((member) => member.alreadyDeniedOnTicket);
  if (again.length === 0) return null;
  return {
    group: 'already-denied-on-ticket', protection: 'already-denied-on-ticket',
    reason: `${again.map((m) => m.name).join(', ')} already denied boarding once on this ticket: ${outcome(policy, 'already-denied-on-ticket')}`,
  };
}

/** Passengers who are not at the flight: never denied boarding, whatever the regime. */
export function absence(passenger: CheckedPassenger, checked: CheckedContext): Protection | null {
  if (passenger.boardedMs !== null) return null;
  const deadline = checked.checkInDeadlineMs;
  const at = deadline === null ? '' : ` (check-in closed at ${formatClock(deadline, checked.timeZone)})`;
  if (passenger.checkedInMs === null) {
    const closed = deadline !== null && checked.nowMs !== null && checked.nowMs >= deadline;
    return {
      protection: 'not-checked-in',
      reason: closed
        ? `not checked in by the deadline${at}: a no-show, not a denied passenger`
        : `not checked in yet${at}: only passengers who are present can be selected`,
    };
  }
  if (deadline !== null && passenger.checkedInMs > deadline) {
    return {
      protection: 'checked-in-late',
      reason: `checked in at ${formatClock(passenger.checkedInMs, checked.timeZone)}, after the deadline${at}: did not present on time, so not a denied passenger`,
    };
  }
  return null;
}

export { GROUP_WORDS };
