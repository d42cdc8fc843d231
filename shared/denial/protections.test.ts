// Protected groups are the carrier policy Bumpboard enforces (common practice); the boarded rule is
// 14 CFR 250.7 (86 FR 2534); SSR codes are IATA special service request codes (common practice).
import { describe, expect, it } from 'vitest';
import { rankDenialCandidates, type DenialContext, type DenialPassenger, type PriorityRuleInput } from './index';

const context: DenialContext = { tierOrder: ['Silver', 'Gold'], currency: 'EUR', stationTimeZone: 'Europe/Rome', regime: 'us-dot' };
const RULES: PriorityRuleInput[] = [{ factor: 'check-in-time', direction: 'latest-first' }];

function passenger(id: string, overrides: Partial<DenialPassenger> = {}): DenialPassenger {
  return {
    id,
    pnr: `PNR-${id}`,
    partyId: id,
    name: `Traveller ${id}`,
    checkedInAt: '2025-03-01T06:00:00Z',
    boardedAt: null,
    fareMinor: 10_000,
    frequentFlyerTier: null,
    ssrCodes: [],
    alreadyDeniedOnTicket: false,
    volunteered: false,
    ...overrides,
  };
}

function rank(list: DenialPassenger[]) {
  const result = rankDenialCandidates([...list, passenger('control')], RULES, context);
  const candidateIds = result.candidates.flatMap((candidate) => candidate.passengerIds);
  const protections = Object.fromEntries(result.excluded.map((entry) => [entry.passengerId, entry.protection]));
  const reasons = Object.fromEntries(result.excluded.map((entry) => [entry.passengerId, entry.reason]));
  return { candidateIds, protections, reasons };
}

describe('never selected (each excluded with a stated reason)', () => {
  it('unaccompanied minor (SSR UMNR)', () => {
    const { candidateIds, protections, reasons } = rank([passenger('um', { ssrCodes: ['UMNR'] })]);
    expect(candidateIds).toEqual(['control']);
    expect(protections.um).toBe('unaccompanied-minor');
    expect(reasons.um).toContain('UMNR');
  });

  it.each(['WCHR', 'WCHS', 'WCHC', 'BLND', 'DEAF', 'DPNA', 'SVAN', 'ESAN'])('passenger with disability SSR %s and the companion in the same party', (code) => {
    const { candidateIds, protections, reasons } = rank([
      passenger('needs', { partyId: 'D', ssrCodes: [code] }),
      passenger('companion', { partyId: 'D' }),
    ]);
    expect(candidateIds).toEqual(['control']);
    expect(protections).toMatchObject({ needs: 'disability-or-companion', companion: 'disability-or-companion' });
    expect(reasons.needs).toContain(code);
    expect(reasons.companion).toContain('Traveller needs');
  });

  it('SSR codes are matched regardless of case and spacing, and the carrier may add codes', () => {
    expect(rank([passenger('w', { ssrCodes: [' wchr '] })]).protections.w).toBe('disability-or-companion');
    const extra = rankDenialCandidates([passenger('x', { ssrCodes: ['ABCD'] })], RULES, { ...context, extraDisabilitySsrCodes: ['abcd'] });
    expect(extra.excluded[0].protection).toBe('disability-or-companion');
  });

  it.each<[string, Partial<DenialPassenger>]>([
    ['SSR CHLD', { ssrCodes: ['CHLD'] }],
    ['SSR INFT', { ssrCodes: ['INFT'] }],
    ['isChild flag', { isChild: true }],
    ['age 11 (under the default 12)', { age: 11 }],
  ])('family travelling with a child (%s) is kept together and excluded', (_label, childFields) => {
    const { candidateIds, protections } = rank([
      passenger('parent', { partyId: 'F' }),
      passenger('kid', { partyId: 'F', ...childFields }),
    ]);
    expect(candidateIds).toEqual(['control']);
    expect(protections).toMatchObject({ parent: 'family-with-child', kid: 'family-with-child' });
  });

  it('age 12 is not a child under the default, and the age limit is configurable', () => {
    expect(rank([passenger('teen', { age: 12 })]).candidateIds).toContain('teen');
    const strict = rankDenialCandidates([passenger('teen', { age: 15 })], RULES, { ...context, childAgeUnder: 18 });
    expect(strict.candidates).toEqual([]);
  });

  it('a family that agreed to split is still kept together and excluded', () => {
    const { candidateIds } = rank([
      passenger('parent', { partyId: 'F', partySplitAgreed: true }),
      passenger('kid', { partyId: 'F', partySplitAgreed: true, ssrCodes: ['CHLD'] }),
    ]);
    expect(candidateIds).toEqual(['control']);
  });

  it('anyone already denied on the same ticket, and the party kept with them', () => {
    const { candidateIds, protections, reasons } = rank([
      passenger('again', { partyId: 'R', alreadyDeniedOnTicket: true }),
      passenger('friend', { partyId: 'R' }),
    ]);
    expect(candidateIds).toEqual(['control']);
    expect(protections).toMatchObject({ again: 'already-denied-on-ticket', friend: 'kept-with-party' });
    expect(reasons.friend).toContain('already denied once on this ticket');
  });

  it('anyone boarded with an accepted boarding pass (14 CFR 250.7), time in station zone', () => {
    const { candidateIds, protections, reasons } = rank([passenger('onboard', { boardedAt: '2025-03-01T06:55:00Z' })]);
    expect(candidateIds).toEqual(['control']);
    expect(protections.onboard).toBe('boarded');
    expect(reasons.onboard).toContain('07:55');
    expect(reasons.onboard).toContain('14 CFR 250.7');
  });

  it('a boarded member of a party that chose to split protects only themselves', () => {
    const { candidateIds, protections } = rank([
      passenger('b1', { partyId: 'B', partySplitAgreed: true, boardedAt: '2025-03-01T06:55:00Z' }),
      passenger('b2', { partyId: 'B', partySplitAgreed: true }),
    ]);
    expect(candidateIds).toEqual(expect.arrayContaining(['b2', 'control']));
    expect(protections).toEqual({ b1: 'boarded' });
  });

  it('volunteers are handled in the volunteer round, not ranked', () => {
    const { candidateIds, protections } = rank([passenger('vol', { volunteered: true })]);
    expect(candidateIds).toEqual(['control']);
    expect(protections.vol).toBe('volunteered');
  });

  it('without the US regime the boarded reason carries no CFR reference', () => {
    const result = rankDenialCandidates([passenger('onboard', { boardedAt: '2025-03-01T06:55:00Z' })], RULES, { ...context, regime: 'eu-261' });
    expect(result.excluded[0].reason).not.toContain('CFR');
  });
});

