import { useState } from 'react';
import type { DenialCandidates, DenialProposal } from '@shared/schemas/denials';
import { Button } from '../../../components/ui/button';
import { ResultMessage } from '../../../components/ui/form-problems';
import { formatTime } from '../../../lib/format';
import { useAuthorizeDenials } from '../api/denials';
import { PROPOSAL_STATUS_WORDS } from '../model/words';
import { ChangeSelectionForm } from './change-selection-form';
import { DenialCard } from './denial-card';
import { WithdrawForm } from './withdraw-form';

interface Props {
  proposal: DenialProposal;
  flightId: number;
  timeZone: string;
  userId: number | null;
  /** Supervisors and admins change or withdraw the selection; everyone else reads. */
  decides: boolean;
  /** Only a supervisor authorizes an involuntary denial. */
  authorizes: boolean;
  candidates: DenialCandidates['candidates'];
}

export function ProposalReview({ proposal, flightId, timeZone, userId, decides, authorizes, candidates }: Props) {
  const [mode, setMode] = useState<'none' | 'change' | 'withdraw'>('none');
  const waiting = proposal.status === 'proposed' || proposal.status === 'changed';
  const ownProposal = userId !== null && proposal.proposedByUserId === userId;
  const pending = proposal.denials.filter((d) => d.status === 'proposed');
  // The selection as shown: a message about an earlier selection is not shown against a new one.
  const selectionKey = proposal.denials.map((d) => `${d.id}:${d.status}`).join(',');
  const [error, setError] = useState<{ key: string; message: string } | null>(null);
  // The authorize buttons go once the denials are authorized: the words of what happened take their focus.
  const [authorized, setAuthorized] = useState<string | null>(null);
  const authorize = useAuthorizeDenials(flightId);
  const mayAuthorize = (selectedByUserId: number) => authorizes && waiting && !ownProposal && selectedByUserId !== userId;

  /** Always names the denials on screen, so a click never authorizes a selection changed since it was drawn. */
  async function authorizeNow(denialIds: number[]) {
    setError(null);
    setAuthorized(null);
    try {
      await authorize.mutateAsync({ proposalId: proposal.id, denialIds });
      const n = denialIds.length;
      setAuthorized(`Authorized ${n} denial${n === 1 ? '' : 's'} on proposal ${proposal.id}. Next: rebook ${n === 1 ? 'the passenger' : 'each passenger'} below; the compensation and the written statement follow from the new arrival.`);
    } catch (err) {
      setError({ key: selectionKey, message: err instanceof Error ? err.message : 'Not authorized.' });
    }
  }

  return (
    <article className="rounded-lg border-2 border-harbour p-4" aria-label={`Proposal ${proposal.id}`}>
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h3 className="text-xl font-bold">
            Proposal {proposal.id} · <span data-proposal-status={proposal.status}>{PROPOSAL_STATUS_WORDS[proposal.status]}</span>
          </h3>
          <p>
            {proposal.seatsSelected} of {proposal.seatsNeeded} seat{proposal.seatsNeeded === 1 ? '' : 's'} selected · proposed by {proposal.proposedBy} at{' '}
            {formatTime(proposal.proposedAt, timeZone)}: “{proposal.reason}”
          </p>
          {proposal.decidedBy && proposal.decidedAt && (
            <p className="text-sm text-ink-soft">
              Decided by {proposal.decidedBy} at {formatTime(proposal.decidedAt, timeZone)}
            </p>
          )}
        </div>
        {decides && waiting && (
          <div className="flex flex-wrap gap-2 no-print">
            {pending.length > 0 && pending.every((d) => mayAuthorize(d.selectedByUserId)) && (
              <Button onClick={() => authorizeNow(pending.map((d) => d.id))} disabled={authorize.isPending} data-denial-ids={pending.map((d) => d.id).join(' ')}>
                {authorize.isPending ? 'Authorizing…' : `Authorize all (${pending.length})`}
              </Button>
            )}
            <Button variant="secondary" onClick={() => setMode(mode === 'change' ? 'none' : 'change')} aria-expanded={mode === 'change'}>
              Change selection
            </Button>
            <Button variant="quiet" onClick={() => setMode(mode === 'withdraw' ? 'none' : 'withdraw')} aria-expanded={mode === 'withdraw'}>
              Withdraw
            </Button>
          </div>
        )}
      </header>
      {authorizes && waiting && ownProposal && (
        <p className="mt-2 rounded-md bg-watch-soft px-3 py-2">You proposed these denials: another supervisor must authorize them.</p>
      )}
      {decides && !authorizes && waiting && (
        <p className="mt-2 rounded-md bg-harbour-soft px-3 py-2">Authorizing an involuntary denial is a supervisor’s act: a supervisor of this station authorizes it.</p>
      )}
      {error && error.key === selectionKey && <p role="alert" className="mt-2 font-bold text-alert">{error.message}</p>}
      {authorized && (
        <div className="mt-2">
          <ResultMessage text={authorized} />
        </div>
      )}
      {mode === 'change' && <ChangeSelectionForm proposal={proposal} flightId={flightId} candidates={candidates} onDone={() => setMode('none')} />}
      {mode === 'withdraw' && <WithdrawForm proposalId={proposal.id} flightId={flightId} onDone={() => setMode('none')} />}
      <div className="mt-4 space-y-4">
        {proposal.denials.map((d) => (
          <DenialCard
            key={d.id}
            denial={d}
            flightId={flightId}
            timeZone={timeZone}
            decides={decides}
            onAuthorize={mayAuthorize(d.selectedByUserId) && d.status === 'proposed' ? () => authorizeNow([d.id]) : undefined}
            authorizing={authorize.isPending}
          />
        ))}
      </div>
    </article>
  );
}
