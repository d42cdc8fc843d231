// Alerts for everyone at a station and for finance: listed within the user's stations, acknowledged by anyone there.
import { Router } from 'express';
import { alertQuerySchema } from '@shared/schemas/alerts';
import { idParamSchema } from '@shared/schemas/common';
import type { DataSource } from 'typeorm';
import { ANY_SIGNED_IN, currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { acknowledgeAlert, listAlerts } from './alerts.service';

export function alertsRouter(deps: { db: DataSource }) {
  const r = Router();
  r.use(requireRole(...ANY_SIGNED_IN));

  r.get('/', async (req, res) => {
    res.json({ alerts: await listAlerts(deps.db, currentUser(req), parse(alertQuerySchema, req.query, 'query')) });
  });

  r.post('/:id/acknowledge', async (req, res) => {
    const alert = await acknowledgeAlert(deps.db, currentUser(req), parse(idParamSchema, req.params, 'params').id);
    res.json({ alert });
  });

  return r;
}
