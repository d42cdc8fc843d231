import type { DataSource, EntityManager } from 'typeorm';
import { volunteerPolicySchema, type VolunteerPolicy } from '@shared/schemas/volunteers';
import { StationEntity, VolunteerPolicyEntity } from '../../db/entities';

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
