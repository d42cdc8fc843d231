import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { ChangedPayload } from '@shared/events';
import { applyCandidatesAnswer, type TaggedCandidates } from '@shared/schemas/denial-candidates-patch';
import { useLiveRoom } from '../../../lib/socket';
import { denialKeys } from './denials';

/**
 * What one flight notice does to the denial queries. A notice without a forecast version says rounds, proposals or
 * denials moved: everything of the flight's denials is fetched again. A forecast notice moves only the ranking: it
 * carries it to the consoles that show it (applied here, nothing fetched, unless it does not fit the ranking held);
 * otherwise the ranking is asked again when passengers changed (as a patch from the ranking held). The expected
 * shows drift with time and are patched in place from the figures. Returns the keys to fetch again.
 */
export function applyDenialNotice(qc: QueryClient, flightId: number, p: ChangedPayload): readonly (readonly unknown[])[] {
  if (p.version === undefined) return [denialKeys.flight(flightId)];
  const key = denialKeys.candidates(flightId);
  if (p.ranking) {
    const held = qc.getQueryData<TaggedCandidates>(key);
    // Not held yet: the first fetch, under way, brings the ranking as it is now.
    if (held) {
      const next = applyCandidatesAnswer(held, p.ranking);
      if (!next) return [key];
      if (next !== held) qc.setQueryData<TaggedCandidates>(key, next);
    }
  }
  const mean = p.desk?.forecast?.mean;
  if (mean !== undefined) {
    qc.setQueryData<TaggedCandidates>(key, (held) => (held ? { ...held, counts: { ...held.counts, expectedShows: mean } } : held));
  }
  if (p.ranking) return [];
  const passengersMoved = p.passengers === undefined || p.passengers === null || p.passengers.length > 0;
  return passengersMoved ? [key] : [];
}

export function useFlightDenialsLive(flightId: number) {
  const qc = useQueryClient();
  return useLiveRoom('flight', flightId, {
    onChanged: (p) => {
      for (const queryKey of applyDenialNotice(qc, flightId, p)) void qc.invalidateQueries({ queryKey });
    },
    onResync: () => void qc.invalidateQueries({ queryKey: denialKeys.flight(flightId) }),
  });
}

/** Any change at the station may add or settle a proposal waiting for a supervisor. */
export function useStationDenialsLive(stationId: number) {
  const qc = useQueryClient();
  const refetch = () => qc.invalidateQueries({ queryKey: denialKeys.waiting(stationId) });
  return useLiveRoom('station', stationId, { onChanged: refetch, onResync: refetch });
}
