import { describe, expect, it } from 'vitest';
import { baseKeyFor, cardKey, cardholderKey, isForward, reissueKeyFor } from './compensation-states';

describe('forward-only moves (webhooks may arrive twice or out of order: Stripe docs, "Event ordering")', () => {
  it('lets the provider move a compensation forward', () => {
    expect(isForward('issuing', 'issued')).toBe(true);
    expect(isForward('issued', 'settled')).toBe(true);
    expect(isForward('issued', 'voided')).toBe(true);
    expect(isForward('failed', 'issued')).toBe(true);
  });

  it('never lets late news move it back', () => {
    expect(isForward('settled', 'issued')).toBe(false);
    expect(isForward('voided', 'issued')).toBe(false);
    expect(isForward('voided', 'settled')).toBe(false);
    expect(isForward('issued', 'issued')).toBe(false);
  });
});

describe('idempotency keys derived from the compensation id', () => {
  it('names the cardholder and the card after the compensation', () => {
    const base = baseKeyFor(42);
    expect(cardholderKey(base)).toBe('comp-42-cardholder');
    expect(cardKey(base)).toBe('comp-42-card');
  });

  it('gives each re-issue a fresh, still derived, key', () => {
    expect(reissueKeyFor(42, 'comp-42')).toBe('comp-42-r2');
    expect(reissueKeyFor(42, 'comp-42-r2')).toBe('comp-42-r3');
    expect(reissueKeyFor(42, null)).toBe('comp-42-r2');
  });
});
