import express, { Router } from 'express';
import type { DataSource } from 'typeorm';
import { eventBatchSchema } from '@shared/schemas/integration-events';
import { parse } from '../../http/validate';
import { applyFeedEvents } from './feed-line';
import { requireStationForKey } from './integration-keys.service';

/**
 * The departure-control feed: authenticated by a per-station API key (Bearer), not by a session, so it sits outside
 * the session and CSRF middleware. Answers 200 with one result per event.
 */
export function integrationEventsRouter(deps: { db: DataSource }) {
  const r = Router();
  r.use(express.json({ limit: '2mb' }));
  r.post('/events', async (req, res) => {
    const presented = /^Bearer (.+)$/.exec(req.get('authorization') ?? '')?.[1];
    const key = await requireStationForKey(deps.db, presented);
    const { events } = parse(eventBatchSchema, req.body);
    const { results } = await applyFeedEvents(deps.db, key.stationId, events);
    res.json({ results, applied: results.filter((x) => x.status === 'applied').length, rejected: results.filter((x) => x.status === 'rejected').length });
  });
  return r;
}
