// Weekly schedules of a station: list, create (generating its flights), edit, cancel. Admins of the station only.
import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { scheduleCreateBodySchema, scheduleUpdateBodySchema } from '@shared/schemas/admin-flights';
import { idParamSchema } from '@shared/schemas/common';
import { currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { stationForUser } from '../flights/admin-flights.service';
import { cancelSchedule, createSchedule, listSchedules, updateSchedule } from './schedules.service';

const stationParams = z.object({ stationId: z.coerce.number({ error: 'stationId must be a number' }).int('stationId must be a whole number').positive('stationId must be positive') });

export function schedulesRouter(deps: { db: DataSource }) {
  const r = Router();
  r.get('/stations/:stationId/schedules', requireRole('admin'), async (req, res) => {
    const station = await stationForUser(deps.db, currentUser(req), parse(stationParams, req.params, 'params').stationId);
    res.json(await listSchedules(deps.db, station));
  });
  r.post('/stations/:stationId/schedules', requireRole('admin'), async (req, res) => {
    const station = await stationForUser(deps.db, currentUser(req), parse(stationParams, req.params, 'params').stationId);
    const body = parse(scheduleCreateBodySchema, req.body);
    res.status(201).json(await createSchedule(deps.db, currentUser(req), station, body));
  });
  r.patch('/schedules/:id', requireRole('admin'), async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json(await updateSchedule(deps.db, currentUser(req), id, parse(scheduleUpdateBodySchema, req.body)));
  });
  r.post('/schedules/:id/cancel', requireRole('admin'), async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json(await cancelSchedule(deps.db, currentUser(req), id));
  });
  return r;
}
