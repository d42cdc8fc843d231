// The facts a compensation's payment terms are computed from: the row, its station's zone and the restrictions the
// station attaches to a card or credit. Read under the caller's lock, inside its transaction.
import type { EntityManager } from 'typeorm';
import type { PaymentTerms } from '@shared/compensation';
import { CompensationEntity, StationEntity } from '../../db/entities';
import { notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import type { SessionUser } from '@shared/schemas/auth';
import { policyFor } from '../volunteers/policy.service';
import { termsFor } from '../payments/voucher-rules';

export interface PaymentFacts {
  row: CompensationEntity;
  timeZone: string;
  terms: PaymentTerms;
  restrictions: string[];
}

export async function lockCompensation(em: EntityManager, user: SessionUser | null, id: number): Promise<CompensationEntity> {
  const row = await em.findOne(CompensationEntity, { where: { id }, lock: { mode: 'pessimistic_write' } });
  // Another station's compensation is "not found", never a hint that it exists.
  if (!row || (user && !canSeeStation(user, row.stationId))) throw notFound('Compensation');
  return row;
}

export async function paymentFacts(em: EntityManager, row: CompensationEntity): Promise<PaymentFacts> {
  const station = await em.findOneByOrFail(StationEntity, { id: row.stationId });
  const terms = termsFor({ regime: row.regime, voluntary: row.voluntary, deniedAt: row.createdAt, timeZone: station.timeZone });
  return { row, timeZone: station.timeZone, terms, restrictions: (await policyFor(em, row.stationId)).voucherRestrictions };
}

/** The legacy form column follows the medium: the provider restricts a travel credit's card to the carrier. */
export function formFor(medium: CompensationEntity['medium']): CompensationEntity['form'] {
  return medium === 'travel-credit' ? 'voucher' : 'prepaid-card';
}
