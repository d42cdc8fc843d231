// Care and the passenger's choice: the desk records them per compensation; admins set the station's allowances and
// hotels; finance reads the care costs. Station scope answers "not found" for another station's object.
import { Router } from 'express';
import { z } from 'zod';
import type { DataSource } from 'typeorm';
import { careLedgerQuerySchema, careSetupBodySchema, recordCareBodySchema, recordChoiceBodySchema } from '@shared/schemas/care';
import { idParamSchema } from '@shared/schemas/common';
import { currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { flightForUser } from '../flights/flight-desk.service';
import { careLedger, careLedgerCsv } from './care-ledger';
import { queueCareMail } from './care-mail';
import { readCareSetup, saveCareSetup } from './care-setup.service';
import { flightCare, recordCare, recordChoice } from './care.service';

const flightParams = z.object({ flightId: z.coerce.number({ error: 'flightId must be a number' }).int('flightId must be a whole number').positive('flightId must be positive') });
const stationParams = z.object({ stationId: z.coerce.number({ error: 'stationId must be a number' }).int('stationId must be a whole number').positive('stationId must be positive') });

export function careRouter(deps: { db: DataSource }) {
  const r = Router();
  const desk = requireRole('agent', 'supervisor');

  r.get('/flights/:flightId/care', desk, async (req, res) => {
    const flight = await flightForUser(deps.db, currentUser(req), parse(flightParams, req.params, 'params').flightId);
    res.json(await flightCare(deps.db, flight));
  });

  r.post('/compensations/:id/choice', desk, async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    const body = parse(recordChoiceBodySchema, req.body);
    const done = await recordChoice(deps.db, currentUser(req), id, body);
    res.status(201).json({ choice: { id: done.choice.id, kind: done.choice.kind } });
  });

  r.post('/compensations/:id/care', desk, async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    const body = parse(recordCareBodySchema, req.body);
    const done = await recordCare(deps.db, currentUser(req), id, body);
    res.status(201).json({ given: done.given });
  });

  // Mails the passenger what was recorded: the updated written statement, or a volunteer's summary.
  r.post('/compensations/:id/care-mail', desk, async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    const done = await queueCareMail(deps.db, currentUser(req), id);
    // 200 either way: asking again for the same text finds the mail already queued and queues nothing.
    res.json({ messageId: done.messageId, created: done.created, kind: done.kind });
  });

  r.get('/stations/:stationId/care-setup', requireRole('admin'), async (req, res) => {
    res.json({ setup: await readCareSetup(deps.db, currentUser(req), parse(stationParams, req.params, 'params').stationId) });
  });

  r.put('/stations/:stationId/care-setup', requireRole('admin'), async (req, res) => {
    const { stationId } = parse(stationParams, req.params, 'params');
    res.json({ setup: await saveCareSetup(deps.db, currentUser(req), stationId, parse(careSetupBodySchema, req.body)) });
  });

  r.get('/care/ledger', requireRole('finance'), async (req, res) => {
    res.json(await careLedger(deps.db, currentUser(req), parse(careLedgerQuerySchema, req.query, 'query')));
  });

  r.get('/care/ledger.csv', requireRole('finance'), async (req, res) => {
    const csv = await careLedgerCsv(deps.db, currentUser(req), parse(careLedgerQuerySchema, req.query, 'query'));
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="care-costs-${new Date().toISOString().slice(0, 10)}.csv"`);
    res.send(csv);
  });

  return r;
}