// Canada: SOR/2019-150 s.15 sets an order of priority for who is kept on board when volunteers are too few:
// (a) unaccompanied minor, (b) person with a disability and their support person, (c) passenger travelling with
// family members, (d) passenger already denied boarding on the same ticket (text from memory; the order, not an
// exclusion, is what the provision sets). EU: Regulation 261/2004 Art. 11(1) gives priority to persons with reduced
// mobility, their companions and unaccompanied children (from memory).
describe('priority groups are an order, not an exclusion, where the rule says so', () => {
  const ca: DenialContext = { ...context, regime: 'ca-appr', currency: 'CAD', stationTimeZone: 'America/Toronto' };
  const eu: DenialContext = { ...context, regime: 'eu-261' };
  const ids = (result: ReturnType<typeof rankDenialCandidates>) => result.candidates.map((c) => c.unitId);

  it('Canada: everyone outside the groups first, then (d), (c), (b) and the unaccompanied minor last', () => {
    const result = rankDenialCandidates([
      passenger('um', { ssrCodes: ['UMNR'], checkedInAt: '2025-03-01T06:59:00Z' }),
      passenger('needs', { partyId: 'D', ssrCodes: ['WCHR'] }),
      passenger('support', { partyId: 'D' }),
      passenger('mum', { partyId: 'F', name: 'Ana Moreau', familyName: 'Moreau' }),
      passenger('dad', { partyId: 'F', name: 'Luc Moreau', familyName: 'Moreau' }),
      passenger('again', { alreadyDeniedOnTicket: true, checkedInAt: '2025-03-01T06:58:00Z' }),
      passenger('plain', { checkedInAt: '2025-03-01T05:00:00Z' }),
    ], RULES, ca);
    expect(ids(result)).toEqual(['plain', 'again', 'F', 'D', 'um']);
    expect(result.excluded).toEqual([]);
    expect(result.candidates.map((c) => c.priorityGroup)).toEqual([null, 'already-denied-on-ticket', 'family', 'disability-or-companion', 'unaccompanied-minor']);
    expect(result.candidates[2].reasons[1]).toContain('SOR/2019-150 s.15');
  });

  it('Canada: family means any family member, adults included; the US carrier policy needs a child', () => {
    const adults = [
      passenger('a1', { partyId: 'AD', name: 'Ines Roy', familyName: 'Roy' }),
      passenger('a2', { partyId: 'AD', name: 'Paul Roy', familyName: 'Roy' }),
      passenger('solo'),
    ];
    const canada = rankDenialCandidates(adults, RULES, ca);
    expect(canada.candidates.find((c) => c.unitId === 'AD')?.priorityGroup).toBe('family');
    expect(canada.candidates.at(-1)?.unitId).toBe('AD');
    const us = rankDenialCandidates(adults, RULES, context);
    expect(us.candidates.find((c) => c.unitId === 'AD')?.priorityGroup).toBeNull();
  });

  it('Canada: unrelated travellers in one booking are not a family', () => {
    const result = rankDenialCandidates([
      passenger('c1', { partyId: 'CO', name: 'Ines Roy', familyName: 'Roy' }),
      passenger('c2', { partyId: 'CO', name: 'Paul Tremblay', familyName: 'Tremblay' }),
    ], RULES, ca);
    expect(result.candidates[0].priorityGroup).toBeNull();
  });

  it('EU: reduced mobility and unaccompanied children are ranked last, not left out', () => {
    const result = rankDenialCandidates([
      passenger('um', { ssrCodes: ['UMNR'] }),
      passenger('prm', { ssrCodes: ['WCHC'], checkedInAt: '2025-03-01T06:59:00Z' }),
      passenger('control'),
    ], RULES, eu);
    expect(ids(result)).toEqual(['control', 'prm', 'um']);
    expect(result.candidates[1].reasons[1]).toContain('Art. 11(1)');
  });

  it('boarded passengers and volunteers stay out under every regime', () => {
    const result = rankDenialCandidates([
      passenger('onboard', { boardedAt: '2025-03-01T06:55:00Z', ssrCodes: ['UMNR'] }),
      passenger('vol', { volunteered: true }),
      passenger('control'),
    ], RULES, ca);
    expect(ids(result)).toEqual(['control']);
  });
});
