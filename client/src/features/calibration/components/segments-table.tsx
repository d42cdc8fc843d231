import type { StationLearning } from '@shared/schemas/learning';
import { CHANNEL_LABELS, OUTCOME_CHANNELS } from '@shared/schemas/booking-channel';

const HORIZON_WORDS: Record<string, string> = {
  booked: 'More than 24 h out', 'T-24h': '24 h out', 'T-3h': '3 h out', 'T-1h': '1 h out', closed: 'When check-in closed',
};
const STATE_WORDS: Record<string, string> = { any: 'any', 'checked-in': 'checked in', 'not-checked-in': 'not checked in' };
const pct = (r: number) => `${(r * 100).toFixed(1)} %`;

/**
 * The learned show rate of each check-in segment, over all channels and per channel, with the bookings behind it.
 * A segment with too little evidence of its own shows its wider level's rate, marked so.
 */
export function SegmentsTable({ segments }: { segments: StationLearning['segments'] }) {
  const channels = ['all', ...OUTCOME_CHANNELS].filter((c) => segments.some((s) => s.channel === c));
  const rows = [...new Map(segments.map((s) => [`${s.horizon}/${s.state}`, s])).values()];
  const cell = (horizon: string, state: string, channel: string) => segments.find((s) => s.horizon === horizon && s.state === state && s.channel === channel);
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm">
        <caption className="mb-1 text-left font-bold">
          Share of bookings that showed, by their check-in state at each moment before departure (bookings in brackets; * = too few of its own, the wider rate is used)
        </caption>
        <thead>
          <tr className="border-b-2 border-line">
            <th scope="col" className="py-1 pr-3">Moment</th>
            <th scope="col" className="py-1 pr-3">Check-in state</th>
            {channels.map((c) => <th key={c} scope="col" className="py-1 pr-3">{c === 'all' ? 'All channels' : CHANNEL_LABELS[c as keyof typeof CHANNEL_LABELS]}</th>)}
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={`${r.horizon}/${r.state}`} className="border-b border-line">
              <th scope="row" className="py-1 pr-3 font-normal">{HORIZON_WORDS[r.horizon] ?? r.horizon}</th>
              <td className="py-1 pr-3">{STATE_WORDS[r.state] ?? r.state}</td>
              {channels.map((c) => {
                const s = cell(r.horizon, r.state, c);
                return <td key={c} className="py-1 pr-3">{s ? <>{pct(s.rate)}{s.leansOnWider ? '*' : ''} <span className="text-ink-soft">({s.evidence})</span></> : '–'}</td>;
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
