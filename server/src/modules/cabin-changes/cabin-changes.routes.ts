// Cabin changes on a flight: the desk (agents and supervisors) records and lists them, within its stations.
import { Router } from 'express';
import { z } from 'zod';
import { recordCabinChangeBodySchema } from '@shared/schemas/cabin-changes';
import type { DataSource } from 'typeorm';
import { currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { flightForUser } from '../flights/flight-desk.service';
import { listCabinChanges, recordCabinChange } from './cabin-changes.service';

const flightParams = z.object({ flightId: z.coerce.number({ error: 'flightId must be a number' }).int().positive('flightId must be positive') });

export function cabinChangesRouter(deps: { db: DataSource }) {
  const r = Router();
  const desk = requireRole('agent', 'supervisor');

  r.get('/flights/:flightId/cabin-changes', desk, async (req, res) => {
    const flight = await flightForUser(deps.db, currentUser(req), parse(flightParams, req.params, 'params').flightId);
    res.json({ cabinChanges: await listCabinChanges(deps.db, flight) });
  });

  r.post('/flights/:flightId/cabin-changes', desk, async (req, res) => {
    const flight = await flightForUser(deps.db, currentUser(req), parse(flightParams, req.params, 'params').flightId);
    const cabinChange = await recordCabinChange(deps.db, currentUser(req), flight, parse(recordCabinChangeBodySchema, req.body));
    res.status(201).json({ cabinChange });
  });

  return r;
}
