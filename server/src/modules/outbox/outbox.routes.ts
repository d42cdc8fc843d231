// GET /api/flights/:flightId/notices and POST /api/flights/:flightId/notices/:id/retry; a station's notices under
// /api/stations/:stationId/notices for the Notices screen.
import { Router, type Request } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { flightForUser } from '../flights/flight-desk.service';
import { listFlightNotices, requeueFailedNotice } from './outbox.service';
import { noticesQuerySchema } from '@shared/schemas/admin-notices';
import { canSeeStation } from '../../http/require-role';
import { notFound } from '../../http/errors';
import { listStationNotices, noticeDetail, resendStationNotice, retryStationNotice } from './station-notices.service';

const flightParamSchema = z.object({
  flightId: z.coerce.number({ error: 'flightId must be a number' }).int('flightId must be a whole number').positive('flightId must be positive'),
});
const noticeParamSchema = flightParamSchema.extend({ id: z.uuid({ error: 'id must be a notice id (a UUID)' }) });

/** Mounted at /flights/:flightId/notices; mergeParams lets it read :flightId from the mount path. */
export function noticesRouter(deps: { db: DataSource }) {
  const r = Router({ mergeParams: true });
  // Station scoping through the flight: another station's flight is "not found", never a hint it exists.
  const load = (req: Request) => flightForUser(deps.db, currentUser(req), parse(flightParamSchema, req.params, 'params').flightId);

  r.get('/', requireRole('agent', 'supervisor', 'admin'), async (req, res) => {
    res.json(await listFlightNotices(deps.db, await load(req)));
  });

  r.post('/:id/retry', requireRole('supervisor', 'admin'), async (req, res) => {
    const { id } = parse(noticeParamSchema, req.params, 'params');
    const message = await requeueFailedNotice(deps.db, currentUser(req), await load(req), id);
    res.json(message);
  });

  return r;
}

const stationParamSchema = z.object({ stationId: z.coerce.number({ error: 'stationId must be a number' }).int('stationId must be a whole number').positive('stationId must be positive') });
const stationNoticeParamSchema = stationParamSchema.extend({ id: z.uuid({ error: 'id must be a notice id (a UUID)' }) });

/** Every notice of a station, flight or not: supervisors and admins of the station; anyone else's is "not found". */
export function stationNoticesRouter(deps: { db: DataSource }) {
  const r = Router();
  const roles = requireRole('supervisor', 'admin');
  const station = (req: Request) => {
    const { stationId } = parse(stationParamSchema, req.params, 'params');
    if (!canSeeStation(currentUser(req), stationId)) throw notFound('Station');
    return stationId;
  };
  const notice = (req: Request) => {
    const stationId = station(req);
    return { stationId, id: parse(stationNoticeParamSchema, req.params, 'params').id };
  };

  r.get('/stations/:stationId/notices', roles, async (req, res) => {
    const stationId = station(req);
    res.json(await listStationNotices(deps.db, stationId, parse(noticesQuerySchema, req.query, 'query')));
  });
  r.get('/stations/:stationId/notices/:id', roles, async (req, res) => {
    const { stationId, id } = notice(req);
    res.json(await noticeDetail(deps.db, stationId, id));
  });
  r.post('/stations/:stationId/notices/:id/retry', roles, async (req, res) => {
    const { stationId, id } = notice(req);
    const out = await retryStationNotice(deps.db, currentUser(req), stationId, id);
    res.json(out);
  });
  r.post('/stations/:stationId/notices/:id/resend', roles, async (req, res) => {
    const { stationId, id } = notice(req);
    const out = await resendStationNotice(deps.db, currentUser(req), stationId, id);
    res.status(201).json(out);
  });
  return r;
}
