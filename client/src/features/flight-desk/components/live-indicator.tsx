import { describeLive, useLiveSnapshot } from '../../../lib/socket';
import { formatClock } from '../model/time';

const TONES = {
  calm: 'border-calm bg-calm-soft text-calm',
  watch: 'border-watch bg-watch-soft text-watch',
  alert: 'border-alert bg-alert-soft text-alert',
} as const;

/** Whether the screen is live, and when its figures last changed, in the station's zone. */
export function LiveIndicator({ joined, updatedAt, timeZone }: { joined: boolean | null; updatedAt: number; timeZone: string }) {
  const { state } = useLiveSnapshot();
  const look = describeLive(state, joined);
  const lost = state === 'lost';
  return (
    <p
      role="status"
      aria-live="polite"
      data-live-state={state}
      className={`inline-flex flex-wrap items-center gap-x-2 rounded-md border-2 px-3 py-1.5 font-bold ${TONES[look.tone]} ${lost ? 'text-lg' : ''}`}
    >
      <span aria-hidden className={state === 'live' ? 'motion-safe:animate-pulse' : ''}>
        {look.icon}
      </span>
      <span>{look.text}</span>
      {/* The clock changes on every check-in: shown, but kept out of the announcement so only the state is read out. */}
      {updatedAt > 0 && <span aria-hidden className="font-normal text-ink">· updated {formatClock(updatedAt, timeZone)}</span>}
    </p>
  );
}
