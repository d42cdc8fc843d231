import { Router } from 'express';
import { z } from 'zod';
import type { DataSource } from 'typeorm';
import { createIntegrationKeyBodySchema } from '@shared/schemas/integration-events';
import { IntegrationKeyEntity } from '../../db/entities';
import { canSeeStation, currentUser, requireRole } from '../../http/require-role';
import { notFound } from '../../http/errors';
import { parse } from '../../http/validate';
import { createIntegrationKey, presentKey, revokeIntegrationKey } from './integration-keys.service';

const stationParams = z.object({ stationId: z.coerce.number().int().positive('stationId must be positive') });
const keyParams = stationParams.extend({ keyId: z.coerce.number().int().positive('keyId must be positive') });

/** Mounted at /api/stations/:stationId/integration-keys: admins of the station only. */
export function integrationKeysRouter(deps: { db: DataSource }) {
  const r = Router({ mergeParams: true });
  r.use(requireRole('admin'));
  r.use((req, _res, next) => {
    const { stationId } = parse(stationParams, req.params, 'params');
    if (!canSeeStation(currentUser(req), stationId)) throw notFound('Station');
    next();
  });

  r.get('/', async (req, res) => {
    const { stationId } = parse(stationParams, req.params, 'params');
    const keys = await deps.db.getRepository(IntegrationKeyEntity).find({ where: { stationId }, order: { createdAt: 'DESC' } });
    res.json({ keys: keys.map(presentKey) });
  });

  r.post('/', async (req, res) => {
    const { stationId } = parse(stationParams, req.params, 'params');
    const { name } = parse(createIntegrationKeyBodySchema, req.body);
    res.status(201).json(await createIntegrationKey(deps.db, stationId, name, currentUser(req)));
  });

  r.delete('/:keyId', async (req, res) => {
    const { stationId, keyId } = parse(keyParams, req.params, 'params');
    res.json(await revokeIntegrationKey(deps.db, stationId, keyId, currentUser(req)));
  });
  return r;
}
