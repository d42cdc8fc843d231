import { Router } from 'express';
import type { DataSource } from 'typeorm';

export function healthRouter(deps: { db: DataSource }) {
  const r = Router();
  // Public: load balancers and the start script ask whether the app and its database answer.
  r.get('/', async (_req, res) => {
    let database: 'up' | 'down' = 'down';
    try {
      await deps.db.query('SELECT 1');
      database = 'up';
    } catch {
      database = 'down';
    }
    res.status(database === 'up' ? 200 : 503).json({ status: database === 'up' ? 'ok' : 'degraded', database, uptimeSeconds: Math.round(process.uptime()) });
  });
  return r;
}
