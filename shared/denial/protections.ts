// Who is never selected for involuntary denial, and why. A protected member protects the unit they travel in.
import type { DenialContext, ExcludedPassenger, ProtectionCode } from './types';
import { formatClock, type CheckedContext, type CheckedPassenger } from './validate';

export const UNACCOMPANIED_MINOR_SSR = ['UMNR'] as const;

/** IATA SSR codes for wheelchairs, sight, hearing, intellectual or developmental disability, animals, medical needs (common practice). */
export const DISABILITY_SSR = [
  'WCHR', 'WCHS', 'WCHC', 'WCBD', 'WCBW', 'WCMP', 'WCLB', 'WCOB',
  'BLND', 'DEAF', 'DPNA', 'SVAN', 'ESAN', 'MEDA', 'STCR', 'OXYG',
] as const;

export const CHILD_SSR = ['CHLD', 'INFT'] as const;

interface Protection {
  protection: ProtectionCode;
  reason: string;
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

/**
 * Protections that cover the whole party whatever it chose: unaccompanied minors, passengers with a
 * disability and their companions, and families with children, who are kept together.
 */
export function groupProtections(members: CheckedPassenger[], checked: CheckedContext): Map<string, Protection> | null {
  const disability = disabilityCodes(checked.context);
  const own = new Map<string, Protection>();
  for (const member of members) {
    const minorCodes = matching(member, UNACCOMPANIED_MINOR_SSR);
    const disabilityFound = matching(member, disability);
    const child = childEvidence(member, checked.childAgeUnder);
    if (minorCodes.length > 0) {
      own.set(member.id, { protection: 'unaccompanied-minor', reason: 'unaccompanied minor (SSR UMNR): never selected' });
    } else if (disabilityFound.length > 0) {
      own.set(member.id, { protection: 'disability-or-companion', reason: `passenger with a disability or needing assistance (SSR ${disabilityFound.join('/')}): never selected` });
    } else if (child) {
      own.set(member.id, { protection: 'family-with-child', reason: `child travelling with family (${child}): the family is kept together and not selected` });
    }
  }
  if (own.size === 0) return null;
  const result = new Map(own);
  const protectedNames = (code: ProtectionCode) => members.filter((member) => own.get(member.id)?.protection === code).map((member) => member.name);
  for (const member of members) {
    if (result.has(member.id)) continue;
    const withDisability = protectedNames('disability-or-companion');
    const children = protectedNames('family-with-child');
    if (withDisability.length > 0) {
      result.set(member.id, { protection: 'disability-or-companion', reason: `companion in the same party as ${withDisability.join(', ')}, who has a disability or needs assistance: never selected` });
    } else if (children.length > 0) {
      result.set(member.id, { protection: 'family-with-child', reason: `family travelling with a child (${children.join(', ')}): kept together and not selected` });
    } else {
      result.set(member.id, { protection: 'kept-with-party', reason: `travelling with ${protectedNames('unaccompanied-minor').join(', ')}, an unaccompanied minor: kept together and not selected` });
    }
  }
  return result;
}

/** Protections of one traveller that also hold back the rest of a unit kept together. */
export function personalProtection(passenger: CheckedPassenger, checked: CheckedContext): (Protection & { protection: 'boarded' | 'already-denied-on-ticket' | 'volunteered' }) | null {
  if (passenger.boardedMs !== null) {
    const reference = checked.context.regime === 'us-dot' ? ' (14 CFR 250.7)' : '';
    return {
      protection: 'boarded',
      reason: `boarded with an accepted boarding pass at ${formatClock(passenger.boardedMs, checked.timeZone)}: not removed for an oversale${reference}`,
    };
  }
  if (passenger.alreadyDeniedOnTicket) {
    return { protection: 'already-denied-on-ticket', reason: 'already denied boarding once on this ticket: not selected again' };
  }
  if (passenger.volunteered) {
    return { protection: 'volunteered', reason: 'volunteered: handled in the volunteer round with agreed benefits, not involuntarily' };
  }
  return null;
}

const PLAIN_WORDS: Record<'boarded' | 'already-denied-on-ticket' | 'volunteered', string> = {
  boarded: 'who has boarded',
  'already-denied-on-ticket': 'who was already denied once on this ticket',
  volunteered: 'who volunteered',
};

type PersonalCode = keyof typeof PLAIN_WORDS;

export function unitExclusions(unit: CheckedPassenger[], checked: CheckedContext): ExcludedPassenger[] {
  const own = new Map<string, Protection & { protection: PersonalCode }>();
  for (const member of unit) {
    const protection = personalProtection(member, checked);
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
