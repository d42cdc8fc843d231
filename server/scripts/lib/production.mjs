// What `npm start` checks before it starts anything with NODE_ENV=production: every secret comes from the
// environment and none is a value this repository ships or generates for local use, and the database holds no demo.

/** Values shipped in this repository (server/src/config/env.ts defaults and the local stand-ins'), never for production. */
const SHIPPED = {
  SESSION_SECRET: [/^test-secret/, /^fuzz-secret/, /^change-?me/i],
  STRIPE_SECRET_KEY: [/^sk_test_local/],
  STRIPE_WEBHOOK_SECRET: [/^whsec_local/],
};

/** The problems with the environment, one line each; empty when it may run in production. */
export function productionEnvProblems(env) {
  const problems = [];
  const need = (name, why) => {
    if (!env[name]?.trim()) problems.push(`${name} is not set: ${why}`);
  };
  need('DATABASE_URL', 'production uses the database you run and back up, never a private one started here');
  need('SESSION_SECRET', 'a secret of at least 32 characters, from your secret store');
  need('STRIPE_SECRET_KEY', 'the payment provider’s live key');
  need('STRIPE_WEBHOOK_SECRET', 'the signing secret of your webhook endpoint at the provider');
  need('SMTP_HOST', 'the mail relay that sends passenger notices');
  need('APP_BASE_URL', 'the public https address of Bumpboard');
  if (env.SESSION_SECRET && env.SESSION_SECRET.length < 32) problems.push('SESSION_SECRET is shorter than 32 characters');
  for (const [name, patterns] of Object.entries(SHIPPED)) {
    if (env[name] && patterns.some((p) => p.test(env[name]))) problems.push(`${name} is a value shipped for local use; set your own`);
  }
  if (env.STRIPE_API_URL) problems.push('STRIPE_API_URL points at a stand-in; leave it empty in production so payments reach the provider');
  if (env.APP_BASE_URL && !env.APP_BASE_URL.startsWith('https://')) problems.push('APP_BASE_URL must be an https:// address (session cookies are Secure)');
  if (env.SIMULATOR && env.SIMULATOR !== 'off') problems.push('SIMULATOR plays invented check-ins; it must be off');
  return problems;
}

/** Signs that the demo was ever loaded into this database: its invented users or its loader's audit rows. */
export async function demoDataIn(databaseUrl) {
  const mysql = await import('mysql2/promise');
  const conn = await mysql.createConnection({ uri: databaseUrl.replace(/^mariadb:/, 'mysql:') });
  try {
    const found = [];
    const ask = async (sql, label) => {
      try {
        const [rows] = await conn.query(sql);
        if (Number(rows[0].n) > 0) found.push(`${rows[0].n} ${label}`);
      } catch (err) {
        if (err?.code !== 'ER_NO_SUCH_TABLE') throw err;
      }
    };
    await ask(`SELECT COUNT(*) AS n FROM users WHERE email LIKE '%@bumpboard.test'`, 'demo user(s) (@bumpboard.test)');
    await ask(`SELECT COUNT(*) AS n FROM audit_log WHERE action IN ('demo.loaded', 'demo.refreshed')`, 'demo load(s) in the audit log');
    await ask(`SELECT COUNT(*) AS n FROM integration_keys WHERE name = 'Demo simulator' AND revoked_at IS NULL`, 'live demo feed key(s)');
    return found;
  } finally {
    await conn.end();
  }
}
