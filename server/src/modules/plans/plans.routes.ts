import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { listPlansQuerySchema, savePlanBodySchema } from '@shared/schemas/plans';
import { currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { listPlans, savePlan } from './plans.service';

/** Saved booking-limit plans: planning is for supervisors and admins, within their own stations. */
export function plansRouter(deps: { db: DataSource }) {
  const r = Router();
  r.use(requireRole('admin', 'supervisor'));

  r.get('/', async (req, res) => {
    const query = parse(listPlansQuerySchema, req.query, 'query');
    res.json({ plans: await listPlans(deps.db, currentUser(req), query) });
  });

  r.post('/', async (req, res) => {
    const body = parse(savePlanBodySchema, req.body);
    res.status(201).json(await savePlan(deps.db, currentUser(req), body));
  });

  return r;
}
