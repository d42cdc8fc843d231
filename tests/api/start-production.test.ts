// `npm start` with NODE_ENV=production refuses, before it starts anything, secrets that are missing or shipped with
// this repository, a payment stand-in, and a database that ever held the invented demo.
// Outside source: OWASP ASVS 5.0 V13 (configuration: secrets from a secret store or the environment, never
// defaults shipped with the code), level 2, requirement wording from memory.
import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';

function start(env: Record<string, string>) {
  const r = spawnSync(process.execPath, ['server/scripts/start.mjs'], {
    env: { PATH: process.env.PATH ?? '', HOME: process.env.HOME ?? '', NODE_ENV: 'production', PORT: '4999', ...env },
    encoding: 'utf8',
    timeout: 60_000,
  });
  return { status: r.status, out: `${r.stdout}${r.stderr}` };
}

const SOUND = {
  SESSION_SECRET: 'a-production-secret-from-the-store-0123456789',
  STRIPE_SECRET_KEY: 'sk_live_from_the_secret_store',
  STRIPE_WEBHOOK_SECRET: 'whsec_from_the_provider_dashboard',
  SMTP_HOST: 'relay.example.test',
  APP_BASE_URL: 'https://bumpboard.example.test',
};

describe('npm start in production', () => {
  it('refuses missing and shipped secrets, each named, and starts nothing', () => {
    const r = start({ SESSION_SECRET: 'test-secret-test-secret-test-secret-42', STRIPE_SECRET_KEY: 'sk_test_local_stand_in', STRIPE_API_URL: 'http://127.0.0.1:4602', APP_BASE_URL: 'http://127.0.0.1:4600' });
    expect(r.status).toBe(1);
    expect(r.out).toContain('refused to start with NODE_ENV=production');
    for (const line of [
      'DATABASE_URL is not set', 'STRIPE_WEBHOOK_SECRET is not set', 'SMTP_HOST is not set',
      'SESSION_SECRET is a value shipped for local use', 'STRIPE_SECRET_KEY is a value shipped for local use',
      'STRIPE_API_URL points at a stand-in', 'APP_BASE_URL must be an https:// address',
    ]) expect(r.out).toContain(line);
    expect(r.out).not.toContain('Bumpboard is running');
  }, 90_000);

  it('refuses a database that holds the demo, even with every secret in order', () => {
    const r = start({ ...SOUND, DATABASE_URL: process.env.DATABASE_URL! });
    expect(r.status).toBe(1);
    expect(r.out).toMatch(/the database holds demo data \(\d+ demo user\(s\)/);
    expect(r.out).not.toContain('Bumpboard is running');
  }, 90_000);
});
