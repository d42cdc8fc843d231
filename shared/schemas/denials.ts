// Involuntary denied boarding: the station's priority rules, the ranking, proposals, authorization, rebooking.
import { z } from 'zod';
import { priorityRuleSchema, priorityRulesSchema } from '../denial/priority-rules.schema';
import { rebookBodySchema } from './volunteers';

const id = (field: string) => z.number({ error: `${field} must be a number` }).int(`${field} must be a whole number`).positive(`${field} must be positive`);
const reasonText = (what: string) =>
  z.string({ error: `reason is required: say why ${what}` }).trim().min(3, `reason must say why ${what} (at least 3 characters)`).max(300, 'reason must be at most 300 characters');

export const tierOrderSchema = z
  .array(z.string().trim().min(1, 'tierOrder entries must not be blank').max(16, 'tierOrder entries must be at most 16 characters'))
  .max(12, 'tierOrder may list at most 12 tiers')
  .refine((tiers) => new Set(tiers).size === tiers.length, 'tierOrder lists a tier twice');

export const priorityRulesBodySchema = z.object({ rules: priorityRulesSchema, tierOrder: tierOrderSchema });
export type PriorityRulesBody = z.input<typeof priorityRulesBodySchema>;

export const stationPriorityRulesSchema = z.object({
  stationId: z.number(),
  rules: z.array(priorityRuleSchema),
  /** Frequent-flyer tiers from lowest to highest status. */
  tierOrder: z.array(z.string()),
  /** True while the station still works by the built-in default. */
  isDefault: z.boolean(),
  updatedAt: z.string().nullable(),
  /** The rules in the words the written statement uses. */
  description: z.array(z.string()),
});
export type StationPriorityRules = z.infer<typeof stationPriorityRulesSchema>;

export const PROTECTION_CODES = [
  'unaccompanied-minor', 'disability-or-companion', 'family-with-child', 'travelling-with-family', 'already-denied-on-ticket', 'boarded', 'volunteered',
  'kept-with-party', 'not-checked-in', 'checked-in-late',
] as const;

export const PRIORITY_GROUPS = ['unaccompanied-minor', 'disability-or-companion', 'family', 'already-denied-on-ticket'] as const;

/** One cabin's seats against the people present and eligible for them now. */
export const cabinCountsSchema = z.object({
  cabin: z.string(),
  seats: z.number(),
  /** Checked in by the deadline or boarded, not counting accepted volunteers or anyone offloaded. */
  occupying: z.number(),
  acceptedVolunteerSeats: z.number(),
  seatsShort: z.number(),
  waitingProposalSeats: z.number(),
  seatsShortAfterProposals: z.number(),
});
export type CabinCounts = z.infer<typeof cabinCountsSchema>;

export const denialCountsSchema = z.object({
  seats: z.number(),
  checkedIn: z.number(),
  boarded: z.number(),
  acceptedVolunteerSeats: z.number(),
  /** Checked in by the deadline or boarded, not counting accepted volunteers: the people who need a seat now. */
  occupying: z.number(),
  seatsShort: z.number(),
  /** Seats already covered by denials waiting for a supervisor. */
  waitingProposalSeats: z.number(),
  seatsShortAfterProposals: z.number(),
  /** The forecast's expected shows, when computed. */
  expectedShows: z.number().nullable(),
  /** Check-in deadline (scheduled departure minus the station's check-in close); later is a no-show. */
  checkInDeadline: z.string(),
  /** A shortfall is per cabin: seats in one cabin do not take passengers of another. */
  byCabin: z.array(cabinCountsSchema),
});
export type DenialCounts = z.infer<typeof denialCountsSchema>;

export const denialCandidateSchema = z.object({
  position: z.number(),
  unitId: z.string(),
  bookingId: z.number(),
  pnr: z.string(),
  passengerIds: z.array(z.number()),
  names: z.array(z.string()),
  seatsFreed: z.number(),
  /** Cabins of the unit's members: a proposal takes candidates of the cabin that is short. */
  cabins: z.array(z.string()),
  /** A priority group ranked after everyone else (Canada's and the EU's rules), or null. */
  priorityGroup: z.enum(PRIORITY_GROUPS).nullable(),
  reasons: z.array(z.string()),
  /** Set when this unit is already in a waiting or authorized denial. */
  selection: z.object({ denialId: z.number(), proposalId: z.number(), status: z.enum(['proposed', 'authorized']) }).nullable(),
});
export type DenialCandidate = z.infer<typeof denialCandidateSchema>;

export const excludedCandidateSchema = z.object({
  passengerId: z.number(),
  bookingId: z.number(),
  pnr: z.string(),
  name: z.string(),
  protection: z.enum(PROTECTION_CODES),
  reason: z.string(),
});

export const denialCandidatesSchema = z.object({
  flight: z.object({ id: z.number(), label: z.string(), origin: z.string(), destination: z.string(), scheduledDeparture: z.string(), stationId: z.number() }),
  regime: z.string(),
  counts: denialCountsSchema,
  rules: z.array(priorityRuleSchema),
  rulesText: z.array(z.string()),
  candidates: z.array(denialCandidateSchema),
  excluded: z.array(excludedCandidateSchema),
});
export type DenialCandidates = z.infer<typeof denialCandidatesSchema>;

