// The fault switch seen from nodemailer: transient and permanent refusals, counted and timed, and a listener
// that goes away and comes back on the same port.
// Reply-code classes come from RFC 5321 section 4.2.1: 4yz "transient negative completion" (the sender may
// retry), 5yz "permanent negative completion" (it should not). 452 and 550 are listed in section 4.2.3.
import net from 'node:net';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { ActiveFault } from '../src/faults.js';
import type { StoredMessage } from '../src/message.js';
import {
  getJson,
  makeTransport,
  probeTcp,
  removeDataDir,
  sendError,
  sendJson,
  startCatcher,
  waitFor,
  type RunningCatcher,
} from './helpers.js';

type MessageList = { count: number; messages: StoredMessage[] };
type FaultReply = { fault: ActiveFault | null; error?: string };

const mail = (tag: string) => ({
  from: 'notices@bumpboard.test',
  to: 'agent@station.test',
  subject: `Fault check ${tag}`,
  text: `body ${tag}`,
  headers: { 'X-Bumpboard-Message-Id': tag },
});

describe('mail catcher fault switch', () => {
  let catcher: RunningCatcher;
  const storedCount = async () => (await getJson<MessageList>(`${catcher.baseUrl}/api/messages`)).body.count;
  const setFault = (body: unknown) => sendJson<FaultReply>('POST', `${catcher.baseUrl}/api/faults`, body);

  beforeAll(async () => {
    catcher = await startCatcher();
  });

  afterEach(async () => {
    await sendJson('DELETE', `${catcher.baseUrl}/api/faults`);
    await catcher.mailFake.inbox.clear();
  });

  afterAll(async () => {
    await catcher.mailFake.close();
    removeDataDir(catcher.dataDir);
  });

  it('452 at RCPT TO: sendMail rejects with a transient code, nothing is stored, delivery works once cleared', async () => {
    const set = await setFault({ mode: 'reject-4xx' });
    expect(set.status).toBe(200);
    expect(set.body.fault).toMatchObject({ mode: 'reject-4xx', code: 452, stage: 'rcpt', remaining: null, until: null });

    const transport = makeTransport(catcher.ports.smtpPort);
    const error = await sendError(transport.sendMail(mail('t452')));
    expect(error.responseCode).toBe(452); // RFC 5321 4.2.3: 452 insufficient system storage
    expect(error.permanent).toBe(false); // RFC 5321 4.2.1: 4yz is transient
    expect(await storedCount()).toBe(0);

    await sendJson('DELETE', `${catcher.baseUrl}/api/faults`);
    await transport.sendMail(mail('t452'));
    expect(await storedCount()).toBe(1);
  });

  it('550 at DATA: sendMail rejects with a permanent code, nothing is stored, delivery works once cleared', async () => {
    await setFault({ mode: 'reject-5xx', stage: 'data' });
    const transport = makeTransport(catcher.ports.smtpPort);
    const error = await sendError(transport.sendMail(mail('t550')));
    expect(error.responseCode).toBe(550); // RFC 5321 4.2.3: 550 mailbox unavailable
    expect(error.permanent).toBe(true); // RFC 5321 4.2.1: 5yz is permanent
    expect(await storedCount()).toBe(0);

    await sendJson('DELETE', `${catcher.baseUrl}/api/faults`);
    await transport.sendMail(mail('t550'));
    expect(await storedCount()).toBe(1);
  });

  it('a counted fault refuses exactly the next N messages, every recipient of each, then ends by itself', async () => {
    await setFault({ mode: 'reject-4xx', count: 2, code: 451 });
    const transport = makeTransport(catcher.ports.smtpPort);
    const twoRecipients = { ...mail('counted'), to: ['a@station.test', 'b@station.test'] };

    expect((await sendError(transport.sendMail(twoRecipients))).responseCode).toBe(451);
    expect((await sendError(transport.sendMail(twoRecipients))).responseCode).toBe(451);
    expect((await getJson<FaultReply>(`${catcher.baseUrl}/api/faults`)).body.fault).toBeNull();

    const info = await transport.sendMail(twoRecipients);
    expect(info.accepted).toEqual(['a@station.test', 'b@station.test']);
    expect(await storedCount()).toBe(1);
  });

  it('a timed fault ends by itself after its seconds', async () => {
    await setFault({ mode: 'reject-5xx', seconds: 0.4 });
    const transport = makeTransport(catcher.ports.smtpPort);
    expect((await sendError(transport.sendMail(mail('timed')))).responseCode).toBe(550);
    await waitFor(async () => (await getJson<FaultReply>(`${catcher.baseUrl}/api/faults`)).body.fault === null);
    await transport.sendMail(mail('timed'));
    expect(await storedCount()).toBe(1);
  });

  it("'down' refuses TCP connections, then listens again on the same port", async () => {
    const port = catcher.ports.smtpPort;
    const set = await setFault({ mode: 'down', seconds: 0.5 });
    expect(set.body.fault).toMatchObject({ mode: 'down' });

    // Nothing listens on the port, so the kernel answers the SYN with a reset: ECONNREFUSED.
    expect(await probeTcp(port)).toBe('ECONNREFUSED');
    const error = await sendError(makeTransport(port).sendMail(mail('down')));
    expect(error.message).toContain('ECONNREFUSED');
    const health = await getJson<{ smtp: { listening: boolean } }>(`${catcher.baseUrl}/api/health`);
    expect(health.body.smtp.listening).toBe(false);

    await waitFor(async () => (await probeTcp(port)) === 'connected');
    await makeTransport(port).sendMail(mail('down'));
    expect(await storedCount()).toBe(1);
  });

  it("'down' ends SMTP sessions already open with 421", async () => {
    const socket = net.connect({ host: '127.0.0.1', port: catcher.ports.smtpPort });
    let received = '';
    socket.on('data', (chunk: Buffer) => {
      received += chunk.toString('latin1');
    });
    // A reset instead of a clean close would still end the session; the close is what the test waits for.
    socket.on('error', () => undefined);
    const closed = new Promise<void>((resolve) => socket.once('close', () => resolve()));
    await waitFor(async () => received.startsWith('220 '));
    await setFault({ mode: 'down' });
    await closed;
    // RFC 5321 section 3.8: 421 "service not available, closing transmission channel".
    expect(received).toMatch(/\r\n421 /);
  });

  it("DELETE /api/faults brings a 'down' listener back at once", async () => {
    await setFault({ mode: 'down' });
    expect(await probeTcp(catcher.ports.smtpPort)).toBe('ECONNREFUSED');
    await sendJson('DELETE', `${catcher.baseUrl}/api/faults`);
    expect(await probeTcp(catcher.ports.smtpPort)).toBe('connected');
  });

  it('rejects a bad fault request with an error naming the field and the rule', async () => {
    const badMode = await setFault({ mode: 'explode' });
    expect(badMode.status).toBe(400);
    expect(badMode.body.error).toMatch(/^mode: must be one of reject-4xx, reject-5xx, down/);

    const wrongClass = await setFault({ mode: 'reject-4xx', code: 550 });
    expect(wrongClass.status).toBe(400);
    expect(wrongClass.body.error).toBe("code: must be between 400 and 499 for mode 'reject-4xx'");

    const countWhileDown = await setFault({ mode: 'down', count: 1 });
    expect(countWhileDown.status).toBe(400);
    expect(countWhileDown.body.error).toMatch(/^count: not allowed with mode 'down'/);

    const notJson = await fetch(`${catcher.baseUrl}/api/faults`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: '{mode:',
    });
    expect(notJson.status).toBe(400);
    expect(((await notJson.json()) as { error: string }).error).toBe('body: not valid JSON');

    expect((await getJson<FaultReply>(`${catcher.baseUrl}/api/faults`)).body.fault).toBeNull();
  });
});
