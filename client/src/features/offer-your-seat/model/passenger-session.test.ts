import { describe, expect, it } from 'vitest';
import { forgetPassenger, recallPassenger, rememberPassenger } from './passenger-session';

function memoryStorage(): Storage {
  const m = new Map<string, string>();
  return {
    get length() { return m.size; },
    clear: () => m.clear(),
    getItem: (k) => m.get(k) ?? null,
    key: (i) => [...m.keys()][i] ?? null,
    removeItem: (k) => void m.delete(k),
    setItem: (k, v) => void m.set(k, v),
  };
}

describe('the identified passenger, kept per link', () => {
  it('remembers, recalls and forgets per link token', () => {
    const s = memoryStorage();
    rememberPassenger('link-a', { passengerToken: 'token-aaaaaaaa', names: ['Ada Okafor'] }, s);
    expect(recallPassenger('link-a', s)).toEqual({ passengerToken: 'token-aaaaaaaa', names: ['Ada Okafor'] });
    expect(recallPassenger('link-b', s)).toBeNull();
    forgetPassenger('link-a', s);
    expect(recallPassenger('link-a', s)).toBeNull();
    expect(s.length).toBe(0);
  });

  it('ignores what it cannot read, and survives a storage that refuses', () => {
    const s = memoryStorage();
    s.setItem('bumpboard.offer.x', '{not json');
    expect(recallPassenger('x', s)).toBeNull();
    s.setItem('bumpboard.offer.y', JSON.stringify({ passengerToken: 5 }));
    expect(recallPassenger('y', s)).toBeNull();
    const refusing = { ...memoryStorage(), setItem: () => { throw new Error('quota'); }, getItem: () => { throw new Error('denied'); } } as Storage;
    expect(() => rememberPassenger('z', { passengerToken: 't', names: [] }, refusing)).not.toThrow();
    expect(recallPassenger('z', refusing)).toBeNull();
  });
});
