import { describe, expect, it } from 'vitest';
import { bidLinkToken, delayWords, needsSupervisor, nextLadderStep, seatsFoundWords, seatsLeft } from './round-words';

// A ladder of our own: $200 to $1,000 in five steps, agent limit $600 (common practice, no external source).
const LADDER = [20_000, 40_000, 60_000, 80_000, 100_000];

describe('round words', () => {
  it('offers the next ladder step above the current offer, and none at the top', () => {
    expect(nextLadderStep(LADDER, null)).toBe(20_000);
    expect(nextLadderStep(LADDER, 20_000)).toBe(40_000);
    // A custom amount between steps goes on to the next step above it.
    expect(nextLadderStep(LADDER, 45_000)).toBe(60_000);
    expect(nextLadderStep(LADDER, 100_000)).toBeNull();
  });

  it('asks for a supervisor only when an agent goes above the limit', () => {
    const limits = { agentLimitMinor: 60_000, supervisorLimitMinor: null };
    expect(needsSupervisor(60_000, limits, 'agent')).toBe(false);
    expect(needsSupervisor(80_000, limits, 'agent')).toBe(true);
    expect(needsSupervisor(80_000, limits, 'supervisor')).toBe(false);
    // Admins administer; they are no money authority and have the agent limit.
    expect(needsSupervisor(80_000, limits, 'admin')).toBe(true);
    expect(needsSupervisor(150_000, { ...limits, supervisorLimitMinor: 100_000 }, 'supervisor')).toBe(true);
  });

  it('says the progress in words', () => {
    expect(seatsFoundWords({ accepted: 2, volunteersNeeded: 3 })).toBe('2 of 3 seats found');
    expect(seatsFoundWords({ accepted: 0, volunteersNeeded: 1 })).toBe('0 of 1 seat found');
    expect(seatsLeft({ accepted: 2, volunteersNeeded: 3 })).toBe(1);
    expect(seatsLeft({ accepted: 4, volunteersNeeded: 3 })).toBe(0);
  });

  it('spells a planned arrival delay in hours and minutes', () => {
    // Derived: 320 min = 5 h 20 min; 120 min = 2 h.
    expect([delayWords(320), delayWords(120), delayWords(45), delayWords(0)]).toEqual(['5 h 20 min', '2 h', '45 min', 'on time']);
  });

  it('reads the token off the bid link', () => {
    expect(bidLinkToken('http://127.0.0.1:4600/offer/eyJmIjo0fQ.abc-_1')).toBe('eyJmIjo0fQ.abc-_1');
    expect(bidLinkToken('http://127.0.0.1:4600/somewhere')).toBeNull();
    expect(bidLinkToken('http://127.0.0.1:4600/offer/')).toBeNull();
  });
});
