import { z } from 'zod';
import { showUpProfileSchema } from './show-up-profile';

export const BOOKING_OUTCOMES = ['showed', 'no-show', 'volunteered', 'denied', 'missed-connection'] as const;
export const bookingOutcomeSchema = z.enum(BOOKING_OUTCOMES, { error: `outcome must be one of ${BOOKING_OUTCOMES.join(', ')}` });
export type BookingOutcomeValue = z.infer<typeof bookingOutcomeSchema>;
/** Outcomes in which the passenger came to the gate: what a show probability forecasts. */
export const SHOWED_OUTCOMES: ReadonlySet<BookingOutcomeValue> = new Set(['showed', 'volunteered', 'denied']);

export const outcomeCorrectionSchema = z.object({
  outcome: bookingOutcomeSchema,
  reason: z.string({ error: 'reason must be text' }).trim().min(3, 'reason must say why, in at least 3 characters').max(300, 'reason must be at most 300 characters'),
});
export type OutcomeCorrection = z.infer<typeof outcomeCorrectionSchema>;

export const ratesChoiceSchema = z.object({
  mode: z.enum(['learned', 'hand-set'], { error: "mode must be 'learned' or 'hand-set'" }),
  /** A version to stay on; null follows the latest. Only with mode 'learned'. */
  pinnedVersion: z.number({ error: 'pinnedVersion must be a number or null' }).int('pinnedVersion must be a whole number').positive('pinnedVersion must be positive').nullable(),
}).refine((c) => c.mode === 'learned' || c.pinnedVersion === null, { message: "pinnedVersion must be null with mode 'hand-set'", path: ['pinnedVersion'] });
export type RatesChoice = z.infer<typeof ratesChoiceSchema>;

export const learningJobSchema = z.object({
  id: z.number(),
  status: z.enum(['queued', 'running', 'done', 'failed']),
  trigger: z.enum(['on-demand', 'nightly']),
  progress: z.number(),
  stage: z.string(),
  error: z.string().nullable(),
  ratesVersion: z.number().nullable(),
  requestedAt: z.string(),
  finishedAt: z.string().nullable(),
  requests: z.number(),
});
export type LearningJob = z.infer<typeof learningJobSchema>;
export const trainingRequestAnswerSchema = z.object({ job: learningJobSchema, joined: z.boolean() });

const scoresSchema = z.object({ brier: z.number(), logLoss: z.number() });
const binSchema = z.object({ from: z.number(), to: z.number(), meanPredicted: z.number(), observedRate: z.number(), count: z.number() });
const backtestSchema = z.object({
  flights: z.number(), meanPredicted: z.number(), observedRate: z.number(), brier: z.number(),
  expectedDenied: z.number(), actualDenied: z.number(), bins: z.array(binSchema),
});
export const calibrationSchema = z.object({
  stationId: z.number(),
  /** Destination of the route, or null for the whole station. */
  route: z.string().nullable(),
  passengers: z.number(),
  learned: scoresSchema,
  handSet: scoresSchema,
  bins: z.array(binSchema),
  backtest: z.object({ learned: backtestSchema, handSet: backtestSchema }),
});
export type Calibration = z.infer<typeof calibrationSchema>;

export const stationLearningSchema = z.object({
  stationId: z.number(),
  choice: ratesChoiceSchema,
  /** The version the forecasts use now, or null for the hand-set profile. */
  inUse: z.number().nullable(),
  latest: z.object({ version: z.number(), createdAt: z.string(), flightsTrained: z.number(), flightsHeldOut: z.number() }).nullable(),
  versions: z.array(z.number()),
  job: learningJobSchema.nullable(),
  calibration: z.array(calibrationSchema),
  /** The learned common shock of the station (intra-class correlation), if any. */
  shockRho: z.number().nullable(),
  /** The station's show rate per check-in segment (horizon and state) and channel ('all' for every channel). */
  segments: z.array(z.object({
    horizon: z.string(), state: z.string(), channel: z.string(), rate: z.number(), evidence: z.number(),
    /** Too little evidence of its own: the rate is its wider level's. */
    leansOnWider: z.boolean(),
  })),
});
export type StationLearning = z.infer<typeof stationLearningSchema>;

/** A route's learned rates: of the version the station uses, else of the latest (then `inUse` is false). */
export const learnedRouteRatesSchema = z.object({ version: z.number().nullable(), inUse: z.boolean(), profile: showUpProfileSchema.nullable(), shockRho: z.number().nullable() });
export type LearnedRouteRates = z.infer<typeof learnedRouteRatesSchema>;

export const closedFlightSchema = z.object({
  id: z.number(), flight: z.string(), serviceDate: z.string(), route: z.string(), demo: z.boolean(), booked: z.number(),
  outcomes: z.record(z.string(), z.number()),
});
export const outcomeRowSchema = z.object({
  id: z.number(), pnr: z.string(), cabin: z.string(), fareClass: z.string(), connecting: z.boolean(), partySize: z.number(),
  /** Where the booking was made, or 'unknown'. */
  channel: z.string(),
  checkedInT24: z.boolean(), checkedInT3: z.boolean(), checkedInT1: z.boolean(), outcome: bookingOutcomeSchema, corrected: z.boolean(),
});
export type OutcomeRow = z.infer<typeof outcomeRowSchema>;
