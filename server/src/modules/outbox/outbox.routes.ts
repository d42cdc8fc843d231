// GET /api/flights/:flightId/notices and POST /api/flights/:flightId/notices/:id/retry.
import { Router, type Request } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { flightForUser } from '../flights/flight-desk.service';
import { listFlightNotices, requeueFailedNotice } from './outbox.service';
import { notifyOutbox } from './outbox-signal';

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
    notifyOutbox();
    res.json(message);
  });

  return r;
}
