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
import { OfferApprovalEntity, RebookingEntity, VolunteerEntity, VolunteerPolicyEntity, VolunteerRoundEntity } from './volunteer.entity';
import { SavedPlanEntity } from './saved-plan.entity';
import { CompensationEntity } from './compensation.entity';
import { OutboxMessageEntity } from './outbox-message.entity';
import { PaymentIssuanceEntity, ProviderCardEntity, ProviderEventEntity, ReconciliationDifferenceEntity, ReconciliationRunEntity, VoucherOfferEntity } from './payment.entity';
import { BoardingRefusalEntity, DenialEntity, DenialProposalEntity, StationPriorityRulesEntity } from './denial.entity';
import { AlertEntity } from './alert.entity';
import { CabinChangeEntity } from './cabin-change.entity';
import { CareGivenEntity, PassengerChoiceEntity, StationCareSettingsEntity, TicketRefundEntity } from './care.entity';
import { FlightScheduleEntity } from './flight-schedule.entity';
import { BookingOutcomeEntity, ClosedFlightEntity, LearnedRatesEntity, LearningJobEntity, StationRatesChoiceEntity } from './learning.entity';
import { PaymentLinkEntity, PayoutEntity } from './payout.entity';
import { CounterPaymentEntity, PaymentAgreementEntity } from './payment-media.entity';
import { RuleRefundEntity } from './rule-refund.entity';

export { AuditLogEntity, BookingEntity, FlightEntity, PassengerEntity, StationEntity, UserEntity };
export { ShowUpProfileEntity, IntegrationKeyEntity, FlightEventEntity, FlightForecastEntity, ForecastSnapshotEntity };
export { OfferApprovalEntity, RebookingEntity, VolunteerEntity, VolunteerPolicyEntity, VolunteerRoundEntity };
export { CompensationEntity };
export { OutboxMessageEntity };
export { PaymentIssuanceEntity, ProviderCardEntity, ProviderEventEntity, ReconciliationDifferenceEntity, ReconciliationRunEntity, VoucherOfferEntity };
export { BoardingRefusalEntity, DenialEntity, DenialProposalEntity, StationPriorityRulesEntity };
export { AlertEntity, CabinChangeEntity, FlightScheduleEntity };
export { CareGivenEntity, PassengerChoiceEntity, StationCareSettingsEntity, TicketRefundEntity };
export type { StoredPartnerHotel } from './care.entity';
export { BookingOutcomeEntity, ClosedFlightEntity, LearnedRatesEntity, LearningJobEntity, StationRatesChoiceEntity };
export { PaymentLinkEntity, PayoutEntity };
export type { PaymentLinkPurpose, PayoutState } from './payout.entity';
export { CounterPaymentEntity, PaymentAgreementEntity };
export { RuleRefundEntity };
export const entities = [StationEntity, UserEntity, FlightEntity, BookingEntity, PassengerEntity, AuditLogEntity,
  ShowUpProfileEntity, IntegrationKeyEntity, FlightEventEntity, FlightForecastEntity, ForecastSnapshotEntity, SavedPlanEntity,
  VolunteerPolicyEntity, VolunteerRoundEntity, OfferApprovalEntity, VolunteerEntity, RebookingEntity, OutboxMessageEntity, CompensationEntity,
  StationPriorityRulesEntity, DenialProposalEntity, DenialEntity, BoardingRefusalEntity,
  ProviderEventEntity, PaymentIssuanceEntity, ProviderCardEntity, VoucherOfferEntity, ReconciliationRunEntity, ReconciliationDifferenceEntity,
  AlertEntity, CabinChangeEntity, StationCareSettingsEntity, PassengerChoiceEntity, TicketRefundEntity, CareGivenEntity, FlightScheduleEntity,
  ClosedFlightEntity, BookingOutcomeEntity, LearningJobEntity, LearnedRatesEntity, StationRatesChoiceEntity, PaymentLinkEntity, PayoutEntity,
  PaymentAgreementEntity, CounterPaymentEntity, RuleRefundEntity];
