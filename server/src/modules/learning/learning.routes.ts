import { Router } from 'express';
import { z } from 'zod';
import type { DataSource } from 'typeorm';
import { idParamSchema, iataAirportSchema } from '@shared/schemas/common';
import { learnedRouteRatesSchema, outcomeCorrectionSchema, ratesChoiceSchema } from '@shared/schemas/learning';
import { canSeeStation, currentUser, requireRole } from '../../http/require-role';
import { notFound } from '../../http/errors';
import { parse } from '../../http/validate';
import { LearnedRatesEntity } from '../../db/entities';
import { latestJob } from './jobs.service';
import { stationLearning } from './learning.presenter';
import type { LearningRuntime } from './learning-runtime';
import { closedFlightOutcomes, correctOutcome, listClosedFlights } from './outcomes.service';
import { latestVersion, putRatesChoice, routeRates, versionInUse } from './rates.service';
import type { RatesModel } from './train';

const stationParams = z.object({ stationId: z.coerce.number({ error: 'stationId must be a number' }).int().positive('stationId must be positive') });
const routeParams = stationParams.extend({ destination: iataAirportSchema });

/** Mounted at /api/learning. Training is carrier-wide (admins); what a station sees is scoped to it. */
export function learningRouter(deps: { db: DataSource; runtime: LearningRuntime; onChoiceChanged?: (stationId: number) => void }) {
  const r = Router();
  const station = (req: Parameters<typeof currentUser>[0]) => {
    const { stationId } = parse(stationParams, req.params, 'params');
    if (!canSeeStation(currentUser(req), stationId)) throw notFound('Station');
    return stationId;
  };
  const seeing = (req: Parameters<typeof currentUser>[0]) => (stationId: number) => canSeeStation(currentUser(req), stationId);

  r.post('/jobs', requireRole('admin'), async (req, res) => {
    const answer = await deps.runtime.request(currentUser(req));
    // Accepted either way: the run happens in the background; `joined` says whether it was already queued or running.
    res.status(202).json(answer);
  });
  r.get('/jobs/latest', requireRole('admin', 'supervisor'), async (_req, res) => {
    res.json({ job: await latestJob(deps.db) });
  });
  r.get('/stations/:stationId', requireRole('admin', 'supervisor'), async (req, res) => {
    res.json(await stationLearning(deps.db, station(req)));
  });
  r.put('/stations/:stationId/choice', requireRole('admin'), async (req, res) => {
    const stationId = station(req);
    await putRatesChoice(deps.db, stationId, parse(ratesChoiceSchema, req.body), currentUser(req));
    deps.onChoiceChanged?.(stationId);
    res.json(await stationLearning(deps.db, stationId));
  });
  // The planner's starting point: the learned rates of the route in the version the station uses (or the latest).
  r.get('/stations/:stationId/routes/:destination', requireRole('admin', 'supervisor', 'agent'), async (req, res) => {
    const stationId = station(req);
    const { destination } = parse(routeParams, req.params, 'params');
    const inUse = await versionInUse(deps.db, stationId);
    const version = inUse ?? (await latestVersion(deps.db));
    const row = version === null ? null : await deps.db.getRepository(LearnedRatesEntity).findOneBy({ version: Number(version) });
    const learned = row ? routeRates(row.model as RatesModel, stationId, destination) : null;
    res.json(learnedRouteRatesSchema.parse(learned ? { version, inUse: inUse !== null, profile: learned.profile, shockRho: learned.shockRho } : { version: null, inUse: false, profile: null, shockRho: null }));
  });
  r.get('/stations/:stationId/closed-flights', requireRole('admin', 'supervisor'), async (req, res) => {
    res.json({ flights: await listClosedFlights(deps.db, [station(req)]) });
  });
  r.get('/closed-flights/:id/outcomes', requireRole('admin', 'supervisor'), async (req, res) => {
    res.json({ outcomes: await closedFlightOutcomes(deps.db, parse(idParamSchema, req.params, 'params').id, seeing(req)) });
  });
  r.patch('/outcomes/:id', requireRole('admin', 'supervisor'), async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json(await correctOutcome(deps.db, id, parse(outcomeCorrectionSchema, req.body), currentUser(req), seeing(req)));
  });
  return r;
}
