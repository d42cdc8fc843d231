// Expected orders are derived by hand from the rules listed in each test (derived).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { rankDenialCandidates, type DenialContext, type DenialPassenger, type PriorityRuleInput } from './index';

const context: DenialContext = { tierOrder: ['Blue', 'Silver', 'Gold'], currency: 'USD', stationTimeZone: 'America/New_York', regime: 'us-dot' };
const CHECK_IN_THEN_FARE: PriorityRuleInput[] = [
  { factor: 'check-in-time', direction: 'latest-first' },
  { factor: 'fare-paid', direction: 'lowest-first' },
  { factor: 'frequent-flyer-tier', direction: 'none-first' },
];

let sequence = 0;
function passenger(overrides: Partial<DenialPassenger> = {}): DenialPassenger {
  sequence += 1;
  const id = overrides.id ?? `P${sequence}`;
  return {
    id,
    pnr: `PNR${String(sequence).padStart(3, '0')}`,
    partyId: id,
    name: `Traveller ${id}`,
    checkedInAt: '2025-03-01T12:00:00Z',
    boardedAt: null,
    fareMinor: 20_000,
    frequentFlyerTier: null,
    ssrCodes: [],
    alreadyDeniedOnTicket: false,
    volunteered: false,
    ...overrides,
  };
}

const order = (result: ReturnType<typeof rankDenialCandidates>) => result.candidates.map((candidate) => candidate.unitId);

describe('ordering by the carrier rules', () => {
  it('latest check-in first, explained in station time (New York, UTC-5 in March)', () => {
    const result = rankDenialCandidates([
      passenger({ id: 'early', checkedInAt: '2025-03-01T10:05:00Z' }),
      passenger({ id: 'late', checkedInAt: '2025-03-01T12:42:00Z' }),
      passenger({ id: 'middle', checkedInAt: '2025-03-01T11:30:00Z' }),
    ], CHECK_IN_THEN_FARE, context);
    expect(order(result)).toEqual(['late', 'middle', 'early']);
    expect(result.candidates[0].position).toBe(1);
    expect(result.candidates[0].reasons).toContain('rule 1, check-in time: checked in 07:42, later than 2 others');
  });

  it('says how many it is later than in a full flight: "later than 118 others"', () => {
    const list = Array.from({ length: 119 }, (_, index) => passenger({
      id: `F${index}`,
      checkedInAt: new Date(Date.UTC(2025, 2, 1, 10, 44 + index)).toISOString(),
    }));
    const first = rankDenialCandidates(list, CHECK_IN_THEN_FARE, context).candidates[0];
    expect(first.unitId).toBe('F118');
    expect(first.reasons[1]).toBe('rule 1, check-in time: checked in 07:42, later than 118 others');
  });

});

