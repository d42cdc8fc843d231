import { betaBinomialPmf, binomialPmf } from './binomial';
import { addUnitPmf, allOrNoneDistribution, groupUnits, type UnitGroup } from './poisson-binomial';
import { integrateOverShock } from './shock';
import type { CommonShock, ShowUpUnit } from './types';
import {
  requireNonNegativeInteger,
  requirePeopleWithinLimit,
  requirePositiveInteger,
  requireProbability,
  validateShock,
} from './validate';

function meanProbabilityPerPerson(groups: readonly UnitGroup[], total: number): number {
  if (total === 0) return 0;
  let expected = 0;
  for (const g of groups) expected += g.size * g.count * g.probability;
  return expected / total;
}

/**
 * Distribution of the number of people who show up, over 0..total booked people. Units are independent given the
 * shock. With a beta-binomial shock and identical individuals the exact beta-binomial pmf is used; otherwise the
 * common rate is integrated by Gauss-Jacobi quadrature (see betaRateTransform for how each p follows the rate).
 */
export function showUpDistribution(units: ShowUpUnit[], shock?: CommonShock): Float64Array {
  const { groups, total } = groupUnits(units);
  if (shock !== undefined) validateShock(shock);
  if (shock?.kind === 'beta-binomial' && groups.length === 1 && groups[0].size === 1) {
    return betaBinomialPmf(total, groups[0].probability, shock.rho);
  }
  const degree = groups.reduce((sum, g) => sum + g.count, 0);
  return integrateOverShock(shock, { meanProbability: meanProbabilityPerPerson(groups, total), degree, people: total }, (transform) =>
    allOrNoneDistribution(groups, total, transform),
  );
}

/** A party that may split at the airport; see partyShowUp for the model. */
export interface PartyShowUpUnit {
  size: number;
  /** Probability that any one member shows. */
  showProbability: number;
  /** Probability that the party acts as one (all show or none); 1 = always together, 0 = members independent. */
  cohesion: number;
  count?: number;
}

/**
 * Pmf of how many of one party's members show: with probability `cohesion` the party travels as one (all s members
 * with probability p, none otherwise); else each member decides independently with probability p. Either way the
 * mean is s*p; the variance is s p (1-p) [(1 - cohesion) + cohesion * s].
 */
export function partyMemberPmf(size: number, showProbability: number, cohesion: number): Float64Array {
  const independent = binomialPmf(size, showProbability);
  const pmf = new Float64Array(size + 1);
  for (let j = 0; j <= size; j++) pmf[j] = (1 - cohesion) * independent[j];
  pmf[0] += cohesion * (1 - showProbability);
  pmf[size] += cohesion * showProbability;
  return pmf;
}

interface PartyGroup extends UnitGroup {
  cohesion: number;
}

function groupParties(parties: readonly PartyShowUpUnit[]): { groups: PartyGroup[]; total: number } {
  if (!Array.isArray(parties)) throw new RangeError('parties must be an array');
  const byKey = new Map<string, PartyGroup>();
  let total = 0;
  parties.forEach((party, index) => {
    const at = `parties[${index}]`;
    if (party === null || typeof party !== 'object') throw new RangeError(`${at} must be an object`);
    requirePositiveInteger(party.size, `${at}.size`);
    requireProbability(party.showProbability, `${at}.showProbability`);
    requireProbability(party.cohesion, `${at}.cohesion`);
    const count = party.count ?? 1;
    requireNonNegativeInteger(count, `${at}.count`);
    total += party.size * count;
    requirePeopleWithinLimit(total, 'parties');
    if (count === 0) return;
    const key = `${party.size}:${party.showProbability}:${party.cohesion}`;
    const group = byKey.get(key);
    if (group) group.count += count;
    else byKey.set(key, { size: party.size, probability: party.showProbability, cohesion: party.cohesion, count });
  });
  return { groups: [...byKey.values()], total };
}

/**
 * Show-up distribution for parties that can partly show (model in partyMemberPmf), parties independent given the
 * shock. With cohesion 1 for every party it equals showUpDistribution; with cohesion 0 it is the per-person model.
 */
export function partyShowUp(parties: PartyShowUpUnit[], shock?: CommonShock): Float64Array {
  const { groups, total } = groupParties(parties);
  if (shock !== undefined) validateShock(shock);
  const degree = groups.reduce((sum, g) => sum + g.count * g.size, 0);
  return integrateOverShock(shock, { meanProbability: meanProbabilityPerPerson(groups, total), degree, people: total }, (transform) => {
    const pmf = new Float64Array(total + 1);
    pmf[0] = 1;
    let top = 0;
    for (const g of groups) {
      const unitPmf = partyMemberPmf(g.size, transform(g.probability), g.cohesion);
      for (let c = 0; c < g.count; c++) {
        addUnitPmf(pmf, top, unitPmf);
        top += g.size;
      }
    }
    return pmf;
  });
}
