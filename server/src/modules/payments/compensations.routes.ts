// The compensation money routes. Agents choose the medium, record the passenger's agreement to a card or credit, pay
// at the counter or issue through the provider; finance voids; either re-issues a payment that was lost. Supervisors and admins do not touch money.
import { Router, type Request } from 'express';
import { z } from 'zod';
import { idParamSchema } from '@shared/schemas/common';
import { reissueBodySchema, voidBodySchema } from '@shared/schemas/finance';
import { actualArrivalBodySchema, agreementBodySchema, counterPaymentBodySchema, mediumBodySchema } from '@shared/schemas/payment-media';
import { currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { flightForUser } from '../flights/flight-desk.service';
import { issueCompensation, reissueCompensation, voidCompensation } from './compensation-actions';
import { compensationRow, compensationRows, presentCompensation } from './compensation-view';
import type { Issuer } from './issuer';
import type { PaymentsContext } from './payments-context';
import { offerVoucher, paymentInfoFor } from './voucher.service';
import { chooseMedium, recordDeskAgreement } from '../agreements/agreement.service';
import { payAtCounter, receiptFor } from '../counter-payments/counter-payment.service';
import { recordActualArrival } from '../compensations/top-up';
import { sendNewLink } from '../payouts/link-resend';

const flightParams = z.object({ flightId: z.coerce.number().int().positive('flightId must be positive') });
const agent = requireRole('agent');
const finance = requireRole('finance');

export function compensationsRouter(ctx: PaymentsContext, issuer: Issuer) {
  const r = Router();
  const idOf = (req: Request) => parse(idParamSchema, req.params, 'params').id;
  const answer = async (id: number) => ({ compensation: presentCompensation(await compensationRow(ctx.db, id)) });

  r.get('/flights/:flightId/compensations', agent, async (req, res) => {
    const flight = await flightForUser(ctx.db, currentUser(req), parse(flightParams, req.params, 'params').flightId);
    const rows = await compensationRows(ctx.db, 'c.flight_id = ?', [flight.id], 'ORDER BY p.last_name, p.first_name, c.id');
    const info = await paymentInfoFor(ctx.db, rows);
    res.json({ compensations: rows.map((row) => ({ ...presentCompensation(row), ...info.get(row.id)! })) });
  });

  r.post('/compensations/:id/issue', agent, async (req, res) => {
    const id = idOf(req);
    await issueCompensation(ctx, issuer, currentUser(req), id);
    res.json(await answer(id));
  });

  r.post('/compensations/:id/voucher-offer', agent, async (req, res) => {
    const offer = await offerVoucher(ctx.db, currentUser(req), idOf(req));
    res.json({ offer });
  });

  r.post('/compensations/:id/medium', agent, async (req, res) => {
    const id = idOf(req);
    await chooseMedium(ctx.db, currentUser(req), id, parse(mediumBodySchema, req.body).medium);
    res.json(await answer(id));
  });

  r.post('/compensations/:id/agreement', agent, async (req, res) => {
    const id = idOf(req);
    await recordDeskAgreement(ctx.db, currentUser(req), id, parse(agreementBodySchema, req.body));
    res.json(await answer(id));
  });

  r.post('/compensations/:id/counter-payment', agent, async (req, res) => {
    const id = idOf(req);
    await payAtCounter(ctx.db, currentUser(req), id, parse(counterPaymentBodySchema, req.body));
    res.json(await answer(id));
  });

  // Canada: the real arrival decides whether a top-up is owed; the answer is the top-up, or null when none is.
  r.post('/compensations/:id/actual-arrival', agent, async (req, res) => {
    const id = idOf(req);
    const top = await recordActualArrival(ctx.db, currentUser(req), id, parse(actualArrivalBodySchema, req.body).arrivalDelayMinutes);
    res.json({ topUp: top ? presentCompensation(await compensationRow(ctx.db, top.id)) : null });
  });

  // A fresh payout or card-details link for the passenger; every older live link of that kind stops working.
  r.post('/compensations/:id/new-link', agent, async (req, res) => {
    const id = idOf(req);
    const link = await sendNewLink(ctx, currentUser(req), id);
    res.json({ link: { purpose: link.purpose, expiresAt: link.expiresAt }, ...(await answer(id)) });
  });

  r.get('/compensations/:id/receipt', requireRole('agent', 'finance'), async (req, res) => {
    res.json({ receipt: await receiptFor(ctx.db, currentUser(req), idOf(req)) });
  });

  r.post('/compensations/:id/void', finance, async (req, res) => {
    const id = idOf(req);
    const { reason } = parse(voidBodySchema, req.body);
    await voidCompensation(ctx, currentUser(req), id, reason);
    res.json(await answer(id));
  });

  // The passenger is owed whatever became of the payment: the desk may re-issue as finance may, with a reason.
  r.post('/compensations/:id/reissue', requireRole('agent', 'finance'), async (req, res) => {
    const id = idOf(req);
    const { reason } = parse(reissueBodySchema, req.body);
    await reissueCompensation(ctx, issuer, currentUser(req), id, reason);
    res.json(await answer(id));
  });

  return r;
}