// Only a passenger who presented on time can be denied boarding; one who did not check in by the deadline is a
// no-show (14 CFR 250.6(a) and Form 251 line 2(c); Regulation 261/2004 Art. 3(2)(a) "presented themselves for
// check-in ... as stipulated").
describe('only passengers who are present', () => {
  const deadline = { ...context, checkInDeadline: '2025-03-01T12:30:00Z' };

  it('a passenger not checked in is never ranked, whatever the rules say about check-in time', () => {
    const result = rankDenialCandidates([passenger({ id: 'in' }), passenger({ id: 'out', checkedInAt: null })], CHECK_IN_THEN_FARE, context);
    expect(order(result)).toEqual(['in']);
    expect(result.excluded).toEqual([expect.objectContaining({ passengerId: 'out', protection: 'not-checked-in' })]);
  });

  it('after the deadline a missing check-in is a no-show; before it, simply not present yet', () => {
    const after = rankDenialCandidates([passenger({ id: 'gone', checkedInAt: null })], CHECK_IN_THEN_FARE, { ...deadline, now: '2025-03-01T12:31:00Z' });
    expect(after.excluded[0].reason).toMatch(/not checked in by the deadline \(check-in closed at 07:30\): a no-show/);
    const before = rankDenialCandidates([passenger({ id: 'later', checkedInAt: null })], CHECK_IN_THEN_FARE, { ...deadline, now: '2025-03-01T11:00:00Z' });
    expect(before.excluded[0].reason).toMatch(/not checked in yet/);
  });

  it('a check-in after the deadline is not a presentation on time: set aside, not ranked', () => {
    const result = rankDenialCandidates([
      passenger({ id: 'ontime', checkedInAt: '2025-03-01T12:30:00Z' }),
      passenger({ id: 'late', checkedInAt: '2025-03-01T12:31:00Z' }),
    ], CHECK_IN_THEN_FARE, deadline);
    expect(order(result)).toEqual(['ontime']);
    expect(result.excluded[0]).toMatchObject({ passengerId: 'late', protection: 'checked-in-late' });
  });

  it('a party member who is not there leaves the present members ranked as their own unit', () => {
    const result = rankDenialCandidates([
      passenger({ id: 'here', partyId: 'P2' }),
      passenger({ id: 'away', partyId: 'P2', checkedInAt: null }),
    ], CHECK_IN_THEN_FARE, deadline);
    expect(result.candidates[0]).toMatchObject({ passengerIds: ['here'], seatsFreed: 1 });
    expect(result.candidates[0].reasons[0]).toContain('party of 2 booked, 1 present on this flight');
  });

  it('the second rule decides when the first ties: lowest fare first', () => {
    const result = rankDenialCandidates([
      passenger({ id: 'dear', fareMinor: 45_000 }),
      passenger({ id: 'cheap', fareMinor: 12_900 }),
    ], CHECK_IN_THEN_FARE, context);
    expect(order(result)).toEqual(['cheap', 'dear']);
    expect(result.candidates[0].reasons[1]).toContain('level with 1 other');
    expect(result.candidates[0].reasons[2]).toBe('rule 2, fare paid: fare paid USD 129.00, lower than 1 other');
  });

  it('frequent-flyer tier: none first, then the lowest tier of context.tierOrder', () => {
    const rules: PriorityRuleInput[] = [{ factor: 'frequent-flyer-tier' }];
    const result = rankDenialCandidates([
      passenger({ id: 'gold', frequentFlyerTier: 'Gold' }),
      passenger({ id: 'none' }),
      passenger({ id: 'blue', frequentFlyerTier: 'Blue' }),
    ], rules, context);
    expect(order(result)).toEqual(['none', 'blue', 'gold']);
  });

  it('seat-assigned-before-gate: unassigned first, and the flag is required when the rule is used', () => {
    const rules: PriorityRuleInput[] = [{ factor: 'seat-assigned-before-gate' }];
    const result = rankDenialCandidates([
      passenger({ id: 'seated', seatAssignedBeforeGate: true }),
      passenger({ id: 'unseated', seatAssignedBeforeGate: false }),
    ], rules, context);
    expect(order(result)).toEqual(['unseated', 'seated']);
    expect(() => rankDenialCandidates([passenger()], rules, context)).toThrow(/seatAssignedBeforeGate/);
  });

  it('party size smallest-first puts travellers alone before parties', () => {
    const result = rankDenialCandidates([
      passenger({ id: 'a1', partyId: 'A' }),
      passenger({ id: 'a2', partyId: 'A' }),
      passenger({ id: 'solo' }),
    ], [{ factor: 'party-size', direction: 'smallest-first' }], context);
    expect(order(result)).toEqual(['solo', 'A']);
  });

  it('highest-first and earliest-first directions reverse the order', () => {
    const list = [passenger({ id: 'x', fareMinor: 100, checkedInAt: '2025-03-01T09:00:00Z' }), passenger({ id: 'y', fareMinor: 900, checkedInAt: '2025-03-01T11:00:00Z' })];
    expect(order(rankDenialCandidates(list, [{ factor: 'fare-paid', direction: 'highest-first' }], context))).toEqual(['y', 'x']);
    expect(order(rankDenialCandidates(list, [{ factor: 'check-in-time', direction: 'earliest-first' }], context))).toEqual(['x', 'y']);
  });
});

describe('parties', () => {
  it('a party is one unit, counted by its most protected member (earliest check-in, highest fare)', () => {
    const result = rankDenialCandidates([
      passenger({ id: 'f1', partyId: 'FAM', pnr: 'FAM001', checkedInAt: '2025-03-01T12:50:00Z' }),
      passenger({ id: 'f2', partyId: 'FAM', pnr: 'FAM001', checkedInAt: '2025-03-01T10:00:00Z' }),
      passenger({ id: 'solo', checkedInAt: '2025-03-01T11:00:00Z' }),
    ], CHECK_IN_THEN_FARE, context);
    expect(order(result)).toEqual(['solo', 'FAM']);
    const party = result.candidates[1];
    expect(party).toMatchObject({ passengerIds: ['f1', 'f2'], seatsFreed: 2, pnr: 'FAM001' });
    expect(party.reasons[0]).toContain('party of 2');
    expect(party.reasons[1]).toContain('earliest check-in in the party 05:00');
  });

  it('a party that chose to split is ranked person by person', () => {
    const result = rankDenialCandidates([
      passenger({ id: 's1', partyId: 'S', partySplitAgreed: true, checkedInAt: '2025-03-01T12:50:00Z' }),
      passenger({ id: 's2', partyId: 'S', partySplitAgreed: true, checkedInAt: '2025-03-01T10:00:00Z' }),
      passenger({ id: 'solo', checkedInAt: '2025-03-01T11:00:00Z' }),
    ], CHECK_IN_THEN_FARE, context);
    expect(order(result)).toEqual(['S/s1', 'solo', 'S/s2']);
    expect(result.candidates[0].reasons[0]).toContain('chose to travel separately');
  });

  it('a party stays together unless every listed member agreed to split', () => {
    const result = rankDenialCandidates([
      passenger({ id: 'm1', partyId: 'M', partySplitAgreed: true }),
      passenger({ id: 'm2', partyId: 'M' }),
    ], CHECK_IN_THEN_FARE, context);
    expect(order(result)).toEqual(['M']);
  });

  it('notes members booked but not on this flight, and refuses a party larger than its partySize', () => {
    const result = rankDenialCandidates([passenger({ id: 'b1', partyId: 'B', partySize: 3 }), passenger({ id: 'b2', partyId: 'B', partySize: 3 })], CHECK_IN_THEN_FARE, context);
    expect(result.candidates[0].reasons[0]).toContain('party of 3 booked, 2 present on this flight');
    expect(() => rankDenialCandidates([passenger({ id: 'c1', partyId: 'C', partySize: 1 }), passenger({ id: 'c2', partyId: 'C' })], CHECK_IN_THEN_FARE, context)).toThrow(/partySize/);
  });
});

