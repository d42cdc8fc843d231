import { AuditLogEntity } from './audit-log.entity';
import { BookingEntity } from './booking.entity';
import { FlightEntity } from './flight.entity';
import { PassengerEntity } from './passenger.entity';
import { StationEntity } from './station.entity';
import { UserEntity } from './user.entity';

export { AuditLogEntity, BookingEntity, FlightEntity, PassengerEntity, StationEntity, UserEntity };
export const entities = [StationEntity, UserEntity, FlightEntity, BookingEntity, PassengerEntity, AuditLogEntity];
