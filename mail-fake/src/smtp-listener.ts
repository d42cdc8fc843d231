// Owns the SMTP server's TCP listener on loopback: open, close for a 'down' fault, reopen on the same port.
import type { SMTPServer } from 'smtp-server';

export const LOOPBACK_HOST = '127.0.0.1';

/** Reopening can meet a port still held for a moment; retry a bounded number of times, then report. */
const REOPEN_ATTEMPTS = 20;
const REOPEN_RETRY_MS = 250;

export class SmtpListener {
  private boundPort: number | null = null;
  private wantDown = false;
  private reopenError: string | null = null;
  /** Open/close steps run one after another so a quick down-up-down sequence cannot interleave. */
  private steps: Promise<void> = Promise.resolve();
  private closed = false;

  constructor(readonly server: SMTPServer) {}

  /** The port given by the first open(), kept across down/up so clients find the catcher again. */
  get port(): number | null {
    return this.boundPort;
  }

  get listening(): boolean {
    return this.server.server.listening;
  }

  /** Why the last reopen failed, null when it worked. */
  get lastError(): string | null {
    return this.reopenError;
  }

  /** First listen; port 0 picks a free one. Resolves with the port in use. */
  async open(port: number): Promise<number> {
    await this.listenOnce(port);
    const address = this.server.server.address();
    if (address === null || typeof address === 'string') throw new Error('SMTP listener has no TCP address');
    this.boundPort = address.port;
    if (this.wantDown) await this.setDown(true);
    return this.boundPort;
  }

  /** Closes (down) or reopens (up) the listener; never rejects, a failed reopen is kept in lastError. */
  setDown(down: boolean): Promise<void> {
    this.wantDown = down;
    const step = this.steps.then(() => this.applyWantedState());
    this.steps = step;
    return step;
  }

  /** Final shutdown: closes the listener and every open SMTP session. */
  async close(): Promise<void> {
    this.closed = true;
    await this.steps;
    this.dropSessions('Local mail catcher shutting down');
    await new Promise<void>((resolve) => this.server.close(() => resolve()));
  }

  private async applyWantedState(): Promise<void> {
    if (this.closed || this.boundPort === null) return;
    if (this.wantDown && this.listening) {
      // Stop accepting at once; RFC 5321 section 3.8 lets a server end sessions with 421 when it must go away.
      this.server.server.close();
      this.dropSessions('Service not available, closing transmission channel (fault injected)');
      return;
    }
    if (!this.wantDown && !this.listening) await this.reopen(this.boundPort);
  }

  private async reopen(port: number): Promise<void> {
    for (let attempt = 1; attempt <= REOPEN_ATTEMPTS; attempt += 1) {
      try {
        await this.listenOnce(port);
        this.reopenError = null;
        return;
      } catch (error) {
        this.reopenError = `reopening SMTP on ${LOOPBACK_HOST}:${port} failed: ${(error as Error).message}`;
        if (this.wantDown || this.closed) return;
        await new Promise((resolve) => setTimeout(resolve, REOPEN_RETRY_MS));
      }
    }
  }

  private dropSessions(reason: string): void {
    for (const connection of this.server.connections) {
      connection.send(421, reason);
      connection.close();
    }
  }

  private listenOnce(port: number): Promise<void> {
    const tcp = this.server.server;
    return new Promise<void>((resolve, reject) => {
      const onError = (error: Error): void => {
        tcp.off('listening', onListening);
        reject(error);
      };
      const onListening = (): void => {
        tcp.off('error', onError);
        resolve();
      };
      tcp.once('error', onError);
      tcp.once('listening', onListening);
      tcp.listen(port, LOOPBACK_HOST);
    });
  }
}
