import { z } from 'zod';
import type { Role } from './common';
import type { VolunteerPolicy } from './volunteers';

/**
 * Every path that fixes a compensation amount has its own kind of approval: the first posted offer, a raise, a
 * sealed-bid accept, issuing a compensation, and a supervisor's override of a denial's amount.
 */
export const APPROVAL_KINDS = ['opening-offer', 'raise', 'sealed-accept', 'issue', 'denial-override'] as const;
export type ApprovalKind = (typeof APPROVAL_KINDS)[number];

/** Plain words for each kind, for the supervisor's queue and the agent's "awaiting approval" line. */
export const APPROVAL_KIND_WORDS: Record<ApprovalKind, string> = {
  'opening-offer': 'Open the round with an offer of',
  raise: 'Raise the offer to',
  'sealed-accept': 'Accept a volunteer’s sealed bid of',
  issue: 'Issue a compensation of',
  'denial-override': 'Set a denied passenger’s compensation to',
};

export const approvalsQuerySchema = z.object({ stationId: z.coerce.number({ error: 'stationId must be a number' }).int().positive('stationId must be positive') });

export const decideApprovalBodySchema = z.object({ approve: z.boolean({ error: 'approve must be true or false' }), reason: z.string().trim().max(200).default('') })
  .refine((b) => b.approve || b.reason.length >= 3, { message: 'reason must say why the amount is refused (at least 3 characters)', path: ['reason'] });

export const pendingApprovalSchema = z.object({
  id: z.number(),
  kind: z.enum(APPROVAL_KINDS),
  roundId: z.number().nullable(),
  flightId: z.number().nullable(),
  flight: z.string(),
  /** Who the amount is for, when it is one party's (a sealed bid, a compensation): names and booking reference. */
  subject: z.string().nullable(),
  offerMinor: z.number(),
  currency: z.string(),
  limitMinor: z.number().nullable(),
  requestedBy: z.string(),
  requestedAt: z.string(),
});
export type PendingApproval = z.infer<typeof pendingApprovalSchema>;
export const pendingApprovalListSchema = z.object({ approvals: z.array(pendingApprovalSchema) });

export const approvalDecisionSchema = z.object({ id: z.number(), status: z.enum(['approved', 'rejected']), offerMinor: z.number().nullable() });

/**
 * The most a user of this role may fix alone, in the station's minor units; null when there is no limit. Agents and
 * admins (who administer and are no money authority) have the agent limit; supervisors the supervisor limit, if set.
 */
export function limitForRole(role: Role | string | undefined, policy: Pick<VolunteerPolicy, 'agentLimitMinor' | 'supervisorLimitMinor'>): number | null {
  return role === 'supervisor' ? policy.supervisorLimitMinor : policy.agentLimitMinor;
}

export const withinLimit = (limit: number | null, amountMinor: number) => limit === null || amountMinor <= limit;
