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
});
