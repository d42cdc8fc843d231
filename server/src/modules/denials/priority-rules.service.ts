// The station's boarding-priority rules: stored per station, with a default until an admin sets them.
import type { Regime } from '@shared/compensation/types';
import type { DataSource, EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { describeRules, parsePriorityRules, type PriorityRule } from '@shared/denial';
import type { StationPriorityRules } from '@shared/schemas/denials';
import { StationPriorityRulesEntity } from '../../db/entities';
import { recordEffect } from '../../events';
import { audit } from '../audit/audit.service';

/**
 * Latest check-in first, then the lowest fare, then no or low frequent-flyer status: the order most carriers'
 * contracts of carriage describe (common practice).
 */
export const DEFAULT_PRIORITY_RULES: PriorityRule[] = parsePriorityRules([
  { factor: 'check-in-time', direction: 'latest-first' },
  { factor: 'fare-paid', direction: 'lowest-first' },
  { factor: 'frequent-flyer-tier' },
]);

/** The demo carrier's frequent-flyer tiers, lowest status first. */
export const DEFAULT_TIER_ORDER = ['silver', 'gold', 'platinum'];

export interface StationRules {
  rules: PriorityRule[];
  tierOrder: string[];
  isDefault: boolean;
  updatedAt: Date | null;
}

export async function priorityRulesFor(em: DataSource | EntityManager, stationId: number): Promise<StationRules> {
  const row = await em.getRepository(StationPriorityRulesEntity).findOneBy({ stationId });
  if (!row) return { rules: DEFAULT_PRIORITY_RULES, tierOrder: DEFAULT_TIER_ORDER, isDefault: true, updatedAt: null };
  return { rules: parsePriorityRules(row.rules), tierOrder: row.tierOrder, isDefault: false, updatedAt: row.updatedAt };
}

/** The description follows the station's regime: it says whether protected groups are left out or selected last. */
export function presentPriorityRules(stationId: number, rules: StationRules, regime?: Regime): StationPriorityRules {
  return {
    stationId,
    rules: rules.rules,
    tierOrder: rules.tierOrder,
    isDefault: rules.isDefault,
    updatedAt: rules.updatedAt?.toISOString() ?? null,
    description: describeRules(rules.rules, regime),
  };
}

export async function savePriorityRules(db: DataSource, user: SessionUser, stationId: number, body: { rules: PriorityRule[]; tierOrder: string[] }) {
  return db.transaction(async (em) => {
    const before = await priorityRulesFor(em, stationId);
    await em.upsert(StationPriorityRulesEntity, { stationId, rules: body.rules, tierOrder: body.tierOrder }, ['stationId']);
    await audit(em, {
      actor: user, action: 'priority_rules.updated', entityType: 'station', entityId: stationId, stationId,
      before: { rules: before.rules, tierOrder: before.tierOrder, isDefault: before.isDefault }, after: body,
    });
    recordEffect(em, { type: 'priority-rules-changed', stationId });
    return priorityRulesFor(em, stationId);
  });
}
