import { Router, type Request } from 'express';
import { z } from 'zod';
import type { DataSource } from 'typeorm';
import { idParamSchema } from '@shared/schemas/common';
import { addVolunteerBodySchema, openRoundBodySchema, raiseOfferBodySchema, rebookBodySchema, volunteerPolicySchema } from '@shared/schemas/volunteers';
import { PassengerEntity, StationEntity, VolunteerPolicyEntity } from '../../db/entities';
import { badRequest, notFound } from '../../http/errors';
import { canSeeStation, currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { audit } from '../audit/audit.service';
import { flightForUser } from '../flights/flight-desk.service';
import { acceptVolunteer, declineVolunteer } from './accept.service';
import { flightToken } from './bid-link';
import { policyFor } from './policy.service';
import { alternatesFor, rebookVolunteer } from './rebooking.service';
import { presentRounds } from './rounds.presenter';
import { addVolunteer, closeRound, openRound, raiseOffer, roundForUser } from './rounds.service';

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
    const v = await deps.db.transaction(async (em) => {
      const round = await roundForUser(em, user, id, true);
      const first = await em.findOneBy(PassengerEntity, { id: body.passengerIds[0], flightId: round.flightId });
      if (!first) throw badRequest('passengerIds: must be passengers of this flight', [{ field: 'passengerIds', rule: 'must be passengers of this flight' }]);
      return addVolunteer(em, round, first.bookingId, body.passengerIds, body.askMinor ?? null, 'agent', user);
    });
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
    const station = await deps.db.getRepository(StationEntity).findOneByOrFail({ id: stationId });
    // Rounds and compensations take the policy's currency; one the station does not pay in would reach finance unreconciled.
    if (policy.currency !== station.currency) throw badRequest(`currency: must be the station's currency, ${station.currency}`, [{ field: 'currency', rule: `must be the station's currency, ${station.currency}` }]);
    await deps.db.transaction(async (em) => {
      const before = await policyFor(em, stationId);
      await em.upsert(VolunteerPolicyEntity, { stationId, policy }, ['stationId']);
      await audit(em, { actor: user, action: 'volunteer_policy.updated', entityType: 'station', entityId: stationId, stationId, before, after: policy });
    });
    res.json(policy);
  });

  return r;
}
