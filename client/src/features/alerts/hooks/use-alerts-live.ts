import { useQueryClient } from '@tanstack/react-query';
import { ALERT_TOPIC } from '@shared/events';
import { alertKeys } from '../../../lib/alert-keys';
import { useLiveRoom } from '../../../lib/socket';

/**
 * Keeps the alerts current through the station's live notices: only a notice whose topics name the alerts (a change
 * that may raise or close one) fetches them again, so a check-in does not; a reconnect fetches them in any case.
 */
export function useAlertsLive(stationId: number | null) {
  const qc = useQueryClient();
  const refetch = () => qc.invalidateQueries({ queryKey: alertKeys.all });
  return useLiveRoom('station', stationId, {
    onChanged: (p) => {
      if (p.topics?.includes(ALERT_TOPIC)) void refetch();
    },
    onResync: () => void refetch(),
  });
}
