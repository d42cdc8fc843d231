// Test helpers: a catcher on ephemeral loopback ports with its own temporary data dir, and a nodemailer
// transport configured the way the Bumpboard server configures it.
import { mkdtempSync, rmSync } from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { createTransport } from 'nodemailer';
import { createMailFake, type BoundPorts, type MailFake } from '../src/app.js';

export interface RunningCatcher {
  mailFake: MailFake;
  ports: BoundPorts;
  baseUrl: string;
  dataDir: string;
}

export function makeDataDir(): string {
  return mkdtempSync(path.join(os.tmpdir(), 'mail-fake-test-'));
}

export function removeDataDir(dataDir: string): void {
  rmSync(dataDir, { recursive: true, force: true });
}

export async function startCatcher(dataDir = makeDataDir(), smtpPort = 0): Promise<RunningCatcher> {
  const mailFake = createMailFake({ dataDir });
  const ports = await mailFake.listen({ smtpPort, httpPort: 0 });
  return { mailFake, ports, baseUrl: `http://127.0.0.1:${ports.httpPort}`, dataDir };
}

/** The server's transport settings; no pooling so each sendMail is one SMTP session. */
export function makeTransport(smtpPort: number) {
  return createTransport({
    host: '127.0.0.1',
    port: smtpPort,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 2000,
    greetingTimeout: 2000,
    socketTimeout: 5000,
  });
}

export async function getJson<T>(url: string): Promise<{ status: number; body: T }> {
  const response = await fetch(url);
  return { status: response.status, body: (await response.json()) as T };
}

export async function sendJson<T>(method: string, url: string, body?: unknown): Promise<{ status: number; body: T }> {
  const response = await fetch(url, {
    method,
    headers: body === undefined ? {} : { 'content-type': 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  return { status: response.status, body: (await response.json()) as T };
}

/** Resolves with the connect error code, or 'connected' when a TCP connection was accepted. */
export function probeTcp(port: number): Promise<string> {
  return new Promise((resolve) => {
    const socket = net.connect({ host: '127.0.0.1', port });
    socket.setTimeout(2000, () => {
      socket.destroy();
      resolve('timeout');
    });
    socket.once('connect', () => {
      socket.destroy();
      resolve('connected');
    });
    socket.once('error', (error: NodeJS.ErrnoException) => resolve(error.code ?? error.message));
  });
}

/** Polls until check() is true; bounded so a broken catcher fails the test instead of hanging it. */
export async function waitFor(check: () => Promise<boolean>, timeoutMs = 5000, stepMs = 50): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (await check()) return;
    await new Promise((resolve) => setTimeout(resolve, stepMs));
  }
  throw new Error(`condition not met within ${timeoutMs} ms`);
}

/** The error nodemailer rejects with; responseCode comes from the server's reply line. */
export interface SmtpSendError extends Error {
  code?: string;
  responseCode?: number;
  permanent?: boolean;
  command?: string;
}

export async function sendError(send: Promise<unknown>): Promise<SmtpSendError> {
  try {
    await send;
  } catch (error) {
    return error as SmtpSendError;
  }
  throw new Error('expected sendMail to be rejected, but it was accepted');
}
