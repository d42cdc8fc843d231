import { useEffect, useRef } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Button } from '../../../components/ui/button';
import { learnedRouteRatesQueryOptions } from '../api/learned-rates';

interface Props {
  stationId: number;
  origin: string;
  /** A valid three-letter destination, or null while none is typed. */
  destination: string | null;
  /** True while the show rate field is empty: the rates the station uses are then filled in by themselves. */
  showRateEmpty: boolean;
  onUse(showRate: string, rho: string): void;
}

/**
 * The learned booking show rate of the route (local economy passengers on a standard fare) and the learned
 * day-to-day correlation, with the version they come from. Filled into an empty show rate when the station uses
 * that version; offered with a button otherwise.
 */
export function LearnedRatesNote({ stationId, origin, destination, showRateEmpty, onUse }: Props) {
  const { data } = useQuery({ ...learnedRouteRatesQueryOptions(stationId, destination ?? ''), enabled: destination !== null });
  const profile = data?.profile ?? null;
  const rate = profile ? (profile.bookingRates.local.Y ?? Object.values(profile.bookingRates.local)[0]) : undefined;
  const showRate = rate === undefined ? null : (Math.round(rate * 1000) / 10).toFixed(1) + '%';
  const rho = data?.shockRho ? data.shockRho.toFixed(4) : '';
  const filledFor = useRef<string | null>(null);
  useEffect(() => {
    const key = `${destination}-${data?.version}`;
    // Only the rates the station's forecasts use fill the form by themselves; a version not in use is offered.
    if (showRate && data?.inUse && showRateEmpty && filledFor.current !== key) {
      filledFor.current = key;
      onUse(showRate, rho);
    }
  }, [showRate, rho, showRateEmpty, destination, data?.version, data?.inUse, onUse]);
  if (!destination || !data) return null;
  if (!showRate || data.version === null) return <p className="text-sm text-ink-soft">No learned rates for {origin}–{destination} yet: type the show rate.</p>;
  return (
    <div className="flex flex-wrap items-center gap-2 rounded-md border-l-4 border-harbour bg-harbour-soft px-3 py-2 text-sm">
      <span>
        Learned for {origin}–{destination} (rates version {data.version}{data.inUse ? ', in use at the station' : ', not in use at the station'}): show rate{' '}
        <strong>{showRate}</strong>{rho && <>, correlation <strong>{rho}</strong></>} — local economy, standard fare.
      </span>
      <Button variant="quiet" className="min-h-8 px-2 py-0" onClick={() => onUse(showRate, rho)}>Use learned rates</Button>
    </div>
  );
}
