import { describe, expect, it } from 'vitest';
import { feeCurrencyProblem, optionalFeesCell, optionalFeesCellSchema, optionalFeesSchema } from './optional-fees';

describe('optional fees', () => {
  it('reads the manifest cell, tolerant of case and spaces, and writes it back the same', () => {
    const fees = optionalFeesCellSchema.parse(' Seat:3500:usd ;bag: 4000 :USD');
    expect(fees).toEqual([{ kind: 'seat', amountMinor: 3500, currency: 'USD' }, { kind: 'bag', amountMinor: 4000, currency: 'USD' }]);
    expect(optionalFeesCellSchema.parse(optionalFeesCell(fees))).toEqual(fees);
    expect(optionalFeesCellSchema.parse('')).toEqual([]);
  });

  it.each([
    ['seat:35.00:USD', /fee 1 must read like/],
    ['seat:3500', /fee 1 must read like/],
    ['bag:100:USD; spa:100:USD', /fee 2: kind must be one of seat, bag/],
  ])('rejects %s naming the fee and the rule', (cell, message) => {
    const r = optionalFeesCellSchema.safeParse(cell);
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].message).toMatch(message);
  });

  it('the feed form names the field of a bad fee', () => {
    const r = optionalFeesSchema.safeParse([{ kind: 'seat', amountMinor: -1, currency: 'USD' }]);
    expect(r.error!.issues[0]).toMatchObject({ path: [0, 'amountMinor'], message: 'amountMinor must not be negative' });
  });

  it('a fee in another currency than the fare is a problem naming the fee', () => {
    expect(feeCurrencyProblem([{ kind: 'seat', amountMinor: 1, currency: 'USD' }, { kind: 'bag', amountMinor: 1, currency: 'EUR' }], 'USD'))
      .toEqual({ index: 1, rule: "must be the fare's currency USD (fee 2 is in EUR)" });
    expect(feeCurrencyProblem([], 'USD')).toBeNull();
  });
});
