import { describe, expect, it } from 'vitest';
import { DEFAULT_SHOW_UP_PROFILE } from '@shared/schemas/show-up-profile';
import { checkDraft, curvePoints, draftFromProfile, readFraction } from './profile-draft';

describe('the profile draft', () => {
  it('turns the default profile into text and back unchanged', () => {
    const check = checkDraft(draftFromProfile(DEFAULT_SHOW_UP_PROFILE));
    expect(check).toEqual({ ok: true, profile: DEFAULT_SHOW_UP_PROFILE });
  });

  it('reads 0.92, 0,92 and 92 % alike', () => {
    expect([readFraction('0.92'), readFraction('0,92'), readFraction('92 %'), readFraction(' 92%'), readFraction('x'), readFraction('')]).toEqual([0.92, 0.92, 0.92, 0.92, null, null]);
  });

  it('keys each problem as the server names the field, with the shared schema’s rule', () => {
    const d = draftFromProfile(DEFAULT_SHOW_UP_PROFILE);
    d.rates[1].local = '1.5'; // Y
    d.rates[0].connecting = 'abc'; // J
    d.flexibleFareFactor = '2';
    d.curve[2].minutes = '12.5';
    d.checkInCloseMinutes = '300';
    const check = checkDraft(d);
    expect(check.ok).toBe(false);
    if (check.ok) return;
    expect(check.errors).toEqual({
      'bookingRates.local.Y': 'bookingRates.local must be within [0, 1]',
      'bookingRates.connecting.J': 'bookingRates.connecting must be a number',
      flexibleFareFactor: 'flexibleFareFactor must be at most 1.2',
      'checkInCurve.2.0': 'minutes before departure must be a whole number of minutes',
      checkInCloseMinutes: 'checkInCloseMinutes must be at most 240',
    });
  });

  it('says when the curve runs the wrong way, and when a cabin is repeated or not a letter', () => {
    const d = draftFromProfile(DEFAULT_SHOW_UP_PROFILE);
    d.curve[0].minutes = '10';
    d.rates.push({ id: 'x', cabin: 'y', local: '0.9', connecting: '0.9' }, { id: 'z', cabin: '7', local: '0.9', connecting: '0.9' });
    const check = checkDraft(d);
    if (check.ok) throw new Error('expected problems');
    expect(check.errors.checkInCurve).toBe('checkInCurve must list minutes before departure from most to fewest, with shares never falling');
    expect(check.errors['rates.2.cabin']).toBe('cabin Y is listed twice');
    expect(check.errors['rates.3.cabin']).toBe('cabin must be one letter');
  });

  it('draws only the readable curve points, most minutes first', () => {
    const d = draftFromProfile(DEFAULT_SHOW_UP_PROFILE);
    d.curve[1].share = '';
    d.curve.reverse();
    expect(curvePoints(d).map((p) => p.minutes)).toEqual([1440, 240, 120, 60, 45, 30]);
  });
});
