import { Router } from 'express';
import { In, type DataSource } from 'typeorm';
import type { Station } from '@shared/schemas/stations';
import { StationEntity } from '../../db/entities';
import { ANY_SIGNED_IN, currentUser, requireRole } from '../../http/require-role';

export function presentStation(s: StationEntity): Station {
  return { id: s.id, iata: s.iata, name: s.name, timeZone: s.timeZone, regime: s.regime, currency: s.currency, riskTolerance: s.riskToleranceBp / 10_000 };
}

export function stationsRouter(deps: { db: DataSource }) {
  const r = Router();
  r.get('/', requireRole(...ANY_SIGNED_IN), async (req, res) => {
    const ids = currentUser(req).stations.map((s) => s.id);
    const stations = ids.length ? await deps.db.getRepository(StationEntity).find({ where: { id: In(ids) }, order: { iata: 'ASC' } }) : [];
    res.json({ stations: stations.map(presentStation) });
  });
  return r;
}
