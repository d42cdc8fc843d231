import * as tf from '@tensorflow/tfjs';
import { describe, expect, it } from 'vitest';
import { createSeededRandom } from './monte-carlo';
import { brierScore, logLoss } from './scores';

describe('brierScore and logLoss', () => {
  it('match values worked by hand', () => {
    // Hand-worked: Brier = (0.1^2 + 0.2^2 + 0.6^2) / 3 = 0.41 / 3;
    // log loss = -(ln 0.9 + ln 0.8 + ln 0.4) / 3 = (0.1053605 + 0.2231436 + 0.9162907) / 3 = 0.4149316.
    expect(brierScore([0.9, 0.2, 0.6], [1, 0, 0])).toBeCloseTo(0.41 / 3, 12);
    expect(logLoss([0.9, 0.2, 0.6], [1, 0, 0])).toBeCloseTo(0.4149316, 7);
    // A forecast of 0.5 for everything: Brier 0.25, log loss ln 2 (definitions).
    expect(brierScore([0.5, 0.5], [1, 0])).toBe(0.25);
    expect(logLoss([0.5, 0.5], [1, 0])).toBeCloseTo(Math.LN2, 12);
    // A sure miss is clipped, not infinite.
    expect(Number.isFinite(logLoss([0], [1]))).toBe(true);
  });

  it('match the reference library TensorFlow.js (@tensorflow/tfjs 4.22.0: losses.meanSquaredError, losses.logLoss)', async () => {
    await tf.setBackend('cpu');
    const random = createSeededRandom(7);
    const predicted = Array.from({ length: 500 }, () => 0.02 + 0.96 * random());
    const observed = predicted.map((p): 0 | 1 => (random() < p ? 1 : 0));
    const labels = tf.tensor1d(observed);
    const preds = tf.tensor1d(predicted);
    const referenceBrier = (await tf.losses.meanSquaredError(labels, preds).data())[0];
    // TensorFlow.js adds epsilon inside both logarithms; 1e-7 is its default and far below the float32 tolerance here.
    const referenceLogLoss = (await tf.losses.logLoss(labels, preds).data())[0];
    // float32 arithmetic in the library: agreement to about 1e-6 relative.
    expect(brierScore(predicted, observed)).toBeCloseTo(referenceBrier, 5);
    expect(logLoss(predicted, observed)).toBeCloseTo(referenceLogLoss, 5);
    tf.dispose([labels, preds]);
  });

  it('refuse mismatched or out-of-range input, naming it', () => {
    expect(() => brierScore([0.5], [1, 0])).toThrow(/same length/);
    expect(() => brierScore([], [])).toThrow(/at least one/);
    expect(() => logLoss([1.2], [1])).toThrow(/predicted\[0\]/);
    expect(() => logLoss([0.2], [2 as 1])).toThrow(/observed\[0\]/);
  });
});
