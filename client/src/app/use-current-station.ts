import { useCallback, useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { sessionQueryOptions } from '../lib/session';

const KEY = 'bumpboard.station';
export const STATION_PARAM = 'station';

/**
 * The station the user is working. One source of truth: the URL's `station` parameter (an IATA code), read by the
 * header's picker and by the page alike, so a link or a reload shows the same station everywhere. Without one (or
 * with one the user does not belong to) it is the station last chosen on this device, else the first; the shell
 * then writes it into the URL.
 */
export function useCurrentStation() {
  const { data } = useQuery(sessionQueryOptions());
  const stations = useMemo(() => data?.user?.stations ?? [], [data]);
  const [params, setParams] = useSearchParams();
  const asked = params.get(STATION_PARAM)?.toUpperCase() ?? null;
  const fromUrl = stations.find((s) => s.iata === asked) ?? null;
  const remembered = typeof localStorage === 'undefined' ? null : localStorage.getItem(KEY);
  const station = fromUrl ?? stations.find((s) => String(s.id) === remembered) ?? stations[0] ?? null;
  const choose = useCallback(
    (id: number, replace = false) => {
      const next = stations.find((s) => s.id === id);
      if (!next) return;
      localStorage.setItem(KEY, String(id));
      setParams((p) => {
        const copy = new URLSearchParams(p);
        copy.set(STATION_PARAM, next.iata);
        return copy;
      }, { replace });
    },
    [stations, setParams],
  );
  return { station, stations, choose, inUrl: fromUrl !== null };
}
