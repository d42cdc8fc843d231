// The audit viewer: a station's audit rows, filtered and paged, and the same filter as CSV. Admins of the station.
import { Router, type Request } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { auditQuerySchema } from '@shared/schemas/audit-log';
import { canSeeStation, currentUser, requireRole } from '../../http/require-role';
import { notFound } from '../../http/errors';
import { parse } from '../../http/validate';
import { auditCsv, auditPage } from './audit-query.service';

const stationParams = z.object({ stationId: z.coerce.number({ error: 'stationId must be a number' }).int('stationId must be a whole number').positive('stationId must be positive') });

export function auditRouter(deps: { db: DataSource }) {
  const r = Router();
  const station = (req: Request) => {
    const { stationId } = parse(stationParams, req.params, 'params');
    if (!canSeeStation(currentUser(req), stationId)) throw notFound('Station');
    return stationId;
  };
  r.get('/stations/:stationId/audit', requireRole('admin'), async (req, res) => {
    const stationId = station(req);
    res.json(await auditPage(deps.db, stationId, parse(auditQuerySchema, req.query, 'query')));
  });
  r.get('/stations/:stationId/audit.csv', requireRole('admin'), async (req, res) => {
    const stationId = station(req);
    const csv = await auditCsv(deps.db, stationId, parse(auditQuerySchema, req.query, 'query'));
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="bumpboard-audit-station-${stationId}.csv"`);
    res.send(csv);
  });
  return r;
}
