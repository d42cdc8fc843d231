import { z } from 'zod';
import { LANGUAGES } from '../i18n/languages';
import { currencySchema } from './common';
import { minorAmountSchema } from './money';

const minor = minorAmountSchema;

export const RAISE_POLICIES = ['lift-to-new-offer', 'keep-agreed'] as const;

/** What the station lets agents offer: the ladder of posted amounts and the most an agent may offer alone. */
export const volunteerPolicySchema = z.object({
  currency: currencySchema,
  ladderMinor: z.array(minor('ladderMinor[]')).min(1, 'ladderMinor needs at least one step').max(12, 'ladderMinor may have at most 12 steps')
    .refine((l) => l.every((x, i) => i === 0 || x > l[i - 1]), 'ladderMinor must rise at every step'),
  agentLimitMinor: minor('agentLimitMinor'),
  /** The most a supervisor may fix alone; null: no limit of their own (another supervisor is never needed). */
  supervisorLimitMinor: minor('supervisorLimitMinor').nullable().default(null),
  /**
   * When a posted offer rises during a round, volunteers already accepted at a lower amount either get the new
   * amount (the default: no one is worse off for saying yes early) or keep what they agreed.
   */
  raisePolicy: z.enum(RAISE_POLICIES, { error: 'raisePolicy must be lift-to-new-offer or keep-agreed' }).default('lift-to-new-offer'),
  /** Sealed bids: pay each volunteer their own ask, or every accepted volunteer the highest accepted ask. */
  sealedBidPricing: z.enum(['own-ask', 'common-price'], { error: 'sealedBidPricing must be own-ask or common-price' }),
  extras: z.array(z.string().trim().min(1).max(60)).max(6, 'at most 6 extras'),
  voucherRestrictions: z.array(z.string().trim().min(1).max(200)).max(10, 'at most 10 voucher restrictions'),
});
export type VolunteerPolicy = z.infer<typeof volunteerPolicySchema>;

export const ROUND_KINDS = ['posted', 'sealed'] as const;
export const openRoundBodySchema = z.object({
  kind: z.enum(ROUND_KINDS, { error: 'kind must be posted or sealed' }),
  /** Posted rounds: the first offer (normally the ladder's first step). */
  offerMinor: minor('offerMinor').optional(),
  extras: z.array(z.string().max(60)).max(6).default([]),
  volunteersNeeded: z.number().int('volunteersNeeded must be a whole number').min(1, 'volunteersNeeded must be at least 1').max(60, 'volunteersNeeded must be at most 60'),
}).refine((b) => b.kind === 'sealed' || b.offerMinor !== undefined, { message: 'offerMinor is required for a posted offer', path: ['offerMinor'] });

export const raiseOfferBodySchema = z.object({ offerMinor: minor('offerMinor') });

export const addVolunteerBodySchema = z.object({
  passengerIds: z.array(z.number().int().positive()).min(1, 'passengerIds must name at least one passenger').max(9),
  askMinor: minor('askMinor').optional(),
});

export const rebookBodySchema = z.union([
  z.object({ alternateFlightId: z.number().int().positive('alternateFlightId must be positive') }),
  z.object({
    manual: z.object({
      carrier: z.string().regex(/^[A-Z0-9]{2,3}$/, 'carrier must be a 2-3 character airline designator'),
      number: z.string().regex(/^\d{1,4}[A-Z]?$/, 'number must be 1-4 digits'),
      departure: z.iso.datetime({ offset: true, error: 'departure must be an ISO date-time' }),
      arrival: z.iso.datetime({ offset: true, error: 'arrival must be an ISO date-time' }),
    }),
  }),
], { error: 'give alternateFlightId, or manual { carrier, number, departure, arrival }' });

