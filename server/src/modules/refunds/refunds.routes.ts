// The refunds the rules add to compensation, listed on the desk (agents and supervisors) within their stations. They
// are paid from the desk's compensation list, where each has its own payment row.
import { Router } from 'express';
import { z } from 'zod';
import type { DataSource } from 'typeorm';
import { currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { flightForUser } from '../flights/flight-desk.service';
import { listRefunds } from './refunds.service';

const flightParams = z.object({ flightId: z.coerce.number({ error: 'flightId must be a number' }).int().positive('flightId must be positive') });

export function refundsRouter(deps: { db: DataSource }) {
  const r = Router();
  r.get('/flights/:flightId/refunds', requireRole('agent', 'supervisor'), async (req, res) => {
    const flight = await flightForUser(deps.db, currentUser(req), parse(flightParams, req.params, 'params').flightId);
    res.json({ refunds: await listRefunds(deps.db, flight) });
  });
  return r;
}
