// The fault request parser and the switch on their own, with a hand-moved clock.
// Default codes: RFC 5321 section 4.2.3 lists 452 (insufficient system storage, a 4yz transient reply) and
// 550 (mailbox unavailable, a 5yz permanent reply); section 4.2.1 defines the two classes.
import { describe, expect, it } from 'vitest';
import { parseFaultRequest, type FaultPlan } from '../src/fault-spec.js';
import { FaultSwitch, type ActiveFault } from '../src/faults.js';

function planOf(body: unknown): FaultPlan {
  const parsed = parseFaultRequest(body);
  if (!parsed.ok) throw new Error(parsed.error);
  return parsed.plan;
}

function errorOf(body: unknown): string {
  const parsed = parseFaultRequest(body);
  if (parsed.ok) throw new Error('expected the request to be refused');
  return parsed.error;
}

describe('parseFaultRequest', () => {
  it('fills in the RFC 5321 default codes and the RCPT TO stage', () => {
    expect(planOf({ mode: 'reject-4xx' })).toMatchObject({ mode: 'reject-4xx', code: 452, stage: 'rcpt', seconds: null, count: null });
    expect(planOf({ mode: 'reject-5xx', stage: 'data', count: 3 })).toMatchObject({ code: 550, stage: 'data', count: 3 });
    expect(planOf({ mode: 'down', seconds: 2 })).toEqual({ mode: 'down', seconds: 2 });
  });

  it('names the field and the rule for each bad value', () => {
    expect(errorOf(null)).toMatch(/^body: must be a JSON object/);
    expect(errorOf([])).toMatch(/^body: must be a JSON object/);
    expect(errorOf({})).toMatch(/^mode: /);
    expect(errorOf({ mode: 'reject-5xx', code: 452 })).toBe("code: must be between 500 and 599 for mode 'reject-5xx'");
    expect(errorOf({ mode: 'reject-4xx', seconds: 0 })).toMatch(/^seconds: /);
    expect(errorOf({ mode: 'reject-4xx', seconds: 86_401 })).toMatch(/^seconds: /);
    expect(errorOf({ mode: 'reject-4xx', count: 1.5 })).toMatch(/^count: /);
    expect(errorOf({ mode: 'reject-4xx', stage: 'mail' })).toMatch(/^stage: must be one of rcpt, data/);
    expect(errorOf({ mode: 'reject-4xx', message: 'two\r\nlines' })).toMatch(/^message: must be printable ASCII on one line/);
    expect(errorOf({ mode: 'down', code: 421 })).toMatch(/^code: not allowed with mode 'down'/);
    expect(errorOf({ mode: 'down', extra: true })).toMatch(/extra/);
  });
});

describe('FaultSwitch', () => {
  function makeSwitch() {
    let nowMs = Date.parse('2030-01-01T00:00:00Z');
    const changes: Array<ActiveFault | null> = [];
    const faults = new FaultSwitch(
      (fault) => {
        changes.push(fault);
      },
      () => nowMs,
    );
    return { faults, changes, advance: (ms: number) => (nowMs += ms) };
  }

  it('answers only at its own stage and carries the code on the error', async () => {
    const { faults } = makeSwitch();
    await faults.set(planOf({ mode: 'reject-4xx', stage: 'data', code: 421 }));
    expect(faults.takeRejection('rcpt')).toBeNull();
    const rejection = faults.takeRejection('data');
    expect(rejection?.responseCode).toBe(421);
    faults.dispose();
  });

  it('uses up a counted fault and then reports no fault', async () => {
    const { faults, changes } = makeSwitch();
    await faults.set(planOf({ mode: 'reject-5xx', count: 2 }));
    expect(faults.takeRejection('rcpt')?.responseCode).toBe(550);
    expect(faults.current()?.remaining).toBe(1);
    expect(faults.takeRejection('rcpt')?.responseCode).toBe(550);
    expect(faults.current()).toBeNull();
    expect(faults.takeRejection('rcpt')).toBeNull();
    expect(changes.at(-1)).toBeNull();
  });

  it('ends a timed fault when its time is up, by the injected clock', async () => {
    const { faults, advance } = makeSwitch();
    const fault = await faults.set(planOf({ mode: 'reject-4xx', seconds: 30 }));
    expect(fault.until).toBe('2030-01-01T00:00:30.000Z'); // derived: set time + 30 s
    advance(29_999);
    expect(faults.takeRejection('rcpt')).not.toBeNull();
    advance(1);
    expect(faults.takeRejection('rcpt')).toBeNull();
    faults.dispose();
  });

  it("tells the listener about 'down' and about its end", async () => {
    const { faults, changes } = makeSwitch();
    await faults.set(planOf({ mode: 'down' }));
    expect(faults.isDown()).toBe(true);
    expect(faults.takeRejection('rcpt')).toBeNull(); // while down nobody reaches RCPT TO
    await faults.clear();
    expect(faults.isDown()).toBe(false);
    expect(changes.map((change) => change?.mode ?? null)).toEqual(['down', null]);
  });
});
