import type { DataSource } from 'typeorm';
import type { RowClaimer } from '../../db/claim-rows';
import type { IssuingProvider } from '../../integrations/payments/issuing-provider';
import type { PassengerPaymentsProvider } from '../../integrations/payments/passenger-provider';
import { notifyOutbox } from '../outbox/outbox-signal';
import type { Effects } from './issuance-record';

/** What every part of the payments module shares: the database, the provider, and how to tell the consoles. */
export interface PaymentsContext {
  db: DataSource;
  provider: IssuingProvider;
  /** Fingerprint of the provider account (see providerAccountOf): the worker resumes only its own account's issuances. */
  providerAccount: string;
  /** After a commit: live consoles refetch the flight's compensations. */
  changed: (flightId: number, stationId: number, topics: string[]) => void;
  log: (line: string) => void;
  /** Card details and bank transfers, the provider's parts that serve the passenger directly. */
  passenger: PassengerPaymentsProvider;
  /** Where the passenger's links point (the app's public address). */
  appBaseUrl: string;
  /** The clock the passenger's links expire by; tests step it forward. */
  now: () => number;
  /**
   * Claims on the rows this process pays (see db/claim-rows), so two processes never call the provider for the same
   * compensation or transfer at once, and a dead process's rows are taken up after the lease.
   */
  claims: { compensations: RowClaimer; payouts: RowClaimer; leaseMs: number };
}

export function applyEffects(ctx: PaymentsContext, effects: Effects): void {
  if (effects.mail) notifyOutbox();
  if (effects.changed) ctx.changed(effects.changed.flightId, effects.changed.stationId, ['compensations']);
}

export const WORKER_ACTOR = { label: 'payments worker' };
export const PROVIDER_ACTOR = { label: 'payment provider (webhook)' };
export const PASSENGER_ACTOR = { label: 'passenger (own payment link)' };
