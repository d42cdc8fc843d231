import type { DataSource } from 'typeorm';
import type { RowClaimer } from '../../db/claim-rows';
import type { IssuingProvider } from '../../integrations/payments/issuing-provider';
import type { PassengerPaymentsProvider } from '../../integrations/payments/passenger-provider';

/** What every part of the payments module shares: the database, the provider, the links' address and clock. */
export interface PaymentsContext {
  db: DataSource;
  provider: IssuingProvider;
  /** Fingerprint of the provider account (see providerAccountOf): the worker resumes only its own account's issuances. */
  providerAccount: string;
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

export const WORKER_ACTOR = { label: 'payments worker' };
export const PROVIDER_ACTOR = { label: 'payment provider (webhook)' };
export const PASSENGER_ACTOR = { label: 'passenger (own payment link)' };
