import { Router } from 'express';
import { z } from 'zod';
import type { DataSource } from 'typeorm';
import { showUpProfileSchema } from '@shared/schemas/show-up-profile';
import { canSeeStation, currentUser, requireRole } from '../../http/require-role';
import { notFound } from '../../http/errors';
import { parse } from '../../http/validate';
import { getShowUpProfile, putShowUpProfile } from './show-up-profiles.service';

const stationParams = z.object({ stationId: z.coerce.number().int().positive('stationId must be positive') });

/** Mounted at /api/stations/:stationId/show-up-profile: supervisors read it, admins change it. */
export function showUpProfilesRouter(deps: { db: DataSource }) {
  const r = Router({ mergeParams: true });
  r.use(requireRole('admin', 'supervisor'));
  r.use((req, res, next) => {
    const { stationId } = parse(stationParams, req.params, 'params');
    if (!canSeeStation(currentUser(req), stationId)) throw notFound('Station');
    res.locals.stationId = stationId;
    next();
  });

  r.get('/', async (_req, res) => {
    res.json(await getShowUpProfile(deps.db, res.locals.stationId as number));
  });

  r.put('/', requireRole('admin'), async (req, res) => {
    const stationId = res.locals.stationId as number;
    const profile = parse(showUpProfileSchema, req.body);
    res.json(await putShowUpProfile(deps.db, stationId, profile, currentUser(req)));
  });
  return r;
}
