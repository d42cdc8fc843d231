import type { DataSource, EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { volunteerPolicySchema, type VolunteerPolicy } from '@shared/schemas/volunteers';
import { StationEntity, VolunteerPolicyEntity } from '../../db/entities';
import { badRequest } from '../../domain/errors';
import { audit } from '../audit/audit.service';

/**
 * Until an admin sets one: a ladder of five steps and an agent limit at the third, in the station's currency
 * (figures of our own, common practice; the carrier sets its own).
 */
export function defaultPolicy(currency: string): VolunteerPolicy {
  return {
    currency,
    ladderMinor: [20_000, 40_000, 60_000, 80_000, 100_000],
    agentLimitMinor: 60_000,
    supervisorLimitMinor: null,
    raisePolicy: 'lift-to-new-offer',
    sealedBidPricing: 'own-ask',
    extras: ['Meal voucher', 'Lounge access until the new flight'],
    voucherRestrictions: [
      'Valid for 12 months from the date of issue on flights of the issuing carrier only.',
      'Not exchangeable for cash and not transferable.',
      'Cannot be combined with other vouchers on the same booking.',
    ],
  };
}

export async function policyFor(db: DataSource | EntityManager, stationId: number): Promise<VolunteerPolicy> {
  const row = await db.getRepository(VolunteerPolicyEntity).findOneBy({ stationId });
  const parsed = row ? volunteerPolicySchema.safeParse(row.policy) : null;
  if (parsed?.success) return parsed.data;
  const station = await db.getRepository(StationEntity).findOneByOrFail({ id: stationId });
  return defaultPolicy(station.currency);
}

/** An admin's new policy for the station, audited with the one it replaces. */
export async function savePolicy(db: DataSource, user: SessionUser, stationId: number, policy: VolunteerPolicy): Promise<void> {
  const station = await db.getRepository(StationEntity).findOneByOrFail({ id: stationId });
  // Rounds and compensations take the policy's currency; one the station does not pay in would reach finance unreconciled.
  if (policy.currency !== station.currency) throw badRequest(`currency: must be the station's currency, ${station.currency}`, [{ field: 'currency', rule: `must be the station's currency, ${station.currency}` }]);
  await db.transaction(async (em) => {
    const before = await policyFor(em, stationId);
    await em.upsert(VolunteerPolicyEntity, { stationId, policy }, ['stationId']);
    await audit(em, { actor: user, action: 'volunteer_policy.updated', entityType: 'station', entityId: stationId, stationId, before, after: policy });
  });
}
