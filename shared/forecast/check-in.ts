import { requireProbability } from './validate';

/**
 * Show probability of a booked passenger who has not checked in yet, given the booked show probability q and the
 * share G of eventual show-ups that have checked in by now. Bayes: P(show | not checked in) =
 * q(1 - G) / (q(1 - G) + (1 - q)) = q(1 - G) / (1 - qG). It is q at G = 0 and 0 at G = 1 (everyone who was
 * going to show has checked in); for q = 1 and G = 1 that limit is taken as the value, the case being empty.
 */
export function showProbabilityNotCheckedIn(q: number, checkedInShare: number): number {
  requireProbability(q, 'q');
  requireProbability(checkedInShare, 'checkedInShare');
  if (checkedInShare === 1) return 0;
  return (q * (1 - checkedInShare)) / (1 - q * checkedInShare);
}
