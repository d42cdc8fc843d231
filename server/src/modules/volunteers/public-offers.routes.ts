// "Offer your seat": the passenger's page, reached from a signed link or QR code at the gate, with no sign-in.
// The rules (the link, the throttled booking match, the open round) live in public-offers.service.ts.
import express, { Router } from 'express';
import { identifyBodySchema, passengerBidBodySchema } from '@shared/schemas/volunteers';
import { parse } from '../../http/validate';
import { publicOffers, type PublicOffersDeps } from './public-offers.service';

export function publicOffersRouter(deps: PublicOffersDeps) {
  const r = Router();
  r.use(express.json({ limit: '16kb' }));
  const offers = publicOffers(deps);

  r.get('/offers/:token', async (req, res) => {
    res.json(await offers.page(await offers.open(req.params.token)));
  });

  r.post('/offers/:token/identify', async (req, res) => {
    const link = await offers.open(req.params.token);
    res.json(await offers.identify(link, parse(identifyBodySchema, req.body)));
  });

  r.post('/offers/:token/bids', async (req, res) => {
    const link = await offers.open(req.params.token);
    const v = await offers.offerSeat(link, parse(passengerBidBodySchema, req.body));
    res.status(201).json({ status: v.status });
  });

  r.get('/offers/:token/status', async (req, res) => {
    const link = await offers.open(req.params.token);
    res.json(await offers.status(link, String(req.query.passengerToken ?? '')));
  });

  return r;
}
