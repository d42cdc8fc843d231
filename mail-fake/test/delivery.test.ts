// Delivery through nodemailer and the JSON API that tests use to find what was sent.
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { StoredMessage } from '../src/message.js';
import { getJson, makeTransport, removeDataDir, sendJson, startCatcher, type RunningCatcher } from './helpers.js';

type MessageList = { count: number; messages: StoredMessage[] };

describe('mail catcher delivery and JSON API', () => {
  let catcher: RunningCatcher;

  beforeAll(async () => {
    catcher = await startCatcher();
  });

  afterEach(async () => {
    await catcher.mailFake.inbox.clear();
  });

  afterAll(async () => {
    await catcher.mailFake.close();
    removeDataDir(catcher.dataDir);
  });

  it('stores a message with text, HTML and the stable id header, and serves it by filter and by id', async () => {
    const info = await makeTransport(catcher.ports.smtpPort).sendMail({
      from: 'Bumpboard <notices@bumpboard.test>',
      to: 'agent.one@station.test',
      subject: 'Volunteer offer accepted for flight ZZ 101',
      text: 'Your volunteer offer was accepted.',
      html: '<p>Your volunteer offer was <strong>accepted</strong>.</p>',
      headers: { 'X-Bumpboard-Message-Id': 'notice-7f3a' },
    });
    // RFC 5321 section 4.2.1: a 2yz reply is a positive completion, so the message was taken.
    expect(info.response).toMatch(/^250 /);

    const { body } = await getJson<MessageList>(`${catcher.baseUrl}/api/messages?bumpboardMessageId=notice-7f3a`);
    expect(body.count).toBe(1); // exactly one delivery for this stable id
    const message = body.messages[0];
    expect(message.to).toEqual(['agent.one@station.test']);
    // mailparser renders the From header with the display name quoted.
    expect(message.from).toBe('"Bumpboard" <notices@bumpboard.test>');
    expect(message.subject).toBe('Volunteer offer accepted for flight ZZ 101');
    expect(message.text.trim()).toBe('Your volunteer offer was accepted.');
    expect(message.html).toBe('<p>Your volunteer offer was <strong>accepted</strong>.</p>');
    expect(message.headers['X-Bumpboard-Message-Id']).toBe('notice-7f3a');
    // nodemailer's reply info carries the Message-ID it generated; the catcher must keep the same one.
    expect(message.headers['Message-ID']).toBe(info.messageId);
    expect(info.response).toContain(message.id);

    const byId = await getJson<StoredMessage>(`${catcher.baseUrl}/api/messages/${message.id}`);
    expect(byId.status).toBe(200);
    expect(byId.body).toEqual(message);
  });

  it('lists newest first and filters by envelope recipient and subject text', async () => {
    const transport = makeTransport(catcher.ports.smtpPort);
    await transport.sendMail({ from: 'a@bumpboard.test', to: 'first@station.test', subject: 'Oversale alert ZZ 1', text: 'one' });
    await transport.sendMail({
      from: 'a@bumpboard.test',
      to: 'second@station.test',
      bcc: 'Audit@Station.test',
      subject: 'Denied boarding notice ZZ 2',
      text: 'two',
    });

    const all = await getJson<MessageList>(`${catcher.baseUrl}/api/messages`);
    expect(all.body.messages.map((m) => m.text.trim())).toEqual(['two', 'one']);

    // Bcc recipients appear only in the envelope, which is what `to` holds; the match ignores case.
    // RFC 5321 section 2.4: domains are case-insensitive (lower-cased on the way), local parts are kept.
    const audit = await getJson<MessageList>(`${catcher.baseUrl}/api/messages?to=audit@station.test`);
    expect(audit.body.count).toBe(1);
    expect(audit.body.messages[0].to).toEqual(['second@station.test', 'Audit@station.test']);

    const bySubject = await getJson<MessageList>(`${catcher.baseUrl}/api/messages?subject=oversale`);
    expect(bySubject.body.messages.map((m) => m.subject)).toEqual(['Oversale alert ZZ 1']);
  });

  it('counts a repeated stable id twice, so a double send is visible', async () => {
    const transport = makeTransport(catcher.ports.smtpPort);
    const mail = { from: 'a@bumpboard.test', to: 'x@station.test', subject: 's', text: 't', headers: { 'X-Bumpboard-Message-Id': 'dup-1' } };
    await transport.sendMail(mail);
    await transport.sendMail(mail);
    const { body } = await getJson<MessageList>(`${catcher.baseUrl}/api/messages?bumpboardMessageId=dup-1`);
    expect(body.count).toBe(2);
  });

  it('clears the inbox with DELETE /api/messages', async () => {
    await makeTransport(catcher.ports.smtpPort).sendMail({ from: 'a@bumpboard.test', to: 'x@station.test', subject: 's', text: 't' });
    const cleared = await sendJson<{ cleared: number }>('DELETE', `${catcher.baseUrl}/api/messages`);
    expect(cleared.body.cleared).toBe(1);
    const { body } = await getJson<MessageList>(`${catcher.baseUrl}/api/messages`);
    expect(body.count).toBe(0);
  });

  it('answers bad filters and unknown ids with an error naming the field', async () => {
    const unknownFilter = await getJson<{ error: string }>(`${catcher.baseUrl}/api/messages?recipient=x`);
    expect(unknownFilter.status).toBe(400);
    expect(unknownFilter.body.error).toContain('recipient');

    const repeated = await getJson<{ error: string }>(`${catcher.baseUrl}/api/messages?to=a@x.test&to=b@x.test`);
    expect(repeated.status).toBe(400);
    expect(repeated.body.error).toMatch(/^to: /);

    const missing = await getJson<{ error: string }>(`${catcher.baseUrl}/api/messages/no-such-id`);
    expect(missing.status).toBe(404);
    expect(missing.body.error).toMatch(/^id: /);
  });

  it('reports health with the SMTP port and message count', async () => {
    const { body } = await getJson<{ ok: boolean; smtp: { port: number; listening: boolean }; messages: number }>(
      `${catcher.baseUrl}/api/health`,
    );
    expect(body).toMatchObject({ ok: true, smtp: { port: catcher.ports.smtpPort, listening: true }, messages: 0 });
  });
});
