import type { SavedPlan } from '@shared/schemas/plans';
import type { SavedPlanEntity } from '../../db/entities/saved-plan.entity';

/** Expects createdBy loaded: the list says who saved each plan. */
export function presentPlan(p: SavedPlanEntity): SavedPlan {
  return {
    id: p.id,
    stationId: p.stationId,
    routeKey: p.routeKey,
    name: p.name,
    inputs: p.inputs,
    result: p.result,
    createdBy: { id: p.createdBy.id, displayName: p.createdBy.displayName },
    createdAt: p.createdAt.toISOString(),
  };
}
