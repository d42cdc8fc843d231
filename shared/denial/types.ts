import type { PriorityGroup } from './priority-groups';
import type { Regime } from '../compensation/types';

export interface DenialPassenger {
  id: string;
  pnr: string;
  /** Passengers travelling together share a partyId; a single traveller has a party of one. */
  partyId: string;
  /** Party size as booked, when known; members on other flights make it larger than those listed. */
  partySize?: number;
  /** True when the party chose to travel separately; all listed members must agree. */
  partySplitAgreed?: boolean;
  name: string;
  /** Family name, to tell relatives in one booking; the last word of name when left out. */
  familyName?: string;
  /** ISO 8601 date-time with offset, or null when not checked in. */
  checkedInAt: string | null;
  /** Boarding pass scanned and accepted at the gate (ISO date-time), or null. */
  boardedAt: string | null;
  /** Fare paid in minor units of context.currency. */
  fareMinor: number;
  frequentFlyerTier: string | null;
  ssrCodes: string[];
  age?: number | null;
  isChild?: boolean;
  alreadyDeniedOnTicket: boolean;
  volunteered: boolean;
  /** Needed only when a rule uses seat-assigned-before-gate. */
  seatAssignedBeforeGate?: boolean;
}

export interface DenialContext {
  /** Frequent-flyer tiers from lowest to highest status. */
  tierOrder: string[];
  /** Currency of fareMinor, for the reasons text. */
  currency: string;
  /** IANA zone for times in the reasons text; default UTC. */
  stationTimeZone?: string;
  /** Age below which a passenger counts as a child for the family protection; default 12 (common practice). */
  childAgeUnder?: number;
  /** Adds the regulation reference where one exists (e.g. 14 CFR 250.7 for boarded passengers). */
  regime?: Regime;
  /** Further SSR codes the carrier treats as disability or medical assistance. */
  extraDisabilitySsrCodes?: string[];
  /**
   * Check-in deadline (ISO date-time with offset). A passenger not checked in by then is not present: a no-show,
   * never a denied passenger. Without it, anyone checked in counts as present.
   */
  checkInDeadline?: string;
  /** The moment of the ranking (ISO), to say whether a missing check-in is already a no-show. */
  now?: string;
}

export type ProtectionCode =
  | 'unaccompanied-minor'
  | 'disability-or-companion'
  | 'family-with-child'
  | 'travelling-with-family'
  | 'not-checked-in'
  | 'checked-in-late'
  | 'already-denied-on-ticket'
  | 'boarded'
  | 'volunteered'
  | 'kept-with-party';

export interface ExcludedPassenger {
  passengerId: string;
  name: string;
  partyId: string;
  protection: ProtectionCode;
  reason: string;
}

export interface RankedCandidate {
  /** 1 is selected first. */
  position: number;
  /** A party kept together, or one traveller. */
  unitId: string;
  partyId: string;
  pnr: string;
  passengerIds: string[];
  names: string[];
  seatsFreed: number;
  /** Set when the unit is in a priority group ranked after everyone else (selected-last policies). */
  priorityGroup: PriorityGroup | null;
  reasons: string[];
}

export interface DenialRanking {
  candidates: RankedCandidate[];
  excluded: ExcludedPassenger[];
}
