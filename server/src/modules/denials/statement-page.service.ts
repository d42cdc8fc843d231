// The printable statement of a rebooked denial: the same text the passengers were mailed, one sheet each.
import { In, type DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { BookingEntity, CompensationEntity, DenialEntity, FlightEntity, PassengerEntity, RebookingEntity, StationEntity } from '../../db/entities';
import { badRequest, conflict, notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { priorityRulesFor } from './priority-rules.service';
import { withCurrentAmount } from '../care/care-mail';
import { choiceAndCareForStatement } from '../care/for-statement';
import { statementFor, statementPage } from './statement';

export async function statementPageFor(db: DataSource, user: SessionUser, denialId: number, passengerId?: number): Promise<string> {
  const denial = await db.getRepository(DenialEntity).findOneBy({ id: denialId });
  if (!denial || !canSeeStation(user, denial.stationId)) throw notFound('Denial');
  if (!denial.compensation) throw conflict('not_rebooked', 'The statement is written once the passenger is rebooked (or it is recorded that no alternate was offered).');
  if (passengerId !== undefined && !denial.passengerIds.includes(passengerId)) {
    throw badRequest(`passengerId: passenger ${passengerId} is not in this denial`, [{ field: 'passengerId', rule: 'must be a passenger of this denial' }]);
  }
  const ids = passengerId === undefined ? denial.passengerIds : [passengerId];
  const [station, flight, booking, passengers, rebooking, { rules }] = await Promise.all([
    db.getRepository(StationEntity).findOneByOrFail({ id: denial.stationId }),
    db.getRepository(FlightEntity).findOneByOrFail({ id: denial.flightId }),
    db.getRepository(BookingEntity).findOneByOrFail({ id: denial.bookingId }),
    db.getRepository(PassengerEntity).findBy({ id: In(ids) }),
    db.getRepository(RebookingEntity).findOneBy({ denialId }),
    priorityRulesFor(db, denial.stationId),
  ]);
  const snapshot = denial.compensation;
  const printedRules = snapshot.priorityRules ?? rules;
  const rows = await db.getRepository(CompensationEntity).findBy({ sourceKind: 'denial', sourceId: denialId, passengerId: In(ids) });
  const statements = await Promise.all(ids.map(async (id) => {
    const passenger = passengers.find((p) => p.id === id)!;
    const row = rows.find((r) => r.passengerId === id) ?? null;
    const compensation = withCurrentAmount(snapshot.passengers.find((c) => c.passengerId === id)!, row);
    const choiceAndCare = row ? await choiceAndCareForStatement(db, { compensationId: row.id }, booking.language ?? 'en') : undefined;
    return statementFor({ station, flight, pnr: booking.pnr, passenger, compensation, rebooking, rules: printedRules, language: booking.language, choiceAndCare });
  }));
  return statementPage(
    `Written statement · ${flight.carrierCode} ${flight.flightNumber} · booking ${booking.pnr}`,
    statements,
    `Print with your browser's Print command: each passenger's statement starts on a new page. This note does not print.`,
  );
}