describe('determinism', () => {
  it('the order does not depend on the input order (property, fast-check)', () => {
    const base = [
      passenger({ id: 'q1', pnr: 'ZZZ111' }),
      passenger({ id: 'q2', pnr: 'AAA222' }),
      passenger({ id: 'q3', pnr: 'MMM333', fareMinor: 5_000 }),
      passenger({ id: 'q4', pnr: 'BBB444', checkedInAt: '2025-03-01T13:00:00Z' }),
      passenger({ id: 'q5a', pnr: 'CCC555', partyId: 'Q5' }),
      passenger({ id: 'q5b', pnr: 'CCC555', partyId: 'Q5' }),
    ];
    const expected = order(rankDenialCandidates(base, CHECK_IN_THEN_FARE, context));
    expect(expected).toEqual(['q4', 'q3', 'q2', 'Q5', 'q1']);
    fc.assert(fc.property(fc.shuffledSubarray(base, { minLength: base.length }), (shuffled) => {
      expect(order(rankDenialCandidates(shuffled, CHECK_IN_THEN_FARE, context))).toEqual(expected);
    }));
  });

  it('says when only the booking-reference tie-break separated candidates', () => {
    const result = rankDenialCandidates([passenger({ id: 't1' }), passenger({ id: 't2' })], CHECK_IN_THEN_FARE, context);
    expect(result.candidates[0].reasons.at(-1)).toContain('order among them by booking reference');
  });
});

describe('input checks', () => {
  it.each<[string, () => unknown, RegExp]>([
    ['unknown tier', () => rankDenialCandidates([passenger({ frequentFlyerTier: 'Platinum' })], CHECK_IN_THEN_FARE, context), /^passengers\[0\]\.frequentFlyerTier:/],
    ['check-in time without offset', () => rankDenialCandidates([passenger({ checkedInAt: '2025-03-01 07:00' })], CHECK_IN_THEN_FARE, context), /^passengers\[0\]\.checkedInAt:/],
    ['duplicate id', () => rankDenialCandidates([passenger({ id: 'dup' }), passenger({ id: 'dup' })], CHECK_IN_THEN_FARE, context), /^passengers\[1\]\.id:/],
    ['negative fare', () => rankDenialCandidates([passenger({ fareMinor: -1 })], CHECK_IN_THEN_FARE, context), /^passengers\[0\]\.fareMinor:/],
    ['bad direction', () => rankDenialCandidates([passenger()], [{ factor: 'fare-paid', direction: 'random' } as never], context), /^rules\[0\]\.direction:/],
    ['duplicate factor', () => rankDenialCandidates([passenger()], [{ factor: 'party-size', direction: 'smallest-first' }, { factor: 'party-size', direction: 'largest-first' }], context), /^rules\[1\]\.factor:/],
    ['empty rules', () => rankDenialCandidates([passenger()], [], context), /^rules:/],
    ['bad time zone', () => rankDenialCandidates([passenger()], CHECK_IN_THEN_FARE, { ...context, stationTimeZone: 'Mars/Olympus' }), /^context\.stationTimeZone:/],
    ['bad currency', () => rankDenialCandidates([passenger()], CHECK_IN_THEN_FARE, { ...context, currency: 'dollars' }), /^context\.currency:/],
  ])('%s is a RangeError naming the field', (_label, run, message) => {
    expect(run).toThrow(RangeError);
    expect(run).toThrow(message);
  });
});
