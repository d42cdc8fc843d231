import { AuditLogEntity } from './audit-log.entity';
import { BookingEntity } from './booking.entity';
import { FlightEntity } from './flight.entity';
import { PassengerEntity } from './passenger.entity';
import { StationEntity } from './station.entity';
import { UserEntity } from './user.entity';
import { ShowUpProfileEntity } from './show-up-profile.entity';
import { IntegrationKeyEntity } from './integration-key.entity';
import { FlightEventEntity } from './flight-event.entity';
import { FlightForecastEntity, ForecastSnapshotEntity } from './flight-forecast.entity';
import { SavedPlanEntity } from './saved-plan.entity';

export { AuditLogEntity, BookingEntity, FlightEntity, PassengerEntity, StationEntity, UserEntity };
export { ShowUpProfileEntity, IntegrationKeyEntity, FlightEventEntity, FlightForecastEntity, ForecastSnapshotEntity };
export const entities = [StationEntity, UserEntity, FlightEntity, BookingEntity, PassengerEntity, AuditLogEntity,
  ShowUpProfileEntity, IntegrationKeyEntity, FlightEventEntity, FlightForecastEntity, ForecastSnapshotEntity, SavedPlanEntity];
