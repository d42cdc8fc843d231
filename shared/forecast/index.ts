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
export {
  learnShowRates,
  lookupRate,
  priorStrength,
  CARRIER_LEVEL,
  DEFAULT_MIN_EVIDENCE,
  type SegmentHistory,
  type LearnedRate,
  type LearnOptions,
} from './learn';
export { brierScore, logLoss, LOG_LOSS_CLIP } from './scores';
export { reliabilityBins, oversaleBacktest, type ReliabilityBin, type OversaleOutcome, type OversaleBacktest } from './reliability';
export { estimateCommonShock, MAX_LEARNED_RHO, type FlightShowRecord, type ShockEstimate } from './dispersion';
export { learnCheckInCurve, CHECK_IN_GRID, type CheckInHistory } from './check-in-curve';
export {
  CHECK_IN_WINDOWS, HORIZONS, HORIZON_STATES, CHECK_IN_STATES, trainingSegments, liveSegment, segmentRateKey,
  type Horizon, type CheckInState, type CheckInSegment,
} from './check-in-segments';
