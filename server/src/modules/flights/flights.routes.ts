import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { departuresQuerySchema } from '@shared/schemas/flights';
import { canSeeStation, currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { notFound } from '../../http/errors';
import { listDepartures } from './flights.service';

export function departuresRouter(deps: { db: DataSource }) {
  const r = Router();
  r.get('/', requireRole('agent', 'supervisor', 'admin'), async (req, res) => {
    const { stationId } = parse(departuresQuerySchema, req.query, 'query');
    // Another station's data answers as if it did not exist: no hint which stations are there.
    if (!canSeeStation(currentUser(req), stationId)) throw notFound('Station');
    res.json(await listDepartures(deps.db, stationId));
  });
  return r;
}
