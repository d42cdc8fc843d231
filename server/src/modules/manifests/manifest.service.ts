import type { DataSource, EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { ManifestFlightPreview, ManifestImportResult, ManifestPreview, ManifestProblem } from '@shared/schemas/manifest';
import { FlightEntity, StationEntity } from '../../db/entities';
import { badRequest, DomainError } from '../../domain/errors';
import { forecastStale, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { applyFlightManifest, emptyCounts } from './manifest-apply';
import { bookingLimit, capacityOf, flightProblems, passengersIn } from './manifest-checks';
import { flightDiff } from './manifest-diff';
import { parseManifestCsv, type TemplateFlight } from './manifest-csv';
import { groupManifestRows, type ManifestFlightGroup } from './manifest-rows';

/** The refusal of an import with problems: rendered by the route with every problem and its line. */
export class ManifestRejectedError extends DomainError {
  constructor(readonly problems: ManifestProblem[]) {
    super('invalid', 'manifest_invalid', `The manifest has ${problems.length} problem${problems.length === 1 ? '' : 's'}; nothing was imported.`, problems.slice(0, 50).map((p) => ({ field: `line ${p.line}: ${p.field}`, rule: p.rule })));
  }
}

/** A manifest may not rewrite a flight that has left or was cancelled: compensation and finance rely on those records. */
const CLOSED_STATES = new Set(['departed', 'cancelled']);

interface Analysis {
  rows: number;
  problems: ManifestProblem[];
  station: StationEntity;
  flights: { group: ManifestFlightGroup; flight: FlightEntity | null }[];
}

const byLine = (a: ManifestProblem, b: ManifestProblem) => a.line - b.line;

/** Everything that can be known about the file without writing: the same checks for preview and for import. */
async function analyse(em: EntityManager, stationId: number, text: string, lock: boolean): Promise<Analysis> {
  const csv = parseManifestCsv(text);
  const grouped = groupManifestRows(csv.records);
  const problems = [...csv.problems, ...grouped.problems];
  const station = await em.findOneByOrFail(StationEntity, { id: stationId });
  const flights: Analysis['flights'] = [];

  for (const group of grouped.flights.values()) {
    const flight = await em.findOne(FlightEntity, {
      where: { stationId, carrierCode: group.carrier, flightNumber: group.number, serviceDate: group.date },
      ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}),
    });
    flights.push({ group, flight });
    const label = `${group.carrier}${group.number} on ${group.date}`;
    if (!flight) {
      for (const line of group.lines) problems.push({ line, field: 'flight_number', rule: `no flight ${label} departs from ${station.iata}` });
      continue;
    }
    if (CLOSED_STATES.has(flight.state)) {
      problems.push({ line: group.firstLine, field: 'flight_number', rule: `flight ${label} is ${flight.state}; its manifest can no longer change` });
    }
    const cabins = Object.keys(flight.seatsByCabin);
    for (const booking of group.bookings.values()) {
      for (const p of booking.passengers) {
        if (!cabins.includes(p.row.cabin)) problems.push({ line: p.line, field: 'cabin', rule: `flight ${label} has no cabin ${p.row.cabin} (its cabins: ${cabins.join(', ')})` });
      }
    }
    problems.push(...flightProblems(group, flight, station, label));
  }
  return { rows: csv.records.length, problems: problems.sort(byLine), station, flights };
}

export async function previewManifest(db: DataSource, stationId: number, text: string): Promise<ManifestPreview> {
  const a = await analyse(db.manager, stationId, text, false);
  const flights: ManifestFlightPreview[] = [];
  for (const { group, flight } of a.flights) {
    const diff = flight ? await flightDiff(db.manager, flight.id, group) : null;
    flights.push({
      carrier: group.carrier, number: group.number, date: group.date, found: Boolean(flight), bookings: group.bookings.size, passengers: passengersIn(group),
      willCancel: diff?.removed ?? 0, seats: flight ? capacityOf(flight) : null, bookingLimit: flight ? bookingLimit(flight, a.station) : null, diff,
    });
  }
  return { rows: a.rows, needsConfirmation: flights.some((f) => f.willCancel > 0), flights, errors: a.problems };
}

/** All or nothing: one transaction, and any problem (found again under the locks) rolls everything back. */
export async function importManifest(db: DataSource, stationId: number, text: string, actor: SessionUser, fileName: string, confirmRemovals: boolean): Promise<ManifestImportResult> {
  const now = new Date();
  return db.transaction(async (em) => {
    const a = await analyse(em, stationId, text, true);
    if (a.problems.length) throw new ManifestRejectedError(a.problems);
    if (!confirmRemovals) {
      // Counted under the locks, so a passenger added since the preview is not cancelled unconfirmed.
      const removing: string[] = [];
      for (const { group, flight } of a.flights) {
        if (!flight) continue;
        const diff = await flightDiff(em, flight.id, group);
        if (diff.removed > 0) removing.push(`${diff.removed} from ${group.carrier}${group.number} on ${group.date}`);
      }
      if (removing.length) {
        const rule = `must be true to import a file that cancels passengers (${removing.join('; ')}); preview the file to see who`;
        throw badRequest(`confirmRemovals: ${rule}`, [{ field: 'confirmRemovals', rule }]);
      }
    }
    const totals = emptyCounts();
    const flights: ManifestImportResult['flights'] = [];
    for (const { group, flight } of a.flights) {
      if (!flight) continue; // unreachable: a missing flight is a problem above
      const counts = await applyFlightManifest(em, flight, group, now);
      for (const k of Object.keys(totals) as (keyof typeof totals)[]) totals[k] += counts[k];
      flights.push({ flightId: flight.id, carrier: group.carrier, number: group.number, date: group.date, counts });
      recordEffect(em, forecastStale(flight.id));
      await audit(em, {
        actor,
        action: 'manifest.imported',
        entityType: 'flight',
        entityId: flight.id,
        stationId,
        after: { fileName, rows: passengersIn(group), bookings: group.bookings.size, ...counts },
      });
    }
    return { rows: a.rows, flights, totals };
  });
}

/** The station's latest flight that can still take a manifest, for a template that imports as downloaded. */
export async function templateFlight(db: DataSource, stationId: number): Promise<TemplateFlight | undefined> {
  const station = await db.manager.findOneByOrFail(StationEntity, { id: stationId });
  const flight = await db.manager
    .createQueryBuilder(FlightEntity, 'f')
    .where('f.station_id = :stationId', { stationId })
    .andWhere('f.state NOT IN (:...closed)', { closed: [...CLOSED_STATES] })
    .orderBy('f.scheduled_departure', 'DESC')
    .getOne();
  if (!flight) return undefined;
  const cabin = Object.keys(flight.seatsByCabin).sort((a, b) => flight.seatsByCabin[b] - flight.seatsByCabin[a])[0] ?? 'Y';
  return {
    carrier: flight.carrierCode, number: flight.flightNumber, date: flight.serviceDate, cabin, currency: station.currency,
    departure: flight.scheduledDeparture.toISOString(), arrival: flight.scheduledArrival.toISOString(), destination: flight.destination,
  };
}
