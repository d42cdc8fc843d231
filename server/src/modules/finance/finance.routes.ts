// Finance's screens: the compensation ledger (and its CSV), reconciliation runs, and the period report. Finance only.
import { Router, type Response } from 'express';
import { z } from 'zod';
import { idParamSchema } from '@shared/schemas/common';
import { ledgerQuerySchema, reportQuerySchema, resolveDifferenceBodySchema, startReconciliationBodySchema } from '@shared/schemas/finance';
import type { DataSource } from 'typeorm';
import { currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { ledgerCsv, ledgerPage } from './ledger.service';
import { listRuns, presentRuns, resolveDifference, runDetail, type ReconciliationRunner } from './reconciliation.service';
import { periodReport, reportCsv } from './report.service';
import { stationScope } from './scope';
import { counterRegister } from './counter-register.service';
import { counterRegisterQuerySchema } from '@shared/schemas/payment-media';

export interface FinanceDeps {
  db: DataSource;
  reconciliation: ReconciliationRunner;
}

const differenceParams = z.object({
  id: z.coerce.number({ error: 'id must be a number' }).int().positive('id must be positive'),
  did: z.coerce.number({ error: 'did must be a number' }).int().positive('did must be positive'),
});

function sendCsv(res: Response, name: string, csv: string): void {
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
  res.send(csv);
}

export function financeRouter(deps: FinanceDeps) {
  const r = Router();
  r.use(requireRole('finance'));

  r.get('/compensations', async (req, res) => {
    res.json(await ledgerPage(deps.db, currentUser(req), parse(ledgerQuerySchema, req.query, 'query')));
  });

  r.get('/compensations.csv', async (req, res) => {
    const query = parse(ledgerQuerySchema, req.query, 'query');
    sendCsv(res, `compensations-${new Date().toISOString().slice(0, 10)}.csv`, await ledgerCsv(deps.db, currentUser(req), query));
  });

  r.get('/counter-register', async (req, res) => {
    res.json(await counterRegister(deps.db, currentUser(req), parse(counterRegisterQuerySchema, req.query, 'query')));
  });

  r.post('/reconciliations', async (req, res) => {
    const user = currentUser(req);
    const { stationId } = parse(startReconciliationBodySchema, req.body);
    const run = await deps.reconciliation.start(user, stationScope(user, stationId));
    const [present] = await presentRuns(deps.db, [run]);
    res.status(202).json({ run: present });
  });

  r.get('/reconciliations', async (req, res) => {
    res.json({ runs: await listRuns(deps.db, currentUser(req)) });
  });

  r.get('/reconciliations/:id', async (req, res) => {
    res.json(await runDetail(deps.db, currentUser(req), parse(idParamSchema, req.params, 'params').id));
  });

  r.post('/reconciliations/:id/differences/:did/resolve', async (req, res) => {
    const { id, did } = parse(differenceParams, req.params, 'params');
    const { note } = parse(resolveDifferenceBodySchema, req.body);
    res.json({ difference: await resolveDifference(deps.db, currentUser(req), id, did, note) });
  });

  r.get('/report', async (req, res) => {
    const { quarter, stationId } = parse(reportQuerySchema, req.query, 'query');
    res.json(await periodReport(deps.db, currentUser(req), quarter, stationId));
  });

  r.get('/report.csv', async (req, res) => {
    const { quarter, stationId } = parse(reportQuerySchema, req.query, 'query');
    const report = await periodReport(deps.db, currentUser(req), quarter, stationId);
    sendCsv(res, `report-${report.station.iata}-${quarter}.csv`, reportCsv(report));
  });

  return r;
}