export const volunteerSchema = z.object({
  id: z.number(),
  bookingId: z.number(),
  pnr: z.string(),
  names: z.array(z.string()),
  passengerIds: z.array(z.number()),
  askMinor: z.number().nullable(),
  source: z.enum(['passenger-link', 'agent']),
  status: z.enum(['offered', 'accepted', 'declined', 'withdrawn']),
  agreedMinor: z.number().nullable(),
  acceptedAt: z.string().nullable(),
  rebooking: z.object({ flight: z.string(), departure: z.string(), arrival: z.string(), plannedArrivalDelayMinutes: z.number() }).nullable(),
  /** A sealed bid above the accepting agent's limit, waiting for a supervisor. */
  pendingApproval: z.object({ id: z.number(), offerMinor: z.number(), requestedBy: z.string(), requestedAt: z.string() }).nullable(),
  createdAt: z.string(),
});
export type Volunteer = z.infer<typeof volunteerSchema>;

export const roundSchema = z.object({
  id: z.number(),
  flightId: z.number(),
  kind: z.enum(ROUND_KINDS),
  status: z.enum(['open', 'closed', 'cancelled']),
  currency: z.string(),
  offerMinor: z.number().nullable(),
  extras: z.array(z.string()),
  volunteersNeeded: z.number(),
  accepted: z.number(),
  pendingApproval: z.object({ id: z.number(), kind: z.enum(['opening-offer', 'raise']), offerMinor: z.number(), requestedBy: z.string(), requestedAt: z.string() }).nullable(),
  openedBy: z.string(),
  openedAt: z.string(),
  closedAt: z.string().nullable(),
  volunteers: z.array(volunteerSchema),
});
export type Round = z.infer<typeof roundSchema>;
export const roundListSchema = z.object({ rounds: z.array(roundSchema), policy: volunteerPolicySchema, bidLink: z.string().nullable() });

export const alternateFlightSchema = z.object({ id: z.number(), label: z.string(), departure: z.string(), arrival: z.string(), freeSeats: z.number(), plannedArrivalDelayMinutes: z.number() });
export const alternateListSchema = z.object({ alternates: z.array(alternateFlightSchema) });


// The passenger's page ("Offer your seat"): no sign-in; a signed link names the flight, never a passenger.
export const publicOfferSchema = z.object({
  flight: z.object({ label: z.string(), destination: z.string(), departure: z.string(), timeZone: z.string() }),
  round: z.object({ kind: z.enum(ROUND_KINDS), offerMinor: z.number().nullable(), currency: z.string(), extras: z.array(z.string()) }).nullable(),
  disclosure: z.object({ mayBeDeniedInvoluntarily: z.boolean(), involuntaryRule: z.string(), cashAlternative: z.string(), voucherRestrictions: z.array(z.string()), ifTheOfferRises: z.string() }),
});
export const identifyBodySchema = z.object({
  pnr: z.string().trim().toUpperCase().regex(/^[A-Z0-9]{5,8}$/, 'booking reference must be 5-8 letters or digits'),
  lastName: z.string().trim().min(1, 'last name is required').max(60),
});
export const identifiedSchema = z.object({ passengerToken: z.string(), names: z.array(z.string()), language: z.enum(LANGUAGES).nullable().optional() });
export const passengerBidBodySchema = z.object({ passengerToken: z.string().min(10), askMinor: minor('askMinor').optional(), acceptPosted: z.boolean().optional() })
  .refine((b) => b.askMinor !== undefined || b.acceptPosted, { message: 'name the least you would accept, or accept the posted offer', path: ['askMinor'] });
export const passengerStatusSchema = z.object({ status: z.enum(['none', 'offered', 'accepted', 'declined', 'withdrawn']), agreedMinor: z.number().nullable(), currency: z.string(), rebooking: volunteerSchema.shape.rebooking, message: z.string() });

export const outboxMessageSchema = z.object({ id: z.string(), kind: z.string(), to: z.string(), subject: z.string(), status: z.enum(['pending', 'sent', 'failed']), attempts: z.number(), lastError: z.string().nullable(), createdAt: z.string(), sentAt: z.string().nullable(), passengerIds: z.array(z.number()) });
export const outboxListSchema = z.object({ messages: z.array(outboxMessageSchema) });
