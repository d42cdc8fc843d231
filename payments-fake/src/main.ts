import { resolve } from 'node:path';
import { createPaymentsFake } from './app.js';

function readPort(raw: string | undefined): number {
  const port = Number(raw ?? '4602');
  if (!Number.isInteger(port) || port < 0 || port > 65_535) {
    throw new Error(`PAYMENTS_FAKE_PORT must be an integer between 0 and 65535 (got '${raw}').`);
  }
  return port;
}

function readWebhook(): { url: string; secret: string } | null {
  const url = process.env.PAYMENTS_FAKE_WEBHOOK_URL;
  const secret = process.env.PAYMENTS_FAKE_WEBHOOK_SECRET;
  if (!url) return null;
  if (!secret) throw new Error('PAYMENTS_FAKE_WEBHOOK_SECRET is required when PAYMENTS_FAKE_WEBHOOK_URL is set.');
  return { url, secret };
}

const port = readPort(process.env.PAYMENTS_FAKE_PORT);
const dataDir = resolve(process.env.PAYMENTS_FAKE_DATA_DIR ?? '.local/payments-fake');
const fake = createPaymentsFake({ dataDir, webhook: readWebhook() });
// Express 5 hands listen errors (e.g. EADDRINUSE) to this callback instead of throwing.
const server = fake.app.listen(port, '127.0.0.1', (error?: Error) => {
  if (error) {
    console.error(`payments-fake: cannot listen on 127.0.0.1:${port}: ${error.message}`);
    void fake.close().then(() => process.exit(1));
    return;
  }
  const address = server.address();
  const actualPort = typeof address === 'object' && address ? address.port : port;
  console.log(`payments-fake listening on http://127.0.0.1:${actualPort} (data: ${dataDir})`);
});

let stopping = false;
async function stop(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  console.log(`payments-fake: ${signal} received, stopping`);
  await fake.close();
  server.close();
  server.closeAllConnections();
}

process.on('SIGINT', () => void stop('SIGINT'));
process.on('SIGTERM', () => void stop('SIGTERM'));
