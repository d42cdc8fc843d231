import { requireProbability } from './validate';

/** Both arrays the same non-zero length, predictions within [0, 1], outcomes 0 or 1. */
export function requireForecastPairs(predicted: number[], observed: (0 | 1)[]): void {
  if (predicted.length !== observed.length) {
    throw new RangeError(`predicted and observed must have the same length (${predicted.length} and ${observed.length})`);
  }
  if (predicted.length === 0) throw new RangeError('predicted must hold at least one forecast');
  predicted.forEach((p, i) => requireProbability(p, `predicted[${i}]`));
  observed.forEach((o, i) => {
    if (o !== 0 && o !== 1) throw new RangeError(`observed[${i}] must be 0 or 1 (got ${String(o)})`);
  });
}

/** Brier score: the mean squared difference between the forecast probability and the 0/1 outcome (lower is better). */
export function brierScore(predicted: number[], observed: (0 | 1)[]): number {
  requireForecastPairs(predicted, observed);
  let sum = 0;
  for (let i = 0; i < predicted.length; i++) sum += (predicted[i] - observed[i]) ** 2;
  return sum / predicted.length;
}

/**
 * Forecasts are held this far from 0 and 1 inside the logarithm, so one confident miss costs about 34.5 rather than
 * infinity (the same clipping idea as common machine-learning libraries; the size of it is our own choice).
 */
export const LOG_LOSS_CLIP = 1e-15;

/** Log loss (cross-entropy): the mean of -ln of the probability given to what happened (lower is better). */
export function logLoss(predicted: number[], observed: (0 | 1)[]): number {
  requireForecastPairs(predicted, observed);
  let sum = 0;
  for (let i = 0; i < predicted.length; i++) {
    const p = Math.min(1 - LOG_LOSS_CLIP, Math.max(LOG_LOSS_CLIP, predicted[i]));
    sum -= observed[i] === 1 ? Math.log(p) : Math.log(1 - p);
  }
  return sum / predicted.length;
}
