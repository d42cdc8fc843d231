import type { Denial } from '@shared/schemas/denials';
import { Button } from '../../../components/ui/button';
import { formatMoney, formatTime } from '../../../lib/format';
import { statementUrl } from '../api/denials';
import { minutesWords } from '../model/words';
import { RebookControls } from './rebook-controls';

interface Props {
  denial: Denial;
  flightId: number;
  timeZone: string;
  decides: boolean;
  /** Present when this user may authorize this denial now. */
  onAuthorize?: () => void;
  authorizing: boolean;
}

const STATUS_STYLE: Record<Denial['status'], string> = {
  proposed: 'border-watch',
  authorized: 'border-alert',
  removed: 'border-line opacity-70',
};

const STATEMENT_WORDS: Record<Denial['statements'][number]['status'], string> = {
  pending: 'being sent',
  sent: 'sent',
  failed: 'failed to send: retry from the notices list',
  'no-address': 'no e-mail on the booking: print it and hand it over',
  'not-yet': 'written when rebooked',
};

/** One selected booking: who, why, what they would be owed, the seat held for them and their statements. */
export function DenialCard({ denial: d, flightId, timeZone, decides, onAuthorize, authorizing }: Props) {
  return (
    <section className={`rounded-md border-2 bg-card p-3 ${STATUS_STYLE[d.status]}`} aria-label={`Denial ${d.id}, booking ${d.pnr}`} data-denial-status={d.status}>
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h4 className="text-lg font-bold">
          #{d.position} · {d.pnr} · {d.names.join(', ')}
        </h4>
        <p className="font-bold">
          {d.status === 'proposed' && 'Waiting for authorization'}
          {d.status === 'authorized' && `Authorized by ${d.authorizedBy ?? '—'}${d.authorizedAt ? ` at ${formatTime(d.authorizedAt, timeZone)}` : ''}`}
          {d.status === 'removed' && 'Removed from the selection'}
        </p>
      </header>
      {d.changeReason && <p className="text-sm">Selection changed: “{d.changeReason}”</p>}
      <details className="mt-1">
        <summary className="cursor-pointer text-harbour">Why selected (#{d.position} in the ranking)</summary>
        <ul className="mt-1 list-disc pl-5 text-sm">
          {d.reasons.map((r) => (
            <li key={r}>{r}</li>
          ))}
        </ul>
      </details>
      {d.status !== 'removed' && <CompensationTable denial={d} />}
      {d.category && (
        <p className="mt-2 text-sm">
          Report line {d.category}: {d.categoryLabel}
        </p>
      )}
      {d.rebooking && (
        <p className="mt-2">
          Rebooked on <strong>{d.rebooking.flight}</strong>, leaving {formatTime(d.rebooking.departure, timeZone)}, planned arrival {minutesWords(d.rebooking.plannedArrivalDelayMinutes)} after the original.
        </p>
      )}
      {d.compensation.settled && (
        <div className="mt-2">
          <p className="font-bold">Written statements</p>
          <ul className="text-sm">
            {d.statements.map((s) => (
              <li key={s.passengerId}>
                {s.name}: {STATEMENT_WORDS[s.status]}
                {s.to && s.status !== 'no-address' ? ` (${s.to})` : ''}
              </li>
            ))}
          </ul>
          <a href={statementUrl(d.id)} target="_blank" rel="noreferrer" className="mt-1 inline-block font-bold text-harbour underline no-print">
            Print the statement{d.passengerIds.length > 1 ? 's' : ''}
          </a>
        </div>
      )}
      <div className="mt-3 flex flex-wrap gap-2 no-print">
        {onAuthorize && (
          <Button onClick={onAuthorize} disabled={authorizing}>
            Authorize this denial
          </Button>
        )}
      </div>
      {decides && d.status === 'authorized' && !d.compensation.settled && <RebookControls denial={d} flightId={flightId} timeZone={timeZone} />}
    </section>
  );
}

function CompensationTable({ denial: d }: { denial: Denial }) {
  const c = d.compensation;
  return (
    <div className="mt-2">
      <p className="text-sm">
        <strong>{c.settled ? 'Compensation (fixed):' : 'Compensation (preview):'}</strong> {c.basis}
      </p>
      <table className="mt-1 w-full text-left text-sm">
        <thead>
          <tr className="border-b-2 border-line">
            <th scope="col" className="py-1 pr-2">Passenger</th>
            <th scope="col" className="py-1 pr-2">Amount</th>
            <th scope="col" className="py-1 pr-2">Rule</th>
            <th scope="col" className="py-1">Explanation</th>
          </tr>
        </thead>
        <tbody>
          {c.passengers.map((p) => (
            <tr key={p.passengerId} className="border-b border-line align-top">
              <td className="py-1 pr-2">{p.name}</td>
              <td className="py-1 pr-2 font-bold whitespace-nowrap">{p.problem ? '—' : formatMoney(p.amountMinor, p.currency)}</td>
              <td className="py-1 pr-2">{p.ruleRef || '—'}</td>
              <td className="py-1">
                {p.explanation}
                {p.notes.length > 0 && (
                  <ul className="mt-1 list-disc pl-5 text-ink-soft">
                    {p.notes.map((n) => (
                      <li key={n}>{n}</li>
                    ))}
                  </ul>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <ReviewFlags flags={[...new Set([...c.passengers.flatMap((p) => p.reviewFlags), ...c.reviewFlags])]} />
    </div>
  );
}

function ReviewFlags({ flags }: { flags: string[] }) {
  if (flags.length === 0) return null;
  return (
    <div className="mt-2 rounded-md border-l-4 border-watch bg-watch-soft px-3 py-2 text-sm" role="note">
      <p className="font-bold">
        <span aria-hidden>◆ </span>Check before paying
      </p>
      <ul className="list-disc pl-5">
        {flags.map((f) => (
          <li key={f}>{f}</li>
        ))}
      </ul>
    </div>
  );
}
