import { useId, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { APPROVAL_KIND_WORDS, type PendingApproval } from '@shared/schemas/approvals';
import { Button } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/page';
import { ResultMessage } from '../../../components/ui/form-problems';
import { formatMoney, formatTime } from '../../../lib/format';
import { approvalsQueryOptions, useDecideApproval } from '../api/rounds';
import { useApprovalsLive } from '../api/use-live';
import { Problem } from './problem';
import type { FieldProblem } from '../../../components/ui/form-problems';

type Approval = PendingApproval;

/** A supervisor's queue of amounts above someone's limit at this station, kept live by the station's change notices. */
export function PendingApprovals({ stationId, timeZone }: { stationId: number; timeZone: string }) {
  const approvals = useQuery(approvalsQueryOptions(stationId));
  useApprovalsLive(stationId);
  // The decided row leaves the queue: what was decided is said here, and takes the focus the row's button had.
  const [decided, setDecided] = useState<string | null>(null);
  if (approvals.isPending) return <p className="text-lg text-ink-soft">Loading what waits for you…</p>;
  if (approvals.error) return <p role="alert" className="font-bold text-alert">The approvals could not be loaded: {approvals.error.message}</p>;
  const list = approvals.data.approvals;
  return (
    <section aria-label="Amounts waiting for your approval" data-testid="pending-approvals">
      <h3 className="mb-2 text-xl font-bold">
        Amounts above someone’s limit {list.length > 0 && <span className="rounded-full bg-signal px-3 py-0.5 text-ink">{list.length}</span>}
      </h3>
      <div className="mb-3 empty:hidden">
        <ResultMessage text={decided} />
      </div>
      {list.length === 0 ? (
        <p className="rounded-md border-2 border-calm bg-calm-soft px-4 py-3 text-lg font-bold text-calm">
          <span aria-hidden>● </span>No amount waits for your approval.
        </p>
      ) : (
        <>
          <ul className="space-y-3">
            {list.map((a) => (
              <ApprovalRow key={a.id} a={a} timeZone={timeZone} onDecided={setDecided} />
            ))}
          </ul>
          <div className="mt-3">
            <Caution>Approving fixes what a passenger is paid under the station’s policy. The applicable regulation, the contract of carriage and the carrier’s compliance staff decide what is owed.</Caution>
          </div>
        </>
      )}
    </section>
  );
}

const REASON_RULE = 'must say why the amount is refused (at least 3 characters)';

function ApprovalRow({ a, timeZone, onDecided }: { a: Approval; timeZone: string; onDecided: (words: string) => void }) {
  const decide = useDecideApproval();
  const [reason, setReason] = useState('');
  const [reasonError, setReasonError] = useState<string | null>(null);
  const [refused, setRefused] = useState<FieldProblem[] | null>(null);
  const reasonId = useId();
  const send = (approve: boolean) => {
    // A refusal tells the agent why; an approval may go without a word.
    if (!approve && reason.trim().length < 3) {
      setReasonError(`reason ${REASON_RULE}`);
      return setRefused([{ field: 'reason', rule: REASON_RULE }]);
    }
    setReasonError(null);
    setRefused(null);
    const amount = formatMoney(a.offerMinor, a.currency);
    // Awaited rather than a per-call callback: the row unmounts once the queue refetches, and its callbacks with it.
    decide
      .mutateAsync({ approvalId: a.id, flightId: a.flightId, approve, reason: reason.trim() })
      .then(() =>
        onDecided(approve
          ? `Approved ${amount} for ${a.flight}${a.subject ? ` (${a.subject})` : ''}. ${a.requestedBy} sees it on the flight desk now.`
          : `Rejected ${amount} for ${a.flight}. ${a.requestedBy} sees your reason on the flight desk.`))
      .catch(() => undefined); // shown by <Problem> from the mutation's state
  };
  return (
    <li className="rounded-lg border-2 border-watch p-3" data-testid="approval-row">
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <p className="text-xl">
          {a.flightId !== null && <><Link to={`/flights/${a.flightId}`} className="font-bold text-harbour underline">{a.flight}</Link>: </>}
          {APPROVAL_KIND_WORDS[a.kind]} <strong className="text-3xl tabular-nums">{formatMoney(a.offerMinor, a.currency)}</strong>
          {a.subject && <span className="block text-lg">for {a.subject}</span>}
        </p>
        <p className="text-ink-soft">
          asked by {a.requestedBy} at {formatTime(a.requestedAt, timeZone)}
          {a.limitMinor !== null && <span className="block">their limit: {formatMoney(a.limitMinor, a.currency)}</span>}
        </p>
      </div>
      <div className="mt-3 flex flex-wrap items-end gap-2">
        <label className="block min-w-64 flex-1">
          <span className="mb-1 block font-bold">Reason (needed to reject)</span>
          <input
            id={reasonId} value={reason} onChange={(e) => setReason(e.target.value)} maxLength={200} autoComplete="off"
            aria-invalid={reasonError ? true : undefined}
            className={`w-full rounded-md border-2 bg-card px-3 py-2 text-lg ${reasonError ? 'border-alert' : 'border-line'}`}
          />
        </label>
        <Button disabled={decide.isPending} onClick={() => send(true)}>Approve {formatMoney(a.offerMinor, a.currency)}</Button>
        <Button variant="danger" disabled={decide.isPending} onClick={() => send(false)}>Reject</Button>
      </div>
      {reasonError && <p className="mt-1 font-bold text-alert">{reasonError}</p>}
      <Problem error={decide.error} problems={refused} labels={{ reason: 'Reason (needed to reject)' }} fieldIds={{ reason: reasonId }} />
    </li>
  );
}
