import { describe, expect, it } from 'vitest';
import { moneySchema } from './common';
import { passengerBidBodySchema, raiseOfferBodySchema, volunteerPolicySchema } from './volunteers';
import { minorAmountSchema } from './money';

const rule = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  r.success ? 'accepted' : r.error!.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');

describe('amounts the API accepts: integer minor units only', () => {
  it.each([
    [27_550, 'accepted'],
    [0, 'accepted'],
    [1_000_000_000, 'accepted'],
    [275.5, 'offerMinor: offerMinor must be a whole number of minor units (e.g. cents)'],
    ['275,50', 'offerMinor: offerMinor must be a number of minor units, not text'],
    ['27550', 'offerMinor: offerMinor must be a number of minor units, not text'],
    [-1, 'offerMinor: offerMinor must not be negative'],
    [1_000_000_001, 'offerMinor: offerMinor must be at most 1000000000 minor units'],
    [undefined, 'offerMinor: offerMinor is required'],
  ])('raise offerMinor %j -> %s', (offerMinor, expected) => {
    expect(rule(raiseOfferBodySchema.safeParse({ offerMinor }))).toBe(expected);
  });

  it('names the field in every money schema', () => {
    expect(rule(passengerBidBodySchema.safeParse({ passengerToken: 'x'.repeat(12), askMinor: 450.5 }))).toBe('askMinor: askMinor must be a whole number of minor units (e.g. cents)');
    expect(rule(moneySchema.safeParse({ amountMinor: 1.5, currency: 'USD' }))).toBe('amountMinor: amountMinor must be a whole number of minor units (e.g. cents)');
    const policy = { currency: 'EUR', ladderMinor: [20_000, 30_000.5], agentLimitMinor: 60_000, sealedBidPricing: 'own-ask', extras: [], voucherRestrictions: [] };
    expect(rule(volunteerPolicySchema.safeParse(policy))).toBe('ladderMinor.1: ladderMinor[] must be a whole number of minor units (e.g. cents)');
    expect(minorAmountSchema('fareMinor').safeParse(2e9).success).toBe(false);
  });
});
