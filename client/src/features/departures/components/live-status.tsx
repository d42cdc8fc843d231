import { describeLive, useLiveSnapshot } from '../../../lib/socket';

const TONES = {
  calm: 'border-calm bg-calm-soft text-calm',
  watch: 'border-watch bg-watch-soft text-watch',
  alert: 'border-alert bg-alert-soft text-alert',
} as const;

function clock(at: number, timeZone: string) {
  return new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit', second: '2-digit', hourCycle: 'h23' }).format(new Date(at));
}

/** Whether the board is live, and when its figures were last fetched, in the station's zone. */
export function LiveStatus({ joined, updatedAt, timeZone }: { joined: boolean | null; updatedAt: number; timeZone: string }) {
  const { state } = useLiveSnapshot();
  const look = describeLive(state, joined);
  return (
    <p role="status" aria-live="polite" data-live-state={state} className={`inline-flex flex-wrap items-center gap-x-2 rounded-md border-2 px-3 py-1.5 font-bold ${TONES[look.tone]} ${state === 'lost' ? 'text-lg' : ''}`}>
      <span aria-hidden>{look.icon}</span>
      <span>{look.text}</span>
      {updatedAt > 0 && <span className="font-normal text-ink">· updated {clock(updatedAt, timeZone)}</span>}
    </p>
  );
}
