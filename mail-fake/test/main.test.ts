// The command-line entry: starts from the environment on loopback and exits 0 on SIGTERM.
import { spawn, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { getJson, makeDataDir, makeTransport, removeDataDir } from './helpers.js';

const MAIN = fileURLToPath(new URL('../src/main.ts', import.meta.url));
const READY_LINE = /SMTP on 127\.0\.0\.1:(\d+), inbox page and API on http:\/\/127\.0\.0\.1:(\d+)\//;

describe('mail-fake main', () => {
  const dataDir = makeDataDir();
  let child: ChildProcess | null = null;

  afterAll(() => {
    // Only the child this test started, by its own handle, and only if it is still running.
    if (child !== null && child.exitCode === null) child.kill('SIGKILL');
    removeDataDir(dataDir);
  });

  it('listens on the ports it prints, catches mail, and stops cleanly on SIGTERM', async () => {
    const started = spawn(process.execPath, ['--import', 'tsx', MAIN], {
      env: { ...process.env, MAIL_FAKE_SMTP_PORT: '0', MAIL_FAKE_HTTP_PORT: '0', MAIL_FAKE_DATA_DIR: dataDir },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    child = started;
    let output = '';
    started.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
    started.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));

    const [, smtpPort, httpPort] = await new Promise<RegExpMatchArray>((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`main did not start in time; output: ${output}`)), 15_000);
      started.stdout?.on('data', () => {
        const match = output.match(READY_LINE);
        if (match) {
          clearTimeout(timer);
          resolve(match);
        }
      });
      started.once('exit', (code) => {
        clearTimeout(timer);
        reject(new Error(`main exited early with ${code}; output: ${output}`));
      });
    });

    await makeTransport(Number(smtpPort)).sendMail({ from: 'a@bumpboard.test', to: 'b@station.test', subject: 'via main', text: 'm' });
    const health = await getJson<{ messages: number }>(`http://127.0.0.1:${httpPort}/api/health`);
    expect(health.body.messages).toBe(1);

    const exit = new Promise<number | null>((resolve) => started.once('exit', (code) => resolve(code)));
    started.kill('SIGTERM');
    expect(await exit).toBe(0);
    expect(output).toContain('SIGTERM: stopping');
  }, 30_000);
});
