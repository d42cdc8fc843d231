// The few figures an agent reads off a round at a glance, in words.
import type { Round, VolunteerPolicy } from '@shared/schemas/volunteers';

/** The next posted amount on the station's ladder above the current offer, or null at the top. */
export function nextLadderStep(ladderMinor: readonly number[], currentMinor: number | null) {
  return ladderMinor.find((step) => step > (currentMinor ?? -1)) ?? null;
}

/** An agent may offer up to the limit alone; above it a supervisor approves. Supervisors and admins decide alone. */
export function needsSupervisor(amountMinor: number, policy: Pick<VolunteerPolicy, 'agentLimitMinor'>, role: string | undefined) {
  return role === 'agent' && amountMinor > policy.agentLimitMinor;
}

export function seatsFoundWords(round: Pick<Round, 'accepted' | 'volunteersNeeded'>) {
  return `${round.accepted} of ${round.volunteersNeeded} ${round.volunteersNeeded === 1 ? 'seat' : 'seats'} found`;
}

/** Seats still to find; a party larger than this cannot be accepted whole. */
export function seatsLeft(round: Pick<Round, 'accepted' | 'volunteersNeeded'>) {
  return Math.max(0, round.volunteersNeeded - round.accepted);
}

/** "5 h 20 min", "45 min", "on time" for a planned arrival delay. */
export function delayWords(minutes: number) {
  if (minutes <= 0) return 'on time';
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  if (h === 0) return `${m} min`;
  return m === 0 ? `${h} h` : `${h} h ${m} min`;
}

/** The token at the end of the bid link: the passenger page's public API reads the disclosure with it. */
export function bidLinkToken(bidLink: string) {
  const at = bidLink.lastIndexOf('/offer/');
  return at < 0 ? null : bidLink.slice(at + '/offer/'.length) || null;
}
