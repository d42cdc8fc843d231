import { useQuery } from '@tanstack/react-query';
import { REGIME_LABELS } from '@shared/schemas/common';
import { stationsQueryOptions } from '../api/stations';

export function StationsOverview() {
  const { data, isPending, error } = useQuery(stationsQueryOptions());
  if (isPending) return <p className="text-ink-soft">Loading stations…</p>;
  if (error) return <p role="alert" className="text-alert">{error.message}</p>;
  return (
    <ul className="space-y-3">
      {data.stations.map((s) => (
        <li key={s.id} className="rounded border border-line p-3">
          <p className="text-lg font-bold">
            {s.iata} · {s.name}
          </p>
          <p className="text-sm text-ink-soft">{REGIME_LABELS[s.regime]}</p>
          <p className="text-sm text-ink-soft">
            {s.timeZone} · {s.currency} · risk tolerance {Math.round(s.riskTolerance * 100)} %
          </p>
        </li>
      ))}
    </ul>
  );
}
