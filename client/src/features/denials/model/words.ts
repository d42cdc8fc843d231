// Plain words for the states and protections of denied boarding, so every screen says them the same way.
import type { Denial, DenialProposal } from '@shared/schemas/denials';
import { formatTime } from '../../../lib/format';

export const PROTECTION_WORDS: Record<string, string> = {
  'unaccompanied-minor': 'Unaccompanied minor',
  'disability-or-companion': 'Disability or companion',
  'family-with-child': 'Family with a child',
  'travelling-with-family': 'Travelling with family',
  'not-checked-in': 'Not checked in',
  'checked-in-late': 'Checked in after the deadline',
  'already-denied-on-ticket': 'Already denied on this ticket',
  boarded: 'Boarded',
  volunteered: 'Accepted volunteer',
  'kept-with-party': 'Kept with the party',
};

export const PROPOSAL_STATUS_WORDS: Record<DenialProposal['status'], string> = {
  proposed: 'Waiting for a supervisor',
  changed: 'Changed, waiting for a supervisor',
  authorized: 'Authorized',
  withdrawn: 'Withdrawn',
};

export function minutesWords(minutes: number | null): string {
  if (minutes === null) return 'no alternate';
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  if (h === 0) return `+${m} min`;
  return m === 0 ? `+${h} h` : `+${h} h ${m} min`;
}

/** One line on where a denial stands, for the desk's live list. */
export function denialStatusWords(d: Denial, timeZone: string): string {
  if (d.status === 'removed') return `Removed from the selection${d.changeReason ? `: ${d.changeReason}` : ''}`;
  if (d.status === 'proposed') return 'Waiting for a supervisor';
  const who = d.authorizedBy ? ` by ${d.authorizedBy}` : '';
  const when = d.authorizedAt ? ` at ${formatTime(d.authorizedAt, timeZone)}` : '';
  if (!d.compensation.settled) return `Authorized${who}${when}; not rebooked yet`;
  const where = d.rebooking ? `rebooked on ${d.rebooking.flight} (${minutesWords(d.rebooking.plannedArrivalDelayMinutes)})` : 'no alternate offered';
  const sent = d.statements.filter((s) => s.status === 'sent').length;
  const queued = d.statements.filter((s) => s.status === 'pending').length;
  const mail = sent === d.statements.length ? 'statements sent' : queued > 0 ? `${queued} statement${queued === 1 ? '' : 's'} being sent` : 'statements to print';
  return `Authorized${who}${when}; ${where}; ${mail}`;
}

export const PRIORITY_GROUP_WORDS: Record<string, string> = {
  'unaccompanied-minor': 'Priority: unaccompanied minor',
  'disability-or-companion': 'Priority: disability or companion',
  family: 'Priority: travelling with family',
  'already-denied-on-ticket': 'Priority: already denied on this ticket',
};
