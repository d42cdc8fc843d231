import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { ChangedPayload } from '@shared/events';
import type { TaggedCandidates } from '@shared/schemas/denial-candidates-patch';
import { useLiveRoom } from '../../../lib/socket';
import { denialKeys } from './denials';

/**
 * What one flight notice does to the denial queries. A notice without a forecast version says rounds, proposals or
 * denials moved: everything of the flight's denials is fetched again. A forecast notice moves only the ranking, and
 * only when passengers changed (then as a patch from the ranking held); when just the figures drifted with time,
 * the expected shows are patched in place and nothing is fetched. Returns the keys to fetch again.
 */
export function applyDenialNotice(qc: QueryClient, flightId: number, p: ChangedPayload): readonly (readonly unknown[])[] {
  if (p.version === undefined) return [denialKeys.flight(flightId)];
  const mean = p.desk?.forecast?.mean;
  if (mean !== undefined) {
    qc.setQueryData<TaggedCandidates>(denialKeys.candidates(flightId), (held) => (held ? { ...held, counts: { ...held.counts, expectedShows: mean } } : held));
  }
  const passengersMoved = p.passengers === undefined || p.passengers === null || p.passengers.length > 0;
  return passengersMoved ? [denialKeys.candidates(flightId)] : [];
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
