import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { idParamSchema } from '@shared/schemas/common';
import { setShockBodySchema } from '@shared/schemas/flight-desk';
import { currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { deskPassengers, eventTrail, flightDesk, flightForUser, forecastHistory, setShock } from './flight-desk.service';

export function flightDeskRouter(deps: { db: DataSource; onFlightChanged: (flightId: number, stationId: number) => void }) {
  const r = Router();
  const load = (req: Parameters<typeof currentUser>[0]) => flightForUser(deps.db, currentUser(req), parse(idParamSchema, req.params, 'params').id);
  const desk = requireRole('agent', 'supervisor', 'admin');

  r.get('/:id', desk, async (req, res) => res.json(await flightDesk(deps.db, await load(req))));
  r.get('/:id/passengers', desk, async (req, res) => res.json({ passengers: await deskPassengers(deps.db, await load(req)) }));
  r.get('/:id/forecast-history', desk, async (req, res) => res.json(await forecastHistory(deps.db, (await load(req)).id)));
  r.get('/:id/events', desk, async (req, res) => res.json(await eventTrail(deps.db, (await load(req)).id)));
  r.put('/:id/shock', requireRole('supervisor', 'admin'), async (req, res) => {
    const flight = await load(req);
    const body = parse(setShockBodySchema, req.body);
    await setShock(deps.db, currentUser(req), flight, body.shock, body.reason);
    deps.onFlightChanged(flight.id, flight.stationId);
    res.json(await flightDesk(deps.db, await load(req)));
  });
  return r;
}
