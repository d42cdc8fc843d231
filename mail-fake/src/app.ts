// Wires the mail catcher together: inbox, fault switch, SMTP listener and HTTP app, all on loopback.
import http from 'node:http';
import type express from 'express';
import { FaultSwitch } from './faults.js';
import { createHttpApp } from './http-app.js';
import { Inbox, type InboxLoadReport } from './inbox.js';
import { createSmtpServer, DEFAULT_MAX_MESSAGE_BYTES } from './smtp-handlers.js';
import { LOOPBACK_HOST, SmtpListener } from './smtp-listener.js';

export interface MailFakeOptions {
  /** Folder for messages.jsonl; created if missing. */
  dataDir: string;
  /** Largest message accepted; larger ones get 552 (RFC 1870 SIZE). */
  maxMessageBytes?: number;
  /** SMTP-level errors such as a client resetting its connection; ignored when not given. */
  onError?: (error: Error) => void;
}

export interface ListenPorts {
  /** 0 or absent picks a free port. */
  smtpPort?: number;
  httpPort?: number;
}

export interface BoundPorts {
  smtpPort: number;
  httpPort: number;
}

export interface MailFake {
  smtp: SmtpListener;
  http: express.Express;
  inbox: Inbox;
  faults: FaultSwitch;
  /** What reading the data dir found at start-up. */
  loadReport: InboxLoadReport;
  /** Listens on 127.0.0.1 only. */
  listen(ports?: ListenPorts): Promise<BoundPorts>;
  close(): Promise<void>;
}

export function createMailFake(options: MailFakeOptions): MailFake {
  const { inbox, report } = Inbox.open(options.dataDir);
  const onError = options.onError ?? (() => undefined);
  // The SMTP handlers need the switch and the switch needs the listener; the holder breaks the cycle.
  const holder: { smtp?: SmtpListener } = {};
  const faults = new FaultSwitch((fault) => holder.smtp?.setDown(fault?.mode === 'down'));
  const smtp = new SmtpListener(
    createSmtpServer({ inbox, faults, maxMessageBytes: options.maxMessageBytes ?? DEFAULT_MAX_MESSAGE_BYTES, onError }),
  );
  holder.smtp = smtp;

  const httpApp = createHttpApp({
    inbox,
    faults,
    status: () => ({ smtpPort: smtp.port, smtpListening: smtp.listening, fault: faults.current() }),
  });
  let httpServer: http.Server | null = null;

  return {
    smtp,
    http: httpApp,
    inbox,
    faults,
    loadReport: report,

    async listen(ports: ListenPorts = {}): Promise<BoundPorts> {
      const smtpPort = await smtp.open(ports.smtpPort ?? 0);
      httpServer = http.createServer(httpApp);
      const httpPort = await listenHttp(httpServer, ports.httpPort ?? 0);
      return { smtpPort, httpPort };
    },

    async close(): Promise<void> {
      faults.dispose();
      await smtp.close();
      if (httpServer !== null) {
        const server = httpServer;
        httpServer = null;
        server.closeAllConnections();
        await new Promise<void>((resolve) => server.close(() => resolve()));
      }
      await inbox.flush();
    },
  };
}

function listenHttp(server: http.Server, port: number): Promise<number> {
  return new Promise<number>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, LOOPBACK_HOST, () => {
      server.off('error', reject);
      const address = server.address();
      if (address === null || typeof address === 'string') reject(new Error('HTTP listener has no TCP address'));
      else resolve(address.port);
    });
  });
}
