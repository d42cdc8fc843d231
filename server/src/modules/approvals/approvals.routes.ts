import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { idParamSchema } from '@shared/schemas/common';
import { approvalsQuerySchema, decideApprovalBodySchema } from '@shared/schemas/approvals';
import { currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { decideApproval, pendingApprovals } from './approvals.service';

export interface ApprovalDeps {
  db: DataSource;
}

/** Admins may look at the queue; only a supervisor decides. */
export function approvalsRouter(deps: ApprovalDeps) {
  const r = Router();

  r.get('/approvals', requireRole('supervisor', 'admin'), async (req, res) => {
    const { stationId } = parse(approvalsQuerySchema, req.query, 'query');
    res.json({ approvals: await pendingApprovals(deps.db, currentUser(req), stationId) });
  });

  r.post('/approvals/:id', requireRole('supervisor'), async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    const body = parse(decideApprovalBodySchema, req.body);
    const { approval, round } = await decideApproval(deps.db, currentUser(req), id, body.approve, body.reason);
    res.json({ id: approval.id, status: approval.status, offerMinor: round?.offerMinor ?? null });
  });

  return r;
}
