import type { DataSource } from 'typeorm';
import type { IssuingProvider } from '../../integrations/payments/issuing-provider';
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
}

export function applyEffects(ctx: PaymentsContext, effects: Effects): void {
  if (effects.mail) notifyOutbox();
  if (effects.changed) ctx.changed(effects.changed.flightId, effects.changed.stationId, ['compensations']);
}

export const WORKER_ACTOR = { label: 'payments worker' };
export const PROVIDER_ACTOR = { label: 'payment provider (webhook)' };
