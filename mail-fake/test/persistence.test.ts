// The inbox survives a restart of the catcher, because every message is appended to a JSONL file first.
import { appendFileSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { INBOX_FILE_NAME } from '../src/inbox.js';
import type { StoredMessage } from '../src/message.js';
import { getJson, makeDataDir, makeTransport, removeDataDir, startCatcher, type RunningCatcher } from './helpers.js';

type MessageList = { count: number; messages: StoredMessage[] };

describe('mail catcher persistence', () => {
  const running: RunningCatcher[] = [];
  const dataDirs: string[] = [];

  afterEach(async () => {
    for (const catcher of running.splice(0)) await catcher.mailFake.close();
    for (const dataDir of dataDirs.splice(0)) removeDataDir(dataDir);
  });

  async function start(dataDir: string, smtpPort = 0): Promise<RunningCatcher> {
    const catcher = await startCatcher(dataDir, smtpPort);
    running.push(catcher);
    return catcher;
  }

  async function stop(catcher: RunningCatcher): Promise<void> {
    running.splice(running.indexOf(catcher), 1);
    await catcher.mailFake.close();
  }

  it('keeps the inbox, in order and field for field, across a restart on the same data dir and port', async () => {
    const dataDir = makeDataDir();
    dataDirs.push(dataDir);
    const first = await start(dataDir);
    const transport = makeTransport(first.ports.smtpPort);
    await transport.sendMail({ from: 'a@bumpboard.test', to: 'one@station.test', subject: 'first', text: '1' });
    await transport.sendMail({
      from: 'a@bumpboard.test',
      to: 'two@station.test',
      subject: 'second',
      html: '<p>2</p>',
      headers: { 'X-Bumpboard-Message-Id': 'keep-2' },
    });
    const before = (await getJson<MessageList>(`${first.baseUrl}/api/messages`)).body;
    await stop(first);

    const second = await start(dataDir, first.ports.smtpPort);
    expect(second.mailFake.loadReport).toEqual({ loaded: 2, skipped: 0 });
    const after = (await getJson<MessageList>(`${second.baseUrl}/api/messages`)).body;
    expect(after).toEqual(before);
    expect(after.messages.map((m) => m.subject)).toEqual(['second', 'first']);

    // New mail after the restart lands beside the old mail.
    await makeTransport(second.ports.smtpPort).sendMail({ from: 'a@bumpboard.test', to: 'three@station.test', subject: 'third', text: '3' });
    expect((await getJson<MessageList>(`${second.baseUrl}/api/messages`)).body.count).toBe(3);
  });

  it('skips an unreadable line, such as one cut short by a crash, and keeps the rest', async () => {
    const dataDir = makeDataDir();
    dataDirs.push(dataDir);
    const first = await start(dataDir);
    await makeTransport(first.ports.smtpPort).sendMail({ from: 'a@bumpboard.test', to: 'x@station.test', subject: 'whole', text: 'w' });
    await stop(first);
    appendFileSync(path.join(dataDir, INBOX_FILE_NAME), '{"id":"half-writ');

    const second = await start(dataDir);
    expect(second.mailFake.loadReport).toEqual({ loaded: 1, skipped: 1 });
    expect(second.mailFake.inbox.list().map((m) => m.subject)).toEqual(['whole']);
  });

  it('a clear is kept too: the file is emptied', async () => {
    const dataDir = makeDataDir();
    dataDirs.push(dataDir);
    const first = await start(dataDir);
    await makeTransport(first.ports.smtpPort).sendMail({ from: 'a@bumpboard.test', to: 'x@station.test', subject: 'gone', text: 'g' });
    await first.mailFake.inbox.clear();
    await stop(first);
    expect(readFileSync(path.join(dataDir, INBOX_FILE_NAME), 'utf8')).toBe('');

    const second = await start(dataDir);
    expect(second.mailFake.inbox.size).toBe(0);
  });
});
