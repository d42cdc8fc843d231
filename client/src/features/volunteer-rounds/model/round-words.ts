// The few figures an agent reads off a round at a glance, in words.
import type { Round, VolunteerPolicy } from '@shared/schemas/volunteers';
import { limitForRole, withinLimit } from '@shared/schemas/approvals';

/** The next posted amount on the station's ladder above the current offer, or null at the top. */
export function nextLadderStep(ladderMinor: readonly number[], currentMinor: number | null) {
  return ladderMinor.find((step) => step > (currentMinor ?? -1)) ?? null;
}

/** Above the user's own limit (the same rule the server's approval gate applies), a supervisor approves. */
export function needsSupervisor(amountMinor: number, policy: Pick<VolunteerPolicy, 'agentLimitMinor' | 'supervisorLimitMinor'>, role: string | undefined) {
  return !withinLimit(limitForRole(role, policy), amountMinor);
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

/** The user's own limit in words, for the hints beside every amount they can set. */
export function limitWords(limitMinor: number | null, money: (m: number) => string) {
  return limitMinor === null ? 'You may set any amount alone.' : `You may set up to ${money(limitMinor)} alone; above that, a supervisor of the station approves first.`;
}
