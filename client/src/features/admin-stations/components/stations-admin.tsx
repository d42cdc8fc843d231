import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { REGIME_LABELS } from '@shared/schemas/common';
import type { StationSettings } from '@shared/schemas/admin-stations';
import { Button } from '../../../components/ui/button';
import { stationSettingsQueryOptions } from '../api/stations';
import { ResultMessage } from '../../../components/ui/form-problems';
import { StationForm } from './station-form';

export function StationsAdmin() {
  const { data, isPending, error } = useQuery(stationSettingsQueryOptions());
  const [editing, setEditing] = useState<StationSettings | 'new' | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const done = (text: string) => {
    setEditing(null);
    if (text) setMessage(text);
  };
  if (isPending) return <p className="text-ink-soft">Loading stations…</p>;
  if (error) return <p role="alert" className="font-bold text-alert">{error.message}</p>;
  return (
    <div className="space-y-4">
      <ResultMessage text={message} />
      <p className="text-ink-soft">
        {data.viewer.carrierWide ? 'You are a carrier-wide admin: you may open new stations.' : 'You edit the stations you hold. Only a carrier-wide admin opens a new station.'}
      </p>
      {!editing && data.viewer.carrierWide && <Button onClick={() => { setMessage(null); setEditing('new'); }}>Open a station</Button>}
      {editing && <StationForm key={editing === 'new' ? 'new' : editing.id} station={editing === 'new' ? null : editing} onDone={done} />}
      <table className="w-full">
        <caption className="sr-only">Your stations and their settings</caption>
        <thead className="bg-harbour-soft text-left">
          <tr>
            <th className="px-2 py-2">Station</th><th className="px-2 py-2">Time zone</th><th className="px-2 py-2">Rules</th><th className="px-2 py-2">Currency</th>
            <th className="px-2 py-2">Risk tolerance</th><th className="px-2 py-2">Grace</th><th className="px-2 py-2">Booking limit</th><th className="px-2 py-2"><span className="sr-only">Actions</span></th>
          </tr>
        </thead>
        <tbody>
          {data.stations.map((s) => (
            <tr key={s.id} className="border-t border-line">
              <td className="px-2 py-2"><strong>{s.iata}</strong> · {s.name}</td>
              <td className="px-2 py-2">{s.timeZone}</td>
              <td className="px-2 py-2">{REGIME_LABELS[s.regime]}</td>
              <td className="px-2 py-2">{s.currency}</td>
              <td className="px-2 py-2">{s.riskTolerancePercent} %</td>
              <td className="px-2 py-2">{s.departureGraceMinutes} min</td>
              <td className="px-2 py-2">{s.maxOverbookingPercent} %</td>
              <td className="px-2 py-2 text-right"><Button variant="quiet" aria-label={`Edit ${s.iata}`} onClick={() => { setMessage(null); setEditing(s); }}>Edit</Button></td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
