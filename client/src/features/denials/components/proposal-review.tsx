import { useState } from 'react';
import type { DenialCandidates, DenialProposal } from '@shared/schemas/denials';
import { Button } from '../../../components/ui/button';
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
  /** Supervisors and admins decide; everyone else reads. */
  decides: boolean;
  candidates: DenialCandidates['candidates'];
}

export function ProposalReview({ proposal, flightId, timeZone, userId, decides, candidates }: Props) {
  const [mode, setMode] = useState<'none' | 'change' | 'withdraw'>('none');
  const [error, setError] = useState<string | null>(null);
  const authorize = useAuthorizeDenials(flightId);
  const waiting = proposal.status === 'proposed' || proposal.status === 'changed';
  const ownProposal = userId !== null && proposal.proposedByUserId === userId;
  const pending = proposal.denials.filter((d) => d.status === 'proposed');
  const mayAuthorize = (selectedByUserId: number) => decides && waiting && !ownProposal && selectedByUserId !== userId;

  async function authorizeNow(denialIds?: number[]) {
    setError(null);
    try {
      await authorize.mutateAsync({ proposalId: proposal.id, denialIds });
    } catch (err) {
      setError(err instanceof Error ? err.message : 'Not authorized.');
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
            {!ownProposal && pending.length > 0 && pending.every((d) => mayAuthorize(d.selectedByUserId)) && (
              <Button onClick={() => authorizeNow()} disabled={authorize.isPending}>
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
      {decides && waiting && ownProposal && (
        <p className="mt-2 rounded-md bg-watch-soft px-3 py-2">You proposed these denials: another supervisor must authorize them.</p>
      )}
      {error && <p role="alert" className="mt-2 font-bold text-alert">{error}</p>}
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
