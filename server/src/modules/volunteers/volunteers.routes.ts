import { Router, type Request } from 'express';
import { z } from 'zod';
import type { DataSource } from 'typeorm';
import { idParamSchema } from '@shared/schemas/common';
import { addVolunteerBodySchema, openRoundBodySchema, raiseOfferBodySchema, rebookBodySchema, volunteerPolicySchema } from '@shared/schemas/volunteers';
import { notFound } from '../../http/errors';
import { canSeeStation, currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { flightForUser } from '../flights/flight-desk.service';
import { acceptVolunteer, declineVolunteer } from './accept.service';
import { flightToken } from './bid-link';
import { policyFor, savePolicy } from './policy.service';
import { alternatesFor, rebookVolunteer } from './rebooking.service';
import { presentRounds } from './rounds.presenter';
import { addVolunteerAtDesk, closeRound, openRound, raiseOffer } from './rounds.service';

export interface VolunteerDeps {
  db: DataSource;
  secret: string;
  appBaseUrl: string;
}

const flightParams = z.object({ flightId: z.coerce.number().int().positive('flightId must be positive') });
const volunteerParams = z.object({ id: z.coerce.number().int().positive(), volunteerId: z.coerce.number().int().positive('volunteerId must be positive') });
const stationParams = z.object({ stationId: z.coerce.number().int().positive('stationId must be positive') });
const desk = requireRole('agent', 'supervisor', 'admin');

export function volunteersRouter(deps: VolunteerDeps) {
  const r = Router();
  const flightOf = (req: Request) => flightForUser(deps.db, currentUser(req), parse(flightParams, req.params, 'params').flightId);
  const roundsOf = async (flightId: number, stationId: number) => ({ rounds: await presentRounds(deps.db, flightId), policy: await policyFor(deps.db, stationId) });

  r.get('/flights/:flightId/rounds', desk, async (req, res) => {
    const flight = await flightOf(req);
    res.json({ ...(await roundsOf(flight.id, flight.stationId)), bidLink: `${deps.appBaseUrl}/offer/${flightToken(deps.secret, flight.id, flight.scheduledDeparture)}` });
  });

  r.post('/flights/:flightId/rounds', desk, async (req, res) => {
    const flight = await flightOf(req);
    const body = parse(openRoundBodySchema, req.body);
    const { round, approvalRequested } = await openRound(deps.db, currentUser(req), flight, body);
    res.status(201).json({ id: round.id, approvalRequested });
  });

  r.get('/flights/:flightId/alternates', desk, async (req, res) => {
    res.json({ alternates: await alternatesFor(deps.db, await flightOf(req)) });
  });

  r.post('/rounds/:id/raise', desk, async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    const { offerMinor } = parse(raiseOfferBodySchema, req.body);
    const { approvalRequested } = await raiseOffer(deps.db, currentUser(req), id, offerMinor);
    res.json({ approvalRequested });
  });

  r.post('/rounds/:id/close', desk, async (req, res) => {
    const round = await closeRound(deps.db, currentUser(req), parse(idParamSchema, req.params, 'params').id);
    res.json({ status: round.status });
  });

  r.post('/rounds/:id/volunteers', desk, async (req, res) => {
    const user = currentUser(req);
    const { id } = parse(idParamSchema, req.params, 'params');
    const body = parse(addVolunteerBodySchema, req.body);
    const v = await addVolunteerAtDesk(deps.db, user, id, body.passengerIds, body.askMinor ?? null);
    res.status(201).json({ id: v.id });
  });

  r.post('/rounds/:id/volunteers/:volunteerId/accept', desk, async (req, res) => {
    const { id, volunteerId } = parse(volunteerParams, req.params, 'params');
    const { approvalRequested } = await acceptVolunteer(deps.db, currentUser(req), id, volunteerId);
    if (approvalRequested) res.status(202).json({ status: 'awaiting-approval' });
    else res.json({ status: 'accepted' });
  });

  r.post('/rounds/:id/volunteers/:volunteerId/decline', desk, async (req, res) => {
    const { id, volunteerId } = parse(volunteerParams, req.params, 'params');
    await declineVolunteer(deps.db, currentUser(req), id, volunteerId);
    res.json({ status: 'declined' });
  });

  r.post('/volunteers/:id/rebook', desk, async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    const choice = parse(rebookBodySchema, req.body);
    const { rebooking } = await rebookVolunteer(deps.db, currentUser(req), id, choice);
    res.json({ plannedArrivalDelayMinutes: rebooking.plannedArrivalDelayMinutes, label: rebooking.label });
  });

  r.get('/stations/:stationId/volunteer-policy', desk, async (req, res) => {
    const { stationId } = parse(stationParams, req.params, 'params');
    if (!canSeeStation(currentUser(req), stationId)) throw notFound('Station');
    res.json(await policyFor(deps.db, stationId));
  });

  r.put('/stations/:stationId/volunteer-policy', requireRole('admin'), async (req, res) => {
    const user = currentUser(req);
    const { stationId } = parse(stationParams, req.params, 'params');
    if (!canSeeStation(user, stationId)) throw notFound('Station');
    const policy = parse(volunteerPolicySchema, req.body);
    await savePolicy(deps.db, user, stationId, policy);
    res.json(policy);
  });

  return r;
}
