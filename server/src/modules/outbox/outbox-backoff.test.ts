import { describe, expect, it } from 'vitest';
import { DEFAULT_MAX_ATTEMPTS, retryDelayMs } from './outbox-backoff';

describe('retryDelayMs', () => {
  it('doubles from 1 s and stops at 60 s (truncated binary exponential backoff, common practice)', () => {
    const delays = Array.from({ length: 9 }, (_, i) => retryDelayMs(i + 1));
    // derived: 1000 * 2^(n-1), capped at 60000
    expect(delays).toEqual([1_000, 2_000, 4_000, 8_000, 16_000, 32_000, 60_000, 60_000, 60_000]);
  });

  it('stays finite for absurd attempt counts', () => {
    expect(retryDelayMs(10_000)).toBe(60_000);
  });

  // RFC 5321 section 4.5.4.1 (from memory) suggests relays keep trying for 4-5 days; a gate-day notice that has
  // not gone out within minutes needs a person instead, so the bound is deliberately short.
  it('gives up within about six minutes', () => {
    // derived: the waits before attempts 2..12 are 1+2+4+8+16+32 s and 5 x 60 s = 363 s
    const total = Array.from({ length: DEFAULT_MAX_ATTEMPTS - 1 }, (_, i) => retryDelayMs(i + 1)).reduce((a, b) => a + b, 0);
    expect(total).toBe(363_000);
  });

  it('rejects an attempt number below 1, naming the field', () => {
    expect(() => retryDelayMs(0)).toThrow(/failedAttempt/);
  });
});
