// The fault switch: holds at most one injected failure and tells the SMTP side when to refuse.
import type { SMTPServerError } from 'smtp-server';
import type { FaultPlan, FaultStage } from './fault-spec.js';

/** What GET /api/faults reports. */
export type ActiveFault = FaultPlan & {
  setAt: string;
  /** ISO instant the fault ends by itself, null when it lasts until cleared or used up. */
  until: string | null;
  /** Messages still to refuse, null when not counted. */
  remaining: number | null;
};

/** Called after every change, e.g. to close or reopen the SMTP listener; awaited before set()/clear() resolve. */
export type FaultChangeListener = (fault: ActiveFault | null) => Promise<void> | void;

export class FaultSwitch {
  private fault: ActiveFault | null = null;
  private expiryTimer: NodeJS.Timeout | null = null;

  constructor(
    private readonly onChange: FaultChangeListener,
    private readonly now: () => number = Date.now,
  ) {}

  /** The fault in force, or null. */
  current(): ActiveFault | null {
    if (this.fault?.until && Date.parse(this.fault.until) <= this.now()) this.replace(null);
    return this.fault;
  }

  isDown(): boolean {
    return this.current()?.mode === 'down';
  }

  /** Replaces whatever fault was in force. */
  async set(plan: FaultPlan): Promise<ActiveFault> {
    const setAtMs = this.now();
    const fault: ActiveFault = {
      ...plan,
      setAt: new Date(setAtMs).toISOString(),
      until: plan.seconds === null ? null : new Date(setAtMs + plan.seconds * 1000).toISOString(),
      remaining: plan.mode === 'down' ? null : plan.count,
    };
    await this.replace(fault);
    return fault;
  }

  async clear(): Promise<void> {
    await this.replace(null);
  }

  /**
   * The error to answer with at this stage, or null to let the command through. Each call that returns an
   * error uses up one of a counted fault's messages, so callers ask once per mail transaction.
   */
  takeRejection(stage: FaultStage): SMTPServerError | null {
    const fault = this.current();
    if (fault === null || fault.mode === 'down' || fault.stage !== stage) return null;
    const rejection: SMTPServerError = Object.assign(new Error(fault.message), { responseCode: fault.code });
    if (fault.remaining !== null) {
      fault.remaining -= 1;
      if (fault.remaining <= 0) void this.replace(null);
    }
    return rejection;
  }

  /** Stops the expiry timer without notifying, for shutdown. */
  dispose(): void {
    this.stopTimer();
    this.fault = null;
  }

  private replace(fault: ActiveFault | null): Promise<void> {
    this.stopTimer();
    this.fault = fault;
    if (fault?.until) {
      // A timer (not only the lazy check in current()) so a 'down' fault reopens the listener on time
      // even when nobody asks; unref'd so it never keeps the process alive.
      const delay = Math.max(0, Date.parse(fault.until) - this.now());
      this.expiryTimer = setTimeout(() => {
        if (this.fault === fault) void this.replace(null);
      }, delay);
      this.expiryTimer.unref();
    }
    return Promise.resolve(this.onChange(fault));
  }

  private stopTimer(): void {
    if (this.expiryTimer !== null) clearTimeout(this.expiryTimer);
    this.expiryTimer = null;
  }
}
