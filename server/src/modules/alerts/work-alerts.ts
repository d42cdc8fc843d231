// Alerts about work waiting at a station, raised in the transaction that created the work: a passenger volunteered
// from their phone, an amount waits for a supervisor or was decided, a denial proposal waits for a supervisor. Each
// names its subject, and the list shows it open only while that subject still waits (see alerts.service.ts), so no
// path that decides the work (a supervisor, a closed round, a changed offer) has to remember to close the alert.
import { In, type EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import { APPROVAL_KIND_WORDS } from '@shared/schemas/approvals';
import type { AlertKind } from '@shared/schemas/alerts';
import { FlightEntity, PassengerEntity, type DenialProposalEntity, type OfferApprovalEntity, type VolunteerEntity } from '../../db/entities';
import { moneyText } from '../finance/scope';

interface WorkAlert {
  kind: AlertKind;
  stationId: number;
  flightId: number | null;
  subject: { volunteerId: number } | { approvalId: number } | { denialProposalId: number };
  message: string;
}

async function flightLabel(em: EntityManager, flightId: number | null): Promise<string> {
  const flight = flightId ? await em.findOneBy(FlightEntity, { id: flightId }) : null;
  return flight ? `${flight.carrierCode} ${flight.flightNumber}` : 'A flight';
}

/**
 * One row per subject and kind. Raised again (an offer changed, a proposal made anew) it comes back as new: unseen,
 * open, with today's words and time.
 */
async function raise(em: EntityManager, a: WorkAlert): Promise<void> {
  const [column, id] = Object.entries(a.subject)[0] as [string, number];
  const col = { volunteerId: 'volunteer_id', approvalId: 'approval_id', denialProposalId: 'denial_proposal_id' }[column];
  await em.query(
    `INSERT INTO alerts (station_id, flight_id, ${col}, kind, message, dedupe_key) VALUES (?, ?, ?, ?, ?, ?)
     ON DUPLICATE KEY UPDATE message = VALUES(message), created_at = CURRENT_TIMESTAMP(3), resolved_at = NULL, resolution = NULL,
       acknowledged_at = NULL, acknowledged_by_user_id = NULL`,
    [a.stationId, a.flightId, id, a.kind, a.message.slice(0, 400), `${a.kind}:${id}`],
  );
}

/** Only an offer from the passenger's own phone: one an agent typed in is already on that agent's screen. */
export async function raiseVolunteerOffered(em: EntityManager, v: VolunteerEntity, stationId: number, currency: string): Promise<void> {
  if (v.source !== 'passenger-link') return;
  const party = await em.findBy(PassengerEntity, { id: In(v.passengerIds) });
  const names = party.map((p) => `${p.firstName} ${p.lastName}`).join(', ') || 'A passenger';
  const ask = v.askMinor !== null ? `, asking ${moneyText(v.askMinor, currency)}` : '';
  await raise(em, {
    kind: 'volunteer-offered', stationId, flightId: v.flightId, subject: { volunteerId: v.id },
    message: `${await flightLabel(em, v.flightId)}: ${names} offered ${party.length > 1 ? 'their seats' : 'their seat'} from their phone${ask}.`,
  });
}

export async function raiseApprovalWaiting(em: EntityManager, approval: OfferApprovalEntity): Promise<void> {
  const limit = approval.limitMinor !== null ? `, above their limit of ${moneyText(approval.limitMinor, approval.currency ?? '')}` : '';
  await raise(em, {
    kind: 'approval-waiting', stationId: approval.stationId, flightId: approval.flightId, subject: { approvalId: approval.id },
    message: `${await flightLabel(em, approval.flightId)}: ${approval.requestedByLabel} asks to ${APPROVAL_KIND_WORDS[approval.kind].replace(/^./, (c) => c.toLowerCase())} ${moneyText(approval.offerMinor, approval.currency ?? '')}${limit}.`,
  });
}

export async function raiseApprovalDecided(em: EntityManager, approval: OfferApprovalEntity, decider: SessionUser): Promise<void> {
  const verdict = approval.status === 'approved' ? 'approved' : 'declined';
  const reason = approval.reason ? ` Reason: ${approval.reason}` : '';
  await raise(em, {
    kind: 'approval-decided', stationId: approval.stationId, flightId: approval.flightId, subject: { approvalId: approval.id },
    message: `${await flightLabel(em, approval.flightId)}: ${decider.displayName} ${verdict} ${moneyText(approval.offerMinor, approval.currency ?? '')} asked by ${approval.requestedByLabel}.${reason}`,
  });
}

export async function raiseDenialProposed(em: EntityManager, proposal: DenialProposalEntity, seatsSelected: number): Promise<void> {
  await raise(em, {
    kind: 'denial-proposed', stationId: proposal.stationId, flightId: proposal.flightId, subject: { denialProposalId: proposal.id },
    message: `${await flightLabel(em, proposal.flightId)}: ${proposal.proposedByLabel} proposes denying boarding for ${proposal.seatsNeeded} ${proposal.seatsNeeded === 1 ? 'seat' : 'seats'} (${seatsSelected} selected). Reason: ${proposal.reason}`,
  });
}
