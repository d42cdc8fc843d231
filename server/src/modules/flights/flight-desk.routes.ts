import { Router, type Request, type Response } from 'express';
import type { DataSource } from 'typeorm';
import { idParamSchema } from '@shared/schemas/common';
import { setShockBodySchema } from '@shared/schemas/flight-desk';
import { currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import type { PayloadKind } from '../forecast/live-store';
import { deskPayload, etagOf, flightForUser, liveFlightForUser, setShock } from './flight-desk.service';

export function flightDeskRouter(deps: { db: DataSource }) {
  const r = Router();
  const desk = requireRole('agent', 'supervisor', 'admin');

  /**
   * Every desk read is one payload of the flight's current version, built once and held in memory: the version is
   * the ETag, compared before any work, and the body is the same string for every console.
   */
  const serve = (kind: PayloadKind) => async (req: Request, res: Response) => {
    const entry = await liveFlightForUser(deps.db, currentUser(req), parse(idParamSchema, req.params, 'params').id);
    const etag = etagOf(entry, kind);
    res.set('ETag', etag);
    res.set('Cache-Control', 'private, no-cache');
    if (req.get('if-none-match') === etag) {
      res.status(304).end();
      return;
    }
    res.type('application/json').send(await deskPayload(deps.db, entry, kind));
  };

  r.get('/:id', desk, serve('desk'));
  r.get('/:id/passengers', desk, serve('passengers'));
  r.get('/:id/forecast-history', desk, serve('history'));
  r.get('/:id/events', desk, serve('events'));
  r.put('/:id/shock', requireRole('supervisor', 'admin'), async (req, res) => {
    const flight = await flightForUser(deps.db, currentUser(req), parse(idParamSchema, req.params, 'params').id);
    const body = parse(setShockBodySchema, req.body);
    const { desk: figures } = await setShock(deps.db, currentUser(req), flight, body.shock, body.reason);
    res.json(figures);
  });
  return r;
}
