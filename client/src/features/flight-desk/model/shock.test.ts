import { describe, expect, it } from 'vitest';
import { setShockBodySchema } from '@shared/schemas/flight-desk';
import { describeShock, shockChoiceOf, shockFor, WEATHER_DAY_RHO } from './shock';

describe('shock choices', () => {
  it('round-trips each choice through the body the server accepts', () => {
    for (const choice of ['none', 'weather', 'custom'] as const) {
      const shock = shockFor(choice, '0.1');
      expect(setShockBodySchema.safeParse({ shock, reason: 'snow on the roads' }).success).toBe(true);
      expect(shockChoiceOf(shock)).toBe(choice);
    }
  });

  it('reads a weather day as weather, any other correlation as custom', () => {
    expect(shockChoiceOf({ kind: 'beta-binomial', rho: WEATHER_DAY_RHO })).toBe('weather');
    expect(shockChoiceOf({ kind: 'beta-binomial', rho: 0.3 })).toBe('custom');
    expect(shockChoiceOf({ kind: 'scenarios', scenarios: [{ weight: 1, probabilityFactor: 0.9 }] })).toBe('custom');
  });

  it('accepts a decimal comma, as typed on many keyboards', () => expect(shockFor('custom', '0,05')).toEqual({ kind: 'beta-binomial', rho: 0.05 }));

  it('lets the shared schema refuse a correlation out of range, naming the rule', () => {
    const r = setShockBodySchema.safeParse({ shock: shockFor('custom', '1.5'), reason: 'test' });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0].message).toBe('rho must be below 1');
  });

  it('says in words what the model assumes', () => {
    expect(describeShock(null)).toMatch(/independently/);
    expect(describeShock({ kind: 'beta-binomial', rho: WEATHER_DAY_RHO })).toMatch(/^Weather day/);
    expect(describeShock({ kind: 'scenarios', scenarios: [{ weight: 0.3, probabilityFactor: 0.8 }, { weight: 0.7, probabilityFactor: 1 }] })).toBe(
      'Scenarios (30 % chance show rates × 0.8; 70 % chance show rates × 1)',
    );
  });
});