export const proposeDenialsBodySchema = z.object({
  seatsNeeded: z.number({ error: 'seatsNeeded must be a number' }).int('seatsNeeded must be a whole number').min(1, 'seatsNeeded must be at least 1').max(60, 'seatsNeeded must be at most 60'),
  /** The cabin that is short; may be left out when only one cabin is short. */
  cabin: z.string({ error: 'cabin must be a cabin letter' }).regex(/^[A-Z]$/, 'cabin must be one capital letter, e.g. Y').optional(),
  reason: reasonText('the seats are needed'),
});
export type ProposeDenialsBody = z.infer<typeof proposeDenialsBodySchema>;

export const authorizeDenialsBodySchema = z.object({
  /** Only these denials of the proposal; all waiting ones when left out. */
  denialIds: z.array(id('denialIds[]')).min(1, 'denialIds must name at least one denial, or be left out to authorize all').max(60).optional(),
});

export const changeDenialsBodySchema = z
  .object({
    remove: z.array(id('remove[]')).max(60, 'remove may name at most 60 denials').default([]),
    add: z.array(id('add[]')).max(60, 'add may name at most 60 bookings').default([]),
    reason: reasonText('the selection changed'),
  })
  .refine((b) => b.remove.length + b.add.length > 0, { message: 'remove or add must name at least one denial or booking', path: ['remove'] });
export type ChangeDenialsBody = z.input<typeof changeDenialsBodySchema>;

export const withdrawDenialsBodySchema = z.object({ reason: reasonText('the proposal is withdrawn') });

const manualAlternateSchema = rebookBodySchema.options[1].shape.manual;

/**
 * Exactly one of: a flight of ours, another carrier's flight entered by hand, or the record that no alternate
 * transportation was offered (compensation then takes the no-alternate band).
 */
export const rebookDenialBodySchema = z
  .object({
    alternateFlightId: id('alternateFlightId').optional(),
    manual: manualAlternateSchema.optional(),
    noAlternate: z.literal(true, { error: 'noAlternate must be true when given' }).optional(),
    /** A documented exemption code of the station's regime (e.g. us-smaller-aircraft). */
    exemption: z.string().trim().min(1).max(60).optional(),
    /** eu-261 / uk-261 Art. 7(2): the carrier halves when the re-routing arrives close to schedule. */
    applyReroutingReduction: z.boolean({ error: 'applyReroutingReduction must be true or false' }).optional(),
    /**
     * The planned arrival at the airport the rule measures to (the final destination, or the US first stopover), when
     * the re-routing no longer follows the booking's onward flights. ISO 8601 with offset.
     */
    arrivalAtDestination: z.iso.datetime({ offset: true, error: 'arrivalAtDestination must be an ISO 8601 date-time with an offset' }).optional(),
  })
  .refine((b) => [b.alternateFlightId, b.manual, b.noAlternate].filter((x) => x !== undefined).length === 1, {
    message: 'give exactly one of alternateFlightId, manual { carrier, number, departure, arrival } or noAlternate: true',
    path: ['alternateFlightId'],
  });
export type RebookDenialBody = z.input<typeof rebookDenialBodySchema>;

export const DENIAL_CATEGORIES = ['1a', '1b', '2a', '2b', '2c'] as const;
export type DenialCategory = (typeof DENIAL_CATEGORIES)[number];

export const passengerCompensationSchema = z.object({
  passengerId: z.number(),
  name: z.string(),
  amountMinor: z.number(),
  currency: z.string(),
  band: z.string(),
  ruleRef: z.string(),
  explanation: z.string(),
  notes: z.array(z.string()),
  reviewFlags: z.array(z.string()),
  /** Why the rules could not be applied (e.g. a fare in the wrong currency); the amount is then 0 and must not be paid as is. */
  problem: z.string().nullable(),
  /** The rules-table row used, kept so the statement quotes the amounts that were in force. */
  rulesInForce: z.object({ effectiveFrom: z.string(), source: z.string() }).nullable(),
});
export type PassengerCompensation = z.infer<typeof passengerCompensationSchema>;

export const denialCompensationSnapshotSchema = z.object({
  /** The planned arrival delay the amounts rest on, and in words where it came from. */
  plannedArrivalDelayMinutes: z.number().nullable(),
  basis: z.string(),
  passengers: z.array(passengerCompensationSchema),
  /** Flags about the case as a whole, e.g. enforcement-body details that must be checked. */
  reviewFlags: z.array(z.string()),
  /** The station's priority rules when the statements were written, so a reprint says what the mail said. */
  priorityRules: z.array(priorityRuleSchema).optional(),
});
export type DenialCompensationSnapshot = z.infer<typeof denialCompensationSnapshotSchema>;

export const statementStatusSchema = z.object({
  passengerId: z.number(),
  name: z.string(),
  to: z.string().nullable(),
  status: z.enum(['pending', 'sent', 'failed', 'no-address', 'not-yet']),
});

