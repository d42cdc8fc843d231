import { Router } from 'express';
import { In, type DataSource } from 'typeorm';
import { z } from 'zod';
import type { Station } from '@shared/schemas/stations';
import { stationCreateBodySchema, stationUpdateBodySchema } from '@shared/schemas/admin-stations';
import { iataAirportSchema, idParamSchema } from '@shared/schemas/common';
import { StationEntity } from '../../db/entities';
import { ANY_SIGNED_IN, currentUser, requireRole } from '../../http/require-role';
import { parse } from '../../http/validate';
import { createStation, listStationSettings, lookupAirport, updateStation } from './stations-admin.service';

export function presentStation(s: StationEntity): Station {
  return { id: s.id, iata: s.iata, name: s.name, timeZone: s.timeZone, regime: s.regime, currency: s.currency, riskTolerance: s.riskToleranceBp / 10_000 };
}

const airportParams = z.object({ iata: z.string().toUpperCase().pipe(iataAirportSchema) });

export function stationsRouter(deps: { db: DataSource }) {
  const r = Router();
  r.get('/', requireRole(...ANY_SIGNED_IN), async (req, res) => {
    const ids = currentUser(req).stations.map((s) => s.id);
    const stations = ids.length ? await deps.db.getRepository(StationEntity).find({ where: { id: In(ids) }, order: { iata: 'ASC' } }) : [];
    res.json({ stations: stations.map(presentStation) });
  });
  // Admin: every setting of the admin's stations, opening a station, changing one.
  r.get('/settings', requireRole('admin'), async (req, res) => {
    res.json(await listStationSettings(deps.db, currentUser(req)));
  });
  r.get('/airports/:iata', requireRole('admin'), (req, res) => {
    res.json(lookupAirport(parse(airportParams, req.params, 'params').iata));
  });
  r.post('/', requireRole('admin'), async (req, res) => {
    res.status(201).json(await createStation(deps.db, currentUser(req), parse(stationCreateBodySchema, req.body)));
  });
  r.patch('/:id', requireRole('admin'), async (req, res) => {
    const { id } = parse(idParamSchema, req.params, 'params');
    res.json(await updateStation(deps.db, currentUser(req), id, parse(stationUpdateBodySchema, req.body)));
  });
  return r;
}
