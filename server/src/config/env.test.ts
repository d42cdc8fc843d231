// The configuration refuses, in production, any secret that is missing or that this repository publishes; and it
// trusts no proxy unless told which. Yardsticks: OWASP ASVS 5.0 V13.3.1 (secrets from a secrets store or the
// environment, never in code) and V4.1.3 (intermediary headers trusted only from configured proxies), requirement
// numbers from memory.
import { describe, expect, it } from 'vitest';
import { loadEnv } from './env';

const base = { DATABASE_URL: 'mariadb://u:p@127.0.0.1:3306/bumpboard', SESSION_SECRET: 'a-long-random-secret-from-the-vault-0123456789' };
const production = { ...base, NODE_ENV: 'production', STRIPE_SECRET_KEY: 'sk_live_from_the_vault_0123', STRIPE_WEBHOOK_SECRET: 'whsec_from_the_vault_0123' };

describe('secrets in production', () => {
  it('starts with every secret given in the environment', () => {
    expect(loadEnv(production)).toMatchObject({ NODE_ENV: 'production', STRIPE_SECRET_KEY: 'sk_live_from_the_vault_0123' });
  });

  it.each(['STRIPE_SECRET_KEY', 'STRIPE_WEBHOOK_SECRET', 'SESSION_SECRET'])('refuses to start without %s', (name) => {
    const env: Record<string, string> = { ...production };
    delete env[name];
    expect(() => loadEnv(env)).toThrow(new RegExp(`^Configuration error: ${name}: `));
  });

  it.each([
    ['STRIPE_SECRET_KEY', 'sk_test_local'],
    ['STRIPE_SECRET_KEY', 'sk_test_local_stand_in'],
    ['STRIPE_WEBHOOK_SECRET', 'whsec_local_development_secret'],
    ['SESSION_SECRET', 'test-secret-test-secret-test-secret-42'],
  ])('refuses the published development value of %s', (name, value) => {
    expect(() => loadEnv({ ...production, [name]: value })).toThrow(`Configuration error: ${name}: ${name} is a development or test value and may not be used in production`);
  });

  it('keeps the local defaults outside production', () => {
    expect(loadEnv(base)).toMatchObject({ STRIPE_SECRET_KEY: 'sk_test_local', STRIPE_WEBHOOK_SECRET: 'whsec_local_development_secret' });
  });
});

describe('trusted proxies', () => {
  it('trusts none by default', () => {
    expect(loadEnv(base).TRUST_PROXY).toBe(false);
  });

  it.each([
    ['1', 1],
    ['loopback', ['loopback']],
    ['10.0.0.0/8, 192.0.2.7', ['10.0.0.0/8', '192.0.2.7']],
  ])('reads %s', (value, expected) => {
    expect(loadEnv({ ...base, TRUST_PROXY: value }).TRUST_PROXY).toEqual(expected);
  });

  it('refuses a value that names no proxy', () => {
    expect(() => loadEnv({ ...base, TRUST_PROXY: 'everyone' })).toThrow(/^Configuration error: TRUST_PROXY: /);
  });
});
