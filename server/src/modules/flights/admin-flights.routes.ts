// Admin writes on flights: list a station's flights by date, create one, edit it, cancel it.
import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { adminFlightsQuerySchema, flightCancelBodySchema, flightCreateBodySchema, flightUpdateBodySchema } from '@shared/schemas/admin-flights';
import { currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { cancelFlight, createFlight, listAdminFlights, stationForUser, updateFlight } from './admin-flights.service';

const stationParams = z.object({ stationId: z.coerce.number({ error: 'stationId must be a number' }).int('stationId must be a whole number').positive('stationId must be positive') });
const flightParams = z.object({ flightId: z.coerce.number({ error: 'flightId must be a number' }).int('flightId must be a whole number').positive('flightId must be positive') });

export function adminFlightsRouter(deps: { db: DataSource }) {
  const r = Router();
  r.get('/stations/:stationId/flights', requireRole('admin'), async (req, res) => {
    const station = await stationForUser(deps.db, currentUser(req), parse(stationParams, req.params, 'params').stationId);
    const q = parse(adminFlightsQuerySchema, req.query, 'query');
    res.json(await listAdminFlights(deps.db, station, q.from, q.to));
  });
  r.post('/stations/:stationId/flights', requireRole('admin'), async (req, res) => {
    const station = await stationForUser(deps.db, currentUser(req), parse(stationParams, req.params, 'params').stationId);
    const body = parse(flightCreateBodySchema, req.body);
    res.status(201).json(await createFlight(deps.db, currentUser(req), station, body));
  });
  r.patch('/flights/:flightId', requireRole('admin'), async (req, res) => {
    const { flightId } = parse(flightParams, req.params, 'params');
    const body = parse(flightUpdateBodySchema, req.body);
    res.json(await updateFlight(deps.db, currentUser(req), flightId, body));
  });
  r.post('/flights/:flightId/cancel', requireRole('admin'), async (req, res) => {
    const { flightId } = parse(flightParams, req.params, 'params');
    const { reason } = parse(flightCancelBodySchema, req.body);
    res.json(await cancelFlight(deps.db, currentUser(req), flightId, reason));
  });
  return r;
}
