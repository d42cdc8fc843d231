import { describe, expect, it } from 'vitest';
import type { VolunteerPolicy } from '@shared/schemas/volunteers';
import { checkPolicyDraft, draftField, draftFromPolicy } from './policy-draft';

// A policy of our own making (common practice: a rising ladder, an agent limit partway up).
const POLICY: VolunteerPolicy = {
  currency: 'USD',
  ladderMinor: [20_000, 40_000, 60_000],
  agentLimitMinor: 40_000,
  supervisorLimitMinor: null,
  raisePolicy: 'lift-to-new-offer',
  sealedBidPricing: 'own-ask',
  extras: ['Meal voucher'],
  voucherRestrictions: ['Valid for 12 months.', 'Not transferable.'],
};

describe('the volunteer policy draft', () => {
  it('turns a policy into text and back unchanged', () => {
    const d = draftFromPolicy(POLICY);
    expect(d.ladder).toEqual(['200', '400', '600']);
    expect(d.agentLimit).toBe('400');
    expect(checkPolicyDraft(d)).toEqual({ ok: true, policy: POLICY });
  });

  it('drops blank lines of the lists and reads amounts with cents', () => {
    const d = { ...draftFromPolicy(POLICY), extras: '\nMeal voucher\n  \nHotel night\n', ladder: ['200', '450.50'] };
    const r = checkPolicyDraft(d);
    expect(r.ok && r.policy.extras).toEqual(['Meal voucher', 'Hotel night']);
    expect(r.ok && r.policy.ladderMinor).toEqual([20_000, 45_050]);
  });

  it('puts each problem beside its own field, with the shared schema’s rule', () => {
    const d = { ...draftFromPolicy(POLICY), ladder: ['200', 'lots', '100'], agentLimit: '', extras: 'a\nb\nc\nd\ne\nf\ng' };
    const r = checkPolicyDraft(d);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors['ladder.1']).toBe('must be a number, such as 1,234.50');
    expect(r.errors.agentLimit).toBe('is required');
    expect(r.errors.extras).toBe('at most 6 extras');
  });

  it('refuses a step typed with a decimal comma in an en-US browser instead of reading it as thousands', () => {
    // CLDR en-US: "," separates thousands, so "275,50" has a group of two digits and could be read two ways.
    const r = checkPolicyDraft({ ...draftFromPolicy(POLICY), ladder: ['200', '275,50'] });
    expect(!r.ok && r.errors['ladder.1']).toMatch(/^is ambiguous: in en-US "," separates groups of three digits/);
  });

  it('refuses a currency whose decimals Intl and ISO 4217 disagree on, on the currency field', () => {
    // ISO 4217 list one gives HUF 2 decimals (from memory); this runtime's CLDR data shows 0.
    const r = checkPolicyDraft({ ...draftFromPolicy(POLICY), currency: 'HUF' });
    expect(!r.ok && r.errors.currency).toMatch(/HUF cannot be used for amounts/);
  });

  it('marks each step that does not rise above the one before, and an empty ladder', () => {
    const falling = checkPolicyDraft({ ...draftFromPolicy(POLICY), ladder: ['400', '200', '600', '600'] });
    expect(!falling.ok && falling.errors).toEqual({ 'ladder.1': 'must be above step 1', 'ladder.3': 'must be above step 3' });
    const empty = checkPolicyDraft({ ...draftFromPolicy(POLICY), ladder: [] });
    expect(!empty.ok && empty.errors.ladder).toBe('ladderMinor needs at least one step');
  });

  it('refuses a currency that is not an ISO 4217 code before reading any amount', () => {
    const r = checkPolicyDraft({ ...draftFromPolicy(POLICY), currency: 'US' });
    expect(!r.ok && r.errors).toEqual({ currency: 'must be a three-letter ISO 4217 currency code' });
  });

  it('maps the fields the server names to the draft’s', () => {
    expect([draftField('ladderMinor.2'), draftField('ladderMinor'), draftField('agentLimitMinor'), draftField('extras.0'), draftField('currency')]).toEqual(['ladder.2', 'ladder', 'agentLimit', 'extras', 'currency']);
  });
});
