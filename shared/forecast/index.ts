export type {
  BookingLimitOptimum,
  BookingLimitOptions,
  BookingLimitPoint,
  CommonShock,
  OversaleRisk,
  ShockScenario,
  ShowUpUnit,
} from './types';
export { showUpDistribution, partyShowUp, partyMemberPmf, type PartyShowUpUnit } from './show-up';
export { oversaleRisk, volunteerTarget, quantile, upperTail, sumIndependentPmfs } from './risk';
export { bookingLimitCurve, optimalBookingLimit, MAX_BOOKINGS } from './booking-limit';
export { showProbabilityNotCheckedIn } from './check-in';
export { binomialPmf, betaBinomialPmf, betaShape } from './binomial';
export { betaQuadrature, type QuadratureRule } from './gauss-jacobi';
export { betaRateTransform, quadratureNodeCount } from './shock';
export { createSeededRandom, simulateShowUps, betaSample } from './monte-carlo';
export { MAX_PEOPLE } from './validate';
