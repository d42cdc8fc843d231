// Involuntary denied boarding: priority rules, the ranking, proposals, the supervisor's authorization, rebooking
// and the written statement. Routes parse, authorize and present; the services own the transactions.
import { Router, type Request } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { DENIAL_DESK_ROLES, idParamSchema } from '@shared/schemas/common';
import { candidatesSinceQuerySchema } from '@shared/schemas/denial-candidates-patch';
import {
  authorizeDenialsBodySchema, changeDenialsBodySchema, priorityRulesBodySchema, proposeDenialsBodySchema, rebookDenialBodySchema, recordDenialAfterBodySchema,
  recordRefusalBodySchema, withdrawDenialsBodySchema,
} from '@shared/schemas/denials';
import { FlightEntity, StationEntity } from '../../db/entities';
import { notFound } from '../../http/errors';
import { canSeeStation, currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { flightForUser } from '../flights/flight-desk.service';
import { heldRankingsOf } from './candidates-held';
import { priorityRulesFor, presentPriorityRules, savePriorityRules } from './priority-rules.service';
import { presentProposals, waitingProposals } from './proposals.presenter';
import { authorizeDenials, changeDenials, proposeDenials, withdrawProposal } from './proposals.service';
import { rebookDenial } from './rebook.service';
import { recordDenialAfter } from './recorded.service';
import { recordRefusal, refusalsOf } from './refusals.service';
import { statementPageFor } from './statement-page.service';

export interface DenialDeps {
  db: DataSource;
}

const flightParams = z.object({ flightId: z.coerce.number().int('flightId must be a whole number').positive('flightId must be positive') });
const stationParams = z.object({ stationId: z.coerce.number().int('stationId must be a whole number').positive('stationId must be positive') });
const statementQuery = z.object({ passengerId: z.coerce.number().int('passengerId must be a whole number').positive('passengerId must be positive').optional() });
const desk = requireRole(...DENIAL_DESK_ROLES);
const supervisors = requireRole('supervisor', 'admin');

export function denialsRouter(deps: DenialDeps) {
  const r = Router();
  const flightOf = (req: Request) => flightForUser(deps.db, currentUser(req), parse(flightParams, req.params, 'params').flightId);
  const stationOf = (req: Request) => {
    const { stationId } = parse(stationParams, req.params, 'params');
    if (!canSeeStation(currentUser(req), stationId)) throw notFound('Station');
    return stationId;
  };
  const regimeOf = async (stationId: number) => (await deps.db.getRepository(StationEntity).findOneByOrFail({ id: stationId })).regime;
  const proposalOf = async (flightId: number, proposalId: number) => {
    const flight = await deps.db.getRepository(FlightEntity).findOneByOrFail({ id: flightId });
    return (await presentProposals(deps.db, flight)).proposals.find((p) => p.id === proposalId)!;
  };

  r.get('/stations/:stationId/priority-rules', desk, async (req, res) => {
    const stationId = stationOf(req);
    res.json(presentPriorityRules(stationId, await priorityRulesFor(deps.db, stationId), await regimeOf(stationId)));
  });

  r.put('/stations/:stationId/priority-rules', requireRole('admin'), async (req, res) => {
    const stationId = stationOf(req);
    const body = parse(priorityRulesBodySchema, req.body);
    const saved = await savePriorityRules(deps.db, currentUser(req), stationId, body);
    res.json(presentPriorityRules(stationId, saved, await regimeOf(stationId)));
  });

  r.get('/stations/:stationId/denial-proposals', supervisors, async (req, res) => {
    res.json({ proposals: await waitingProposals(deps.db, stationOf(req)) });
  });

  // One ranking per state of the flight, held in memory: its tag is the ETag, and a console naming the tag it holds
  // (`since`) gets only what changed.
  r.get('/flights/:flightId/denial-candidates', desk, async (req, res) => {
    const { flightId } = parse(flightParams, req.params, 'params');
    const { since } = parse(candidatesSinceQuerySchema, req.query, 'query');
    const rankings = heldRankingsOf(deps.db);
    const held = await rankings.current(currentUser(req), flightId);
    res.set('Cache-Control', 'private, no-cache');
    if (since === undefined) {
      const etag = `"${held.ranking.tag}"`;
      res.set('ETag', etag);
      if (req.get('if-none-match') === etag) {
        res.status(304).end();
        return;
      }
    }
    res.type('application/json').send(rankings.answer(held, since));
  });

  r.get('/flights/:flightId/denial-proposals', desk, async (req, res) => {
    res.json(await presentProposals(deps.db, await flightOf(req)));
  });

  r.post('/flights/:flightId/denial-proposals', requireRole('agent', 'supervisor'), async (req, res) => {
    const flight = await flightOf(req);
    const body = parse(proposeDenialsBodySchema, req.body);
    const { proposal } = await proposeDenials(deps.db, currentUser(req), flight.id, body);
    res.status(201).json(await proposalOf(flight.id, proposal.id));
  });

  // Authorizing an involuntary denial is a supervisor's act; an admin manages the station but does not authorize.
  r.post('/denial-proposals/:id/authorize', requireRole('supervisor'), async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    const body = parse(authorizeDenialsBodySchema, req.body);
    const { proposal } = await authorizeDenials(deps.db, currentUser(req), id, body.denialIds);
    res.json(await proposalOf(proposal.flightId, proposal.id));
  });

  r.post('/denial-proposals/:id/change', supervisors, async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    const body = parse(changeDenialsBodySchema, req.body);
    const { proposal } = await changeDenials(deps.db, currentUser(req), id, body);
    res.json(await proposalOf(proposal.flightId, proposal.id));
  });

  r.post('/denial-proposals/:id/withdraw', desk, async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    const { reason } = parse(withdrawDenialsBodySchema, req.body);
    const { proposal } = await withdrawProposal(deps.db, currentUser(req), id, reason);
    res.json(await proposalOf(proposal.flightId, proposal.id));
  });

  // A correction after the fact: the supervisor records a denial with its real date and time and a reason.
  r.post('/flights/:flightId/denials/recorded', requireRole('supervisor'), async (req, res) => {
    const flight = await flightOf(req);
    const body = parse(recordDenialAfterBodySchema, req.body);
    const { proposal } = await recordDenialAfter(deps.db, currentUser(req), flight.id, body);
    res.status(201).json(await proposalOf(flight.id, proposal.id));
  });

  r.get('/flights/:flightId/boarding-refusals', desk, async (req, res) => {
    res.json({ refusals: await refusalsOf(deps.db, await flightOf(req)) });
  });

  // Refusal of carriage for safety, security, health or conduct: its own outcome, not a denial, no compensation.
  r.post('/flights/:flightId/boarding-refusals', requireRole('agent', 'supervisor'), async (req, res) => {
    const flight = await flightOf(req);
    const body = parse(recordRefusalBodySchema, req.body);
    const { refusal } = await recordRefusal(deps.db, currentUser(req), flight.id, body);
    res.status(201).json((await refusalsOf(deps.db, flight)).find((r) => r.id === refusal.id)!);
  });

  r.post('/denials/:id/rebook', desk, async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    const body = parse(rebookDenialBodySchema, req.body);
    const { denial, flight } = await rebookDenial(deps.db, currentUser(req), id, body);
    const proposal = await proposalOf(flight.id, denial.proposalId);
    res.json({ denial: proposal.denials.find((d) => d.id === denial.id)! });
  });

  r.get('/denials/:id/statement', desk, async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    const { passengerId } = parse(statementQuery, req.query, 'query');
    // Built before the content type is set, so a refusal still answers as JSON.
    const page = await statementPageFor(deps.db, currentUser(req), id, passengerId);
    res.type('html').send(page);
  });

  return r;
}
