import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { toBookingLimitOptions, type PlannerInput } from '@shared/schemas/planner';
import { parseRouteKey, type ListPlansQuery, type PlanResult, type SavePlanBody, type SavedPlan } from '@shared/schemas/plans';
import { optimalBookingLimit } from '@shared/forecast';
import { StationEntity } from '../../db/entities';
import { SavedPlanEntity } from '../../db/entities/saved-plan.entity';
import { badRequest, notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { audit } from '../audit/audit.service';
import { presentPlan } from './plans.presenter';

/** Newest first; a route rarely gathers more, and the list stays one screen long. */
const LIST_LIMIT = 100;

/** Another station's plans answer as if the station did not exist: no hint which stations are there. */
async function visibleStation(db: DataSource, user: SessionUser, stationId: number): Promise<StationEntity> {
  const station = canSeeStation(user, stationId) ? await db.getRepository(StationEntity).findOneBy({ id: stationId }) : null;
  if (!station) throw notFound('Station');
  return station;
}

/** A station plans its own departures, so the route must leave from the station's airport. */
function assertRouteLeavesStation(routeKey: string, station: StationEntity): void {
  if (parseRouteKey(routeKey)?.origin !== station.iata) {
    const rule = `routeKey must start at this station's airport (${station.iata})`;
    throw badRequest(`routeKey: ${rule}`, [{ field: 'routeKey', rule }]);
  }
}

/** The server recomputes the optimum itself rather than storing whatever figure a client sent. */
export function planResult(inputs: PlannerInput): PlanResult {
  const best = optimalBookingLimit(toBookingLimitOptions(inputs));
  return { bookings: best.bookings, expectedNetMinor: Math.round(best.expectedNet) };
}

export async function savePlan(db: DataSource, user: SessionUser, body: SavePlanBody): Promise<SavedPlan> {
  const station = await visibleStation(db, user, body.stationId);
  assertRouteLeavesStation(body.routeKey, station);
  const result = planResult(body.inputs);
  return db.transaction(async (em) => {
    const inserted = await em.insert(SavedPlanEntity, {
      stationId: station.id,
      routeKey: body.routeKey,
      name: body.name,
      inputs: body.inputs,
      result,
      createdByUserId: user.id,
    });
    const id = Number(inserted.identifiers[0].id);
    const saved = await em.findOneOrFail(SavedPlanEntity, { where: { id }, relations: { createdBy: true } });
    const shown = presentPlan(saved);
    await audit(em, { actor: user, action: 'plan.saved', entityType: 'saved_plan', entityId: id, stationId: station.id, after: shown });
    return shown;
  });
}

export async function listPlans(db: DataSource, user: SessionUser, query: ListPlansQuery): Promise<SavedPlan[]> {
  await visibleStation(db, user, query.stationId);
  const plans = await db.getRepository(SavedPlanEntity).find({
    where: { stationId: query.stationId, routeKey: query.routeKey },
    relations: { createdBy: true },
    order: { createdAt: 'DESC', id: 'DESC' },
    take: LIST_LIMIT,
  });
  return plans.map(presentPlan);
}
