// The passenger's payment pages' API, with no session: a single-use link's token and the booking proof instead.
// Tokens travel in the JSON body, never in the URL, so no access log, proxy or error line records one. Bodies
// that do not parse are refused without echoing them (Node's JSON errors quote the text, which may hold an
// account number). Answers are never cached: a shown card number must not stay in any cache.
import express, { Router, type ErrorRequestHandler } from 'express';
import { z } from 'zod';
import { bookingProofSchema, payoutDetailsBodySchema } from '@shared/schemas/payouts';
import { badRequest } from '../../http/errors';
import { parse } from '../../http/validate';
import type { Issuer } from '../payments/issuer';
import type { PaymentsContext } from '../payments/payments-context';
import { cardLinkStatus, revealCardDetails } from './card-details.service';
import { payoutLinkStatus, submitPayoutDetails } from './payout.service';

const tokenSchema = z.object({ token: z.string({ error: 'token is required' }).min(20, 'token must be the whole link').max(100, 'token must be the whole link') });

const unreadableBody: ErrorRequestHandler = (error: { type?: string }, _req, _res, next) => {
  if (error?.type === 'entity.parse.failed') return next(badRequest('body: must be JSON', [{ field: 'body', rule: 'must be JSON' }]));
  next(error);
};

export function passengerPaymentsRouter(ctx: PaymentsContext, issuer: Issuer) {
  const r = Router();
  r.use(express.json({ limit: '8kb' }), unreadableBody);
  r.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });

  r.post('/card-details/status', async (req, res) => {
    const { token } = parse(tokenSchema, req.body);
    res.json(await cardLinkStatus(ctx, token));
  });
  r.post('/card-details/reveal', async (req, res) => {
    const { token } = parse(tokenSchema, req.body);
    const proof = parse(bookingProofSchema, req.body);
    res.json(await revealCardDetails(ctx, token, proof));
  });

  r.post('/payout/status', async (req, res) => {
    const { token } = parse(tokenSchema, req.body);
    res.json(await payoutLinkStatus(ctx, token));
  });
  r.post('/payout/account', async (req, res) => {
    const { token } = parse(tokenSchema, req.body);
    const body = parse(payoutDetailsBodySchema, req.body);
    const accepted = await submitPayoutDetails(ctx, token, { pnr: body.pnr, lastName: body.lastName }, body);
    // The transfer goes out now if the provider answers; otherwise the worker sends it on its next pass.
    void issuer.attempt(accepted.compensationId);
    res.json({ accountEnding: accepted.accountEnding, state: 'ready' });
  });
  return r;
}
