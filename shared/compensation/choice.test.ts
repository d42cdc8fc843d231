import { describe, expect, it } from 'vitest';
import { apprRebookingCarriers, choiceOffer, choicesFor } from './index';

// Reg. (EC) 261/2004 Art. 8(1)(a)(b)(c) (eur-lex text): reimbursement (with a return flight where the journey no longer
// serves its purpose), re-routing at the earliest opportunity, or re-routing at a later date at the passenger's convenience.
describe('EU and UK Art. 8: the three choices', () => {
  for (const regime of ['eu-261', 'uk-261'] as const) {
    it(`${regime} offers refund, refund with return, earliest and later re-routing`, () => {
      expect(choicesFor(regime).map((c) => c.kind)).toEqual(['refund', 'refund-and-return', 'reroute-earliest', 'reroute-later']);
      expect(choiceOffer(regime, 'refund').source).toMatch(/Art\. 8\(1\)\(a\)/);
      expect(choiceOffer(regime, 'reroute-earliest').source).toMatch(/Art\. 8\(1\)\(b\)/);
      expect(choiceOffer(regime, 'reroute-later').source).toMatch(/Art\. 8\(1\)\(c\)/);
    });
  }

  it('a refund is owed and the Art. 7(2) reduction is not allowed: no re-routing happened (Art. 7(2) speaks of re-routing)', () => {
    expect(choiceOffer('eu-261', 'refund').effects).toMatchObject({ refundOwed: true, reductionAllowed: false, bandFromAlternate: false, returnFlightOwed: false });
    expect(choiceOffer('eu-261', 'refund-and-return').effects).toMatchObject({ refundOwed: true, returnFlightOwed: true, reductionAllowed: false });
  });

  it('re-routing at the earliest opportunity: the band from the alternate, the reduction allowed, no refund', () => {
    expect(choiceOffer('eu-261', 'reroute-earliest').effects).toEqual({ bandFromAlternate: true, reductionAllowed: true, refundOwed: false, returnFlightOwed: false, careContinues: true });
  });

  it('a later date of the passenger’s choosing: no reduction and care stops (our reading; Commission guidelines 2016/C 214/04, from memory)', () => {
    expect(choiceOffer('uk-261', 'reroute-later').effects).toMatchObject({ reductionAllowed: false, refundOwed: false, careContinues: false });
  });
});

// SOR/2019-150 s. 17/18 (section numbers from memory, marked in the rules table).
describe('Canada: rebooking or refund', () => {
  it('offers rebooking, a refund when the rebooking does not meet the passenger’s needs, and refund with return', () => {
    expect(choicesFor('ca-appr').map((c) => c.kind)).toEqual(['reroute-earliest', 'refund', 'refund-and-return']);
    expect(choiceOffer('ca-appr', 'refund-and-return').effects).toMatchObject({ refundOwed: true, returnFlightOwed: true });
    expect(choicesFor('ca-appr').every((c) => c.basis === 'our-reading')).toBe(true);
  });

  it('a later date is not a choice the rule names: refused with the field', () => {
    expect(() => choiceOffer('ca-appr', 'reroute-later')).toThrow(/^kind: "reroute-later" is not a choice under ca-appr/);
  });

  it('other carriers come in when this carrier’s next flight leaves 9 h or more after the original (s. 17(1)(a), from memory)', () => {
    expect(apprRebookingCarriers(8 * 60 + 59)).toBe('own-or-partner');
    expect(apprRebookingCarriers(9 * 60)).toBe('any-carrier');
    expect(apprRebookingCarriers(null)).toBe('any-carrier');
    expect(() => apprRebookingCarriers(1.5)).toThrow(/^nextOwnDepartureMinutes:/);
  });
});

// 14 CFR 250.5(a): the amount follows the planned arrival of the alternate transportation offered.
describe('US Part 250: no regulated choice', () => {
  it('the amount stays measured from the alternate offered even when the passenger takes a refund', () => {
    expect(choiceOffer('us-dot', 'refund').effects).toMatchObject({ bandFromAlternate: true, refundOwed: true, reductionAllowed: false });
    expect(choiceOffer('us-dot', 'refund').basis).toBe('common-practice');
  });
});

describe('input checks', () => {
  it('an unknown regime names the field', () => {
    expect(() => choicesFor('xx' as never)).toThrow(/^regime:/);
  });
});