export const denialSchema = z.object({
  id: z.number(),
  proposalId: z.number(),
  bookingId: z.number(),
  pnr: z.string(),
  passengerIds: z.array(z.number()),
  names: z.array(z.string()),
  position: z.number(),
  reasons: z.array(z.string()),
  status: z.enum(['proposed', 'authorized', 'removed']),
  selectedBy: z.string(),
  selectedByUserId: z.number(),
  authorizedBy: z.string().nullable(),
  authorizedAt: z.string().nullable(),
  changeReason: z.string().nullable(),
  category: z.enum(DENIAL_CATEGORIES).nullable(),
  categoryLabel: z.string().nullable(),
  /** settled: frozen at rebooking; otherwise a preview on the stated assumption. */
  compensation: denialCompensationSnapshotSchema.extend({ settled: z.boolean() }),
  /** Where the station's rule measures this booking's journey; the zones read the times typed for those airports. */
  journey: z.object({
    legDestination: z.string(), legDestinationTimeZone: z.string().nullable(), finalDestination: z.string(),
    measuredTo: z.string(), measuredToTimeZone: z.string().nullable(), measuredBecause: z.string(), onward: z.array(z.string()),
  }).nullable(),
  rebooking: z.object({ flight: z.string(), departure: z.string(), arrival: z.string(), plannedArrivalDelayMinutes: z.number() }).nullable(),
  statements: z.array(statementStatusSchema),
});
export type Denial = z.infer<typeof denialSchema>;

export const DENIAL_PROPOSAL_STATUSES = ['proposed', 'authorized', 'changed', 'withdrawn'] as const;

export const denialProposalSchema = z.object({
  id: z.number(),
  flightId: z.number(),
  stationId: z.number(),
  status: z.enum(DENIAL_PROPOSAL_STATUSES),
  seatsNeeded: z.number(),
  seatsSelected: z.number(),
  reason: z.string(),
  proposedBy: z.string(),
  proposedByUserId: z.number(),
  proposedAt: z.string(),
  decidedBy: z.string().nullable(),
  decidedAt: z.string().nullable(),
  denials: z.array(denialSchema),
});
export type DenialProposal = z.infer<typeof denialProposalSchema>;

export const denialProposalListSchema = z.object({ regime: z.string(), proposals: z.array(denialProposalSchema) });

export const waitingProposalSchema = z.object({
  id: z.number(),
  flightId: z.number(),
  flight: z.string(),
  destination: z.string(),
  scheduledDeparture: z.string(),
  status: z.enum(DENIAL_PROPOSAL_STATUSES),
  seatsNeeded: z.number(),
  seatsSelected: z.number(),
  reason: z.string(),
  proposedBy: z.string(),
  proposedAt: z.string(),
});
export const waitingProposalListSchema = z.object({ proposals: z.array(waitingProposalSchema) });
export type WaitingProposal = z.infer<typeof waitingProposalSchema>;

export const rebookDenialResultSchema = z.object({ denial: denialSchema });

/**
 * Refusing carriage for safety, security, health or the passenger's conduct is not a denial of boarding: no
 * compensation, not on the denied-boarding report (SOR/2019-150 s.1(3), as we read it; 14 CFR 250.7 names the same
 * grounds; Regulation 261/2004 Art. 2(j) excludes reasonable grounds such as health, safety or security).
 */
export const REFUSAL_GROUNDS = ['safety', 'security', 'health', 'conduct'] as const;

const passengerIdList = z
  .array(id('passengerIds[]'), { error: 'passengerIds must list the passengers' })
  .min(1, 'passengerIds must name at least one passenger')
  .max(9, 'passengerIds may name at most 9 passengers (one booking)');

export const recordRefusalBodySchema = z.object({
  passengerIds: passengerIdList,
  ground: z.enum(REFUSAL_GROUNDS, { error: 'ground must be one of safety, security, health, conduct' }),
  reason: reasonText('carriage is refused'),
});
export type RecordRefusalBody = z.infer<typeof recordRefusalBodySchema>;

export const boardingRefusalSchema = z.object({
  id: z.number(),
  flightId: z.number(),
  pnr: z.string(),
  passengerIds: z.array(z.number()),
  names: z.array(z.string()),
  ground: z.enum(REFUSAL_GROUNDS),
  reason: z.string(),
  refusedBy: z.string(),
  refusedAt: z.string(),
});
export type BoardingRefusal = z.infer<typeof boardingRefusalSchema>;
export const boardingRefusalListSchema = z.object({ refusals: z.array(boardingRefusalSchema) });

/** A supervisor's correction: a denial that happened but was not recorded at the time. */
export const recordDenialAfterBodySchema = z.object({
  passengerIds: passengerIdList,
  occurredAt: z.iso.datetime({ offset: true, error: 'occurredAt must be a date and time with its offset, e.g. 2025-01-21T18:40:00-05:00' }),
  reason: reasonText('the denial is recorded after the fact'),
});
export type RecordDenialAfterBody = z.infer<typeof recordDenialAfterBodySchema>;
