// Caught messages in memory, mirrored to an append-only JSONL file so a restart keeps the inbox.
import { appendFile, writeFile } from 'node:fs/promises';
import { existsSync, mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { matchesFilter, storedMessageSchema, type MessageFilter, type StoredMessage } from './message.js';

export const INBOX_FILE_NAME = 'messages.jsonl';

export interface InboxLoadReport {
  loaded: number;
  /** Lines that were not a valid message, e.g. a half-written last line after a crash. */
  skipped: number;
}

export class Inbox {
  /** Oldest first, the order of the file. */
  private messages: StoredMessage[] = [];
  /** Writes run one after another so lines never interleave and clear() cannot race an append. */
  private writeQueue: Promise<void> = Promise.resolve();

  private constructor(readonly filePath: string) {}

  /** Opens (creating if needed) the inbox in dataDir and reads what an earlier run left there. */
  static open(dataDir: string): { inbox: Inbox; report: InboxLoadReport } {
    mkdirSync(dataDir, { recursive: true });
    const inbox = new Inbox(path.join(dataDir, INBOX_FILE_NAME));
    const report = inbox.loadFromFile();
    return { inbox, report };
  }

  get size(): number {
    return this.messages.length;
  }

  /** Resolves once the message is on disk, so the SMTP reply 250 is only sent for a message that survives a restart. */
  add(message: StoredMessage): Promise<void> {
    return this.enqueue(async () => {
      await appendFile(this.filePath, `${JSON.stringify(message)}\n`, 'utf8');
      this.messages.push(message);
    });
  }

  /** Newest first. */
  list(filter: MessageFilter = {}): StoredMessage[] {
    const matching = this.messages.filter((message) => matchesFilter(message, filter));
    return matching.reverse();
  }

  get(id: string): StoredMessage | undefined {
    return this.messages.find((message) => message.id === id);
  }

  /** Empties memory and file; resolves with how many messages were removed. */
  clear(): Promise<number> {
    return this.enqueue(async () => {
      const removed = this.messages.length;
      await writeFile(this.filePath, '', 'utf8');
      this.messages = [];
      return removed;
    });
  }

  /** Waits for pending writes, used before shutting down. */
  async flush(): Promise<void> {
    await this.writeQueue;
  }

  private enqueue<T>(work: () => Promise<T>): Promise<T> {
    const result = this.writeQueue.then(work);
    this.writeQueue = result.then(
      () => undefined,
      () => undefined,
    );
    return result;
  }

  private loadFromFile(): InboxLoadReport {
    if (!existsSync(this.filePath)) return { loaded: 0, skipped: 0 };
    let skipped = 0;
    for (const line of readFileSync(this.filePath, 'utf8').split('\n')) {
      if (line.trim() === '') continue;
      const parsed = storedMessageSchema.safeParse(safeJsonParse(line));
      if (parsed.success) this.messages.push(parsed.data);
      else skipped += 1;
    }
    return { loaded: this.messages.length, skipped };
  }
}

function safeJsonParse(line: string): unknown {
  try {
    return JSON.parse(line);
  } catch {
    return undefined;
  }
}
