// Starts the local mail catcher from the environment and stops it cleanly on SIGINT/SIGTERM.
import path from 'node:path';
import { createMailFake } from './app.js';

const DEFAULT_SMTP_PORT = 4625;
const DEFAULT_HTTP_PORT = 4601;
const DEFAULT_DATA_DIR = '.local/mail-fake';

function readPort(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw.trim() === '') return fallback;
  const port = Number(raw);
  // 0 asks the system for a free port; the chosen ports are printed on start-up.
  if (!Number.isInteger(port) || port < 0 || port > 65_535) {
    throw new Error(`${name}: must be a whole number from 0 to 65535, got "${raw}"`);
  }
  return port;
}

async function main(): Promise<void> {
  const smtpPort = readPort('MAIL_FAKE_SMTP_PORT', DEFAULT_SMTP_PORT);
  const httpPort = readPort('MAIL_FAKE_HTTP_PORT', DEFAULT_HTTP_PORT);
  const dataDir = path.resolve(process.env.MAIL_FAKE_DATA_DIR || DEFAULT_DATA_DIR);

  const mailFake = createMailFake({
    dataDir,
    onError: (error) => console.error(`[mail-fake] SMTP: ${error.message}`),
  });
  const { loaded, skipped } = mailFake.loadReport;
  console.log(`[mail-fake] inbox ${dataDir}: ${loaded} message(s) kept from earlier runs${skipped ? `, ${skipped} unreadable line(s) skipped` : ''}`);

  const ports = await mailFake.listen({ smtpPort, httpPort });
  console.log(`[mail-fake] SMTP on 127.0.0.1:${ports.smtpPort}, inbox page and API on http://127.0.0.1:${ports.httpPort}/`);

  let stopping = false;
  const stop = (signal: string): void => {
    if (stopping) return;
    stopping = true;
    console.log(`[mail-fake] ${signal}: stopping`);
    mailFake.close().then(
      () => process.exit(0),
      (error: Error) => {
        console.error(`[mail-fake] stop failed: ${error.message}`);
        process.exit(1);
      },
    );
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
}

main().catch((error: Error) => {
  console.error(`[mail-fake] could not start: ${error.message}`);
  process.exit(1);
});
