import { useState } from 'react';
import { localDate } from '@shared/time';
import { REGIME_LABELS, type RegimeCode } from '@shared/schemas/common';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { formatMoney } from '../../../lib/format';
import { useNow } from '../../../lib/use-now';
import { EMPTY_COST_HELPER, buildDenialCost, type CostHelperFields } from '../model/denial-cost';
import { minorToText } from '../model/money-text';

interface Props {
  regime: RegimeCode;
  currency: string;
  timeZone: string;
  revenuePerBookingMinor?: number;
  aircraftSeats?: number;
  onUse: (costText: string) => void;
}


/** Builds the cost of one denied boarding: the regime's compensation for a typical case, plus rebooking and goodwill. */
export function DenialCostHelper({ regime, currency, timeZone, revenuePerBookingMinor, aircraftSeats, onUse }: Props) {
  const [f, setF] = useState<CostHelperFields>(EMPTY_COST_HELPER);
  const now = useNow(60 * 60_000);
  const set = (patch: Partial<CostHelperFields>) => setF((old) => ({ ...old, ...patch }));
  const outcome = buildDenialCost(f, { regime, deniedOn: localDate(now, timeZone) /* the station's calendar day selects the amounts in force */, currency, revenuePerBookingMinor, aircraftSeats });
  const euStyle = regime === 'eu-261' || regime === 'uk-261';

  return (
    <details className="rounded-md border-2 border-harbour bg-harbour-soft/40 p-3">
      <summary className="cursor-pointer font-bold text-harbour">Work out this cost from the compensation rules</summary>
      <div className="mt-3 space-y-3">
        <p className="text-sm">Rules of this station: <strong>{REGIME_LABELS[regime]}</strong>. Describe a typical involuntary denial.</p>
        {regime === 'us-dot' && (
          <>
            <TextField label={`Typical one-way fare (${currency})`} value={f.fare} onChange={(v) => set({ fare: v })} error={outcome.errors.fare} hint="Empty: the revenue per booking." inputMode="decimal" />
            <label className="flex items-center gap-2">
              <input type="checkbox" className="h-5 w-5" checked={f.international} onChange={(e) => set({ international: e.target.checked })} />
              International flight from a US airport
            </label>
          </>
        )}
        {euStyle && (
          <>
            <TextField label="Distance to the destination (km)" value={f.distanceKm} onChange={(v) => set({ distanceKm: v })} error={outcome.errors.distanceKm} hint="Great-circle distance." inputMode="numeric" />
            <label className="flex items-center gap-2">
              <input type="checkbox" className="h-5 w-5" checked={f.intraCommunity} onChange={(e) => set({ intraCommunity: e.target.checked })} />
              {regime === 'eu-261' ? 'Both airports in the EU' : 'UK domestic flight'}
            </label>
          </>
        )}
        <TextField label="Arrival delay of the alternate flight (hours)" value={f.delayHours} onChange={(v) => set({ delayHours: v })} error={outcome.errors.delayHours} inputMode="decimal" />
        {outcome.compensation && (
          <div role="status" className="rounded-md border-l-4 border-harbour bg-card px-3 py-2">
            <p className="font-bold">
              Compensation: {formatMoney(outcome.compensation.amountMinor, outcome.compensation.currency)}{' '}
              <span className="font-normal text-ink-soft">({outcome.compensation.ruleRef})</span>
            </p>
            <p className="text-sm">{outcome.compensation.explanation}</p>
            {outcome.compensation.reviewFlags.map((flag) => (
              <p key={flag} className="text-sm text-watch">
                Check: {flag}
              </p>
            ))}
          </div>
        )}
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField label={`Rebooking cost (${currency})`} value={f.rebooking} onChange={(v) => set({ rebooking: v })} error={outcome.errors.rebooking} hint="Seat on another flight, hotel, meals." inputMode="decimal" />
          <TextField label={`Goodwill (${currency})`} value={f.goodwill} onChange={(v) => set({ goodwill: v })} error={outcome.errors.goodwill} hint="Your estimate of the lost future custom." inputMode="decimal" />
        </div>
        {outcome.errors.form && <p className="font-bold text-alert">{outcome.errors.form}</p>}
        {outcome.totalMinor !== undefined && (
          <div className="flex flex-wrap items-center gap-3">
            <p className="text-lg">
              Total per denied boarding: <strong>{formatMoney(outcome.totalMinor, currency)}</strong>
            </p>
            <Button type="button" variant="secondary" onClick={() => onUse(minorToText(outcome.totalMinor ?? 0, currency))}>
              Use this cost
            </Button>
          </div>
        )}
      </div>
    </details>
  );
}
