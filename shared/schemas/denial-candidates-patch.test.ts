// A patch from one ranking to another, applied to the first, gives the second: for any two rankings of the same
// flight (units added, dropped, moved, changed), and it is refused on any other base.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { applyCandidatesPatch, diffCandidates, type TaggedCandidates } from './denial-candidates-patch';

const counts = (checkedIn: number): TaggedCandidates['counts'] => ({
  seats: 2, checkedIn, boarded: 0, acceptedVolunteerSeats: 0, occupying: checkedIn, seatsShort: Math.max(0, checkedIn - 2), waitingProposalSeats: 0,
  seatsShortAfterProposals: Math.max(0, checkedIn - 2), expectedShows: null, checkInDeadline: '2026-12-03T09:15:00.000Z', byCabin: [],
});

const unit = (id: number, selected: boolean, reason: string, level = 0): TaggedCandidates['candidates'][number] => ({
  position: 0, unitId: `u${id}`, bookingId: id, pnr: `P${id}`, passengerIds: [id], names: [`Name ${id}`], seatsFreed: 1, cabins: ['Y'], priorityGroup: null,
  reasons: level > 1 ? [reason] : [reason, `rule 3, tier: level with ${level} others`], selection: selected ? { denialId: id, proposalId: 1, status: 'proposed' } : null,
});

function ranking(tag: string, units: TaggedCandidates['candidates']): TaggedCandidates {
  return {
    kind: 'full', tag, flight: { id: 1, label: 'ZZ 1', origin: 'AAA', destination: 'BBB', scheduledDeparture: '2026-12-03T10:00:00.000Z', stationId: 1 },
    regime: 'US', counts: counts(units.length), rules: [], rulesText: [], candidates: units.map((u, i) => ({ ...u, position: i + 1 })),
    // Those not in the ranking this time stand for the excluded, with a reason that counts the ranked.
    excluded: [1, 2, 3].filter((id) => !units.some((u) => u.bookingId === id)).map((id) => ({
      passengerId: id, bookingId: id, pnr: `P${id}`, name: `Name ${id}`, protection: 'not-checked-in' as const, reason: `not checked in; ${units.length} are`,
    })),
  };
}

// Units by id (unique), each possibly selected and with one of two reasons, in any order.
// Units by id (unique), each possibly selected, with one of two first reasons and a second line that may count
// others differently or be absent, in any order.
const units = fc.uniqueArray(fc.record({ id: fc.integer({ min: 1, max: 30 }), selected: fc.boolean(), reason: fc.constantFrom('fare', 'checked in late'), level: fc.integer({ min: 0, max: 2 }) }), { selector: (u) => u.id, maxLength: 12 })
  .map((list) => list.map((u) => unit(u.id, u.selected, u.reason, u.level)));

describe('candidates patch', () => {
  it('applied to its base gives the ranking it was made from', () => {
    fc.assert(fc.property(units, units, (a, b) => {
      const from = ranking('t.1', a);
      const to = ranking('t.2', b);
      const patch = diffCandidates(from, to)!;
      expect(applyCandidatesPatch(from, patch)).toEqual(to);
      // Units that did not change (but for their place) are not sent again.
      const unchanged = b.filter((u) => a.some((x) => JSON.stringify(x) === JSON.stringify(u)));
      expect(patch.changed.length + patch.added.length).toBe(b.length - unchanged.length);
    }));
  });

  it('a hand-worked case: one new check-in ranked first moves the others down and is the only unit sent', () => {
    const from = ranking('t.1', [unit(1, false, 'fare'), unit(2, false, 'fare')]);
    const to = ranking('t.2', [unit(3, false, 'fare'), unit(1, false, 'fare'), unit(2, false, 'fare')]);
    const patch = diffCandidates(from, to)!;
    expect(patch.order).toEqual(['u3', 'u1', 'u2']);
    expect(patch.added.map((u) => u.unitId)).toEqual(['u3']);
    expect(patch.changed).toEqual([]);
    expect(applyCandidatesPatch(from, patch)!.candidates.map((u) => [u.unitId, u.position])).toEqual([['u3', 1], ['u1', 2], ['u2', 3]]);
  });

  it('a count in one reason line moved: only that line’s numbers travel', () => {
    const from = ranking('t.1', [unit(1, false, 'fare', 0)]);
    const to = ranking('t.2', [unit(1, false, 'fare', 1)]);
    const patch = diffCandidates(from, to)!;
    // "rule 3, tier: level with 0 others" -> "... with 1 others": the digit runs 3 and 1.
    expect(patch.changed).toEqual([{ unitId: 'u1', lines: [[1, ['3', '1']]], reasonCount: 2 }]);
    expect(applyCandidatesPatch(from, patch)).toEqual(to);
  });

  it('is refused on another base, and not made across other rules', () => {
    const from = ranking('t.1', [unit(1, false, 'fare')]);
    const to = ranking('t.2', [unit(2, false, 'fare')]);
    expect(applyCandidatesPatch({ ...from, tag: 't.0' }, diffCandidates(from, to)!)).toBeNull();
    expect(diffCandidates(from, { ...to, rulesText: ['fare first'] })).toBeNull();
  });
});
