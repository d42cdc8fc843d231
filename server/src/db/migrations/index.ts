// Listed by hand: a glob of .ts files does not load inside vitest. Append new migrations at the end.
import { Initial1796151413508 } from './1796151413508-Initial';
import { SessionsAndAuditGuard1796151413600 } from './1796151413600-SessionsAndAuditGuard';
import { SavedPlans1796151413700 } from './1796151413700-SavedPlans';
import { LiveFlightDesk1796152035497 } from './1796152035497-LiveFlightDesk';
import { Outbox1796152300000 } from './1796152300000-Outbox';
import { VolunteerRounds1796152709441 } from './1796152709441-VolunteerRounds';
import { Compensations1796153183331 } from './1796153183331-Compensations';
import { Denials1796153400000 } from './1796153400000-Denials';
import { Payments1796153500000 } from './1796153500000-Payments';
import { AdminScopeAndSignInThrottle1796210000000 } from './1796210000000-AdminScopeAndSignInThrottle';
import { AmountApprovals1796220000000 } from './1796220000000-AmountApprovals';
import { CompensationAmountCleared1796220100000 } from './1796220100000-CompensationAmountCleared';
import { RefusalsAndRecordedDenials1796240000000 } from './1796240000000-RefusalsAndRecordedDenials';
import { JourneyAndBookingLimit1796250000000 } from './1796250000000-JourneyAndBookingLimit';
import { AlertsAndCabinChanges1796260000000 } from './1796260000000-AlertsAndCabinChanges';
import { ForecastVersion1796270000000 } from './1796270000000-ForecastVersion';
import { ForeignKeys1796290000000 } from './1796290000000-ForeignKeys';
import { CompensationMedium1796295000000 } from './1796295000000-CompensationMedium';
import { PaymentMediaAgreements1796300000000 } from './1796300000000-PaymentMediaAgreements';
import { PassengerPaymentLinks1796310000000 } from './1796310000000-PassengerPaymentLinks';
import { CareAndChoice1796320000000 } from './1796320000000-CareAndChoice';
import { BookingLanguage1796330000000 } from './1796330000000-BookingLanguage';
import { LearnedShowRates1796340000000 } from './1796340000000-LearnedShowRates';
import { FlightSchedules1796370000000 } from './1796370000000-FlightSchedules';
import { PassengerOptionalFees1796400000000 } from './1796400000000-PassengerOptionalFees';
import { RuleRefunds1796401000000 } from './1796401000000-RuleRefunds';
import { ReconciliationByMedium1796500000000 } from './1796500000000-ReconciliationByMedium';
import { RecomputeQueue1796600000000 } from './1796600000000-RecomputeQueue';
import { ClaimedRows1797000000000 } from './1797000000000-ClaimedRows';
import { BookingChannel1796800000000 } from './1796800000000-BookingChannel';
import { AlertSubjects1796900000000 } from './1796900000000-AlertSubjects';

export const migrations = [
  Initial1796151413508,
  SessionsAndAuditGuard1796151413600,
  SavedPlans1796151413700,
  LiveFlightDesk1796152035497,
  Outbox1796152300000,
  VolunteerRounds1796152709441,
  Compensations1796153183331,
  Denials1796153400000,
  Payments1796153500000,
  AdminScopeAndSignInThrottle1796210000000,
  AmountApprovals1796220000000,
  CompensationAmountCleared1796220100000,
  RefusalsAndRecordedDenials1796240000000,
  JourneyAndBookingLimit1796250000000,
  AlertsAndCabinChanges1796260000000,
  ForecastVersion1796270000000,
  ForeignKeys1796290000000,
  CompensationMedium1796295000000,
  PaymentMediaAgreements1796300000000,
  PassengerPaymentLinks1796310000000,
  CareAndChoice1796320000000,
  BookingLanguage1796330000000,
  LearnedShowRates1796340000000,
  FlightSchedules1796370000000,
  PassengerOptionalFees1796400000000,
  RuleRefunds1796401000000,
  ReconciliationByMedium1796500000000,
  RecomputeQueue1796600000000,
  BookingChannel1796800000000,
  AlertSubjects1796900000000,
  ClaimedRows1797000000000,
];
