import { QueryClient } from '@tanstack/react-query';
import { describe, expect, it } from 'vitest';
import type { ChangedPayload } from '@shared/events';
import type { TaggedCandidates } from '@shared/schemas/denial-candidates-patch';
import { denialKeys } from './denials';
import { applyDenialNotice } from './use-denials-live';

const held = { kind: 'full', tag: 'a.1', counts: { expectedShows: 100 } } as unknown as TaggedCandidates;
const seeded = () => {
  const qc = new QueryClient();
  qc.setQueryData(denialKeys.candidates(7), held);
  return qc;
};
const figures = (mean: number) => ({ forecast: { mean } }) as unknown as ChangedPayload['desk'];

describe('applyDenialNotice', () => {
  it('a notice without a version (rounds, proposals, denials) refetches everything of the flight’s denials', () => {
    expect(applyDenialNotice(seeded(), 7, { id: 7, topics: ['denials'] })).toEqual([denialKeys.flight(7)]);
  });

  it('a forecast notice with moved passengers refetches the ranking only (as a patch), never the proposals', () => {
    expect(applyDenialNotice(seeded(), 7, { id: 7, version: 3, passengers: [{ id: 1 } as NonNullable<ChangedPayload['passengers']>[number]] })).toEqual([denialKeys.candidates(7)]);
    // The server could not tell what moved: the ranking is asked again.
    expect(applyDenialNotice(seeded(), 7, { id: 7, version: 3, passengers: null })).toEqual([denialKeys.candidates(7)]);
  });

  it('figures that drifted with time patch the expected shows in place and fetch nothing', () => {
    const qc = seeded();
    expect(applyDenialNotice(qc, 7, { id: 7, version: 4, passengers: [], events: [], desk: figures(101.5) })).toEqual([]);
    expect(qc.getQueryData<TaggedCandidates>(denialKeys.candidates(7))?.counts.expectedShows).toBe(101.5);
  });

  it('a notice that carries the ranking patches the one held and fetches nothing; one that does not fit it refetches', () => {
    const full = (tag: string, names: string[]) => ({
      kind: 'full', tag, flight: held.flight, regime: 'US', counts: { expectedShows: 90 }, rules: [], rulesText: [], excluded: [],
      candidates: names.map((n, i) => ({ position: i + 1, unitId: n, bookingId: i, pnr: n, passengerIds: [i], names: [n], seatsFreed: 1, cabins: ['Y'], priorityGroup: null, reasons: ['fare'], selection: null })),
    }) as unknown as TaggedCandidates;
    const qc = new QueryClient();
    qc.setQueryData(denialKeys.candidates(7), full('a.1', ['u1', 'u2']));
    const patch = { kind: 'patch', base: 'a.1', tag: 'a.2', counts: { expectedShows: 90 }, order: ['u2', 'u1'], added: [], changed: [], excluded: null } as const;
    const moved = [{ id: 1 } as NonNullable<ChangedPayload['passengers']>[number]];
    expect(applyDenialNotice(qc, 7, { id: 7, version: 5, passengers: moved, ranking: patch as never, desk: figures(91) })).toEqual([]);
    const now = qc.getQueryData<TaggedCandidates>(denialKeys.candidates(7))!;
    expect([now.tag, now.candidates.map((c) => c.unitId), now.counts.expectedShows]).toEqual(['a.2', ['u2', 'u1'], 91]);
    // Unchanged: nothing to do.
    expect(applyDenialNotice(qc, 7, { id: 7, version: 6, passengers: moved, ranking: { kind: 'same', tag: 'a.2' } })).toEqual([]);
    // Made from a ranking this console does not hold (it fetched a newer one meanwhile): it asks the API.
    expect(applyDenialNotice(qc, 7, { id: 7, version: 7, passengers: moved, ranking: { ...patch, base: 'a.9', tag: 'a.10' } as never })).toEqual([denialKeys.candidates(7)]);
    expect(qc.getQueryData<TaggedCandidates>(denialKeys.candidates(7))!.tag).toBe('a.2');
  });
});
