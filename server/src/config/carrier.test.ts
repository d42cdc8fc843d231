import { describe, expect, it } from 'vitest';
import { carrierNameFrom } from './carrier';
import { loadEnv } from './env';

const base = { DATABASE_URL: 'mariadb://x@127.0.0.1/x', SESSION_SECRET: 's'.repeat(32) };

describe('the carrier named in written statements', () => {
  it('comes from configuration, whatever the demo scenario says', () => {
    expect(carrierNameFrom(loadEnv({ ...base, CARRIER_NAME: 'Example Regional' }), true)).toBe('Example Regional');
  });

  it('falls back to the invented demo carrier only in a demo installation, and is required otherwise', () => {
    expect(carrierNameFrom(loadEnv(base), true)).toMatch(/^Larkfield Air/);
    expect(() => carrierNameFrom(loadEnv(base), false)).toThrow(/^Configuration error: CARRIER_NAME/);
  });

  it('refuses an empty name with a message naming the setting', () => {
    expect(() => loadEnv({ ...base, CARRIER_NAME: '  ' })).toThrow(/CARRIER_NAME: CARRIER_NAME must not be empty/);
  });
});
