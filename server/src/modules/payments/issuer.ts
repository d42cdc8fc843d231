// Issuing one compensation at the provider: a cardholder, then a virtual card whose all_time spending limit is the
// amount. Every call carries a key derived from the compensation, fixed before the first attempt, so the HTTP
// route, the worker and a restarted server all send the same keys and the provider issues one card, however
// often the answer is lost (Stripe docs, "Idempotent requests"; Issuing "Virtual cards" and "Spending controls").
// Every attempt runs under a claim on the row (db/claim-rows), so two processes never call for it at once.
import { CompensationEntity } from '../../db/entities';
import { cardholderName } from '../../integrations/payments/cardholder-name';
import { stationBillingAddress } from '../../integrations/payments/billing-address';
import type { CardSnapshot } from '../../integrations/payments/issuing-provider';
import { classifyProviderError } from '../../integrations/payments/provider-errors';
import { cardKey, cardholderKey } from './compensation-states';
import { compensationRow, type CompensationRow } from './compensation-view';
import { recordIssued, recordRefused, spentOnEarlierCards } from './issuance-record';
import { WORKER_ACTOR, type PaymentsContext } from './payments-context';
import { VOUCHER_CATEGORIES } from './voucher-rules';
import { advancePayout } from '../payouts/payout.service';
import { assertReadyToIssue } from '../agreements/agreement.service';
import { DomainError } from '../../domain/errors';

export interface Issuer {
  /**
   * One attempt for a row in 'issuing', under a claim taken for it; a second call while one runs here joins it, and
   * a row another process holds is left to that process. Never throws.
   */
  attempt(compensationId: number): Promise<void>;
  /** One attempt for a row the caller (the worker) has already claimed with `token`; ends the claim. Never throws. */
  attemptClaimed(compensationId: number, token: string): Promise<void>;
  /** Attempts still running, e.g. for a clean stop. */
  idle(): Promise<void>;
}

function cardMetadata(row: CompensationRow): Record<string, string> {
  return { compensationId: String(row.id), stationId: String(row.station_id), flightId: String(row.flight_id), form: row.form };
}

/**
 * What the provider does for a medium: a card (prepaid, or the restricted card of an agreed voucher) or a bank
 * transfer. Cash, cheque and a travel credit of the carrier's own are handed over at the counter, not here.
 */
export function providerWork(c: Pick<CompensationEntity, 'medium' | 'form'>): 'card' | 'transfer' | null {
  if (c.medium === 'bank-transfer') return 'transfer';
  if (c.medium === 'prepaid-card' || c.form === 'voucher') return 'card';
  return null;
}

/** A claim is not a change of the compensation: its updated_at (the worker's retry clock) stays as it was. */
export const KEEP_UPDATED_AT = 'updated_at = updated_at';

export function createIssuer(ctx: PaymentsContext): Issuer {
  const inFlight = new Map<number, Promise<void>>();

  async function createCard(row: CompensationRow, baseKey: string, cardholderId: string, valueMinor: number): Promise<CardSnapshot> {
    // After a re-issue, what was spent on an earlier (now canceled) card is already paid: the new card holds the rest.
    const spent = await spentOnEarlierCards(ctx.db.manager, row.id);
    return ctx.provider.createCard(
      {
        cardholderId,
        currency: row.currency,
        amountMinor: Math.max(0, valueMinor - spent),
        categories: row.form === 'voucher' ? VOUCHER_CATEGORIES : [],
        metadata: cardMetadata(row),
      },
      cardKey(baseKey),
    );
  }

  async function run(compensationId: number): Promise<void> {
    const entity = await ctx.db.getRepository(CompensationEntity).findOneBy({ id: compensationId });
    if (!entity || entity.state !== 'issuing' || !entity.idempotencyKey) return;
    const work = providerWork(entity);
    if (!work) {
      ctx.log(`[payments] compensation ${compensationId}: paid as ${entity.medium} at the counter, not through the provider`);
      return;
    }
    if (!(await startedUnderThisAccount(compensationId))) {
      ctx.log(`[payments] compensation ${compensationId}: started under another provider account; left for a server configured for it`);
      return;
    }
    // The rule's conditions (and the currencies the provider pays) are checked again right before money moves, and a
    // card holds what they allow: a travel credit's agreed value, never simply the cash amount.
    let valueMinor: number;
    try {
      valueMinor = await assertReadyToIssue(ctx.db.manager, entity);
    } catch (error) {
      // A rule not met is final; anything else (the database busy) is tried again on the next pass.
      if (!(error instanceof DomainError)) throw error;
      await refuse(compensationId, `checking the medium and agreement: ${error.message}`);
      return;
    }
    if (work === 'transfer') return advancePayout(ctx, compensationId);
    const baseKey = entity.idempotencyKey;
    let step = 'preparing the cardholder';
    try {
      const row = await compensationRow(ctx.db, compensationId);
      let cardholderId = entity.providerCardholderId;
      let card: CardSnapshot | undefined;
      if (!cardholderId) {
        let billing;
        try {
          billing = stationBillingAddress({ iata: row.station_iata, name: row.station_name });
        } catch (error) {
          // Reference data, not the network: retrying would only fail again.
          await refuse(compensationId, `${step}: ${(error as Error).message}`);
          return;
        }
        step = 'creating the cardholder';
        const holder = await ctx.provider.createCardholder(
          {
            name: cardholderName(row.first_name ?? '', row.last_name ?? ''),
            email: row.contact_email,
            billing,
            metadata: { compensationId: String(row.id), passengerId: String(row.passenger_id) },
          },
          cardholderKey(baseKey),
        );
        cardholderId = holder.id;
        await ctx.db.query(`UPDATE compensations SET provider_cardholder_id = ? WHERE id = ? AND state = 'issuing' AND provider_cardholder_id IS NULL`, [holder.id, compensationId]);
      } else {
        // A retry: the card may exist although its answer never arrived, or the key's 24 hours at the provider ran out.
        step = 'looking for an earlier card';
        card = (await ctx.provider.cardsOfCardholder(cardholderId)).find((c) => c.compensationId === compensationId && c.status !== 'canceled');
      }
      step = 'creating the card';
      card ??= await createCard(row, baseKey, cardholderId, valueMinor);
      const issued = card;
      step = 'recording the card';
      await ctx.db.transaction((em) => recordIssued(em, compensationId, issued, WORKER_ACTOR, ctx));
    } catch (error) {
      const failure = classifyProviderError(error, step);
      if (failure.retryable) {
        await ctx.db
          .query(`UPDATE compensations SET last_error = ?, updated_at = CURRENT_TIMESTAMP(3) WHERE id = ? AND state = 'issuing'`, [failure.reason, compensationId])
          .catch((e: unknown) => ctx.log(`[payments] compensation ${compensationId}: could not record "${failure.reason}": ${(e as Error).message}`));
        return;
      }
      await refuse(compensationId, failure.reason);
    }
  }

  /** The account on record, claimed for this one when none is (a row moved to 'issuing' by other means). */
  async function startedUnderThisAccount(compensationId: number): Promise<boolean> {
    await ctx.db.query('INSERT IGNORE INTO payment_issuances (compensation_id, provider_account, requested_at) VALUES (?, ?, CURRENT_TIMESTAMP(3))', [compensationId, ctx.providerAccount]);
    const [row]: { provider_account: string }[] = await ctx.db.query('SELECT provider_account FROM payment_issuances WHERE compensation_id = ?', [compensationId]);
    return row?.provider_account === ctx.providerAccount;
  }

  async function refuse(compensationId: number, reason: string): Promise<void> {
    await ctx.db
      .transaction((em) => recordRefused(em, compensationId, reason, WORKER_ACTOR))
      .catch((e: unknown) => ctx.log(`[payments] compensation ${compensationId}: could not record the refusal: ${(e as Error).message}`));
  }

  /** Claims the row for this attempt: null when it is not 'issuing' or another process holds it. */
  async function claim(compensationId: number): Promise<string | null> {
    const claimed = await ctx.claims.compensations.claim({
      limit: 1, leaseMs: ctx.claims.leaseMs, due: `state = 'issuing'`, keys: [compensationId], alsoSet: KEEP_UPDATED_AT,
    });
    return claimed.rows.length === 1 ? claimed.token : null;
  }

  /** Runs under the claim and then ends it, whatever happened; an end that fails leaves the lease to run out. */
  async function underClaim(compensationId: number, token: string | Promise<string | null>): Promise<void> {
    const held = await token;
    if (!held) return;
    try {
      await run(compensationId);
    } finally {
      await endClaim(compensationId, held);
    }
  }

  async function endClaim(compensationId: number, token: string): Promise<void> {
    await ctx.claims.compensations.finish(token, compensationId, KEEP_UPDATED_AT)
      .catch((e: unknown) => ctx.log(`[payments] compensation ${compensationId}: could not end the claim (its lease will): ${(e as Error).message}`));
  }

  function once(compensationId: number, token: () => string | Promise<string | null>): Promise<void> {
    const running = inFlight.get(compensationId);
    if (running) return running;
    const attempt = underClaim(compensationId, token())
      .catch((error: unknown) => ctx.log(`[payments] compensation ${compensationId}: ${(error as Error).message}`))
      .finally(() => inFlight.delete(compensationId));
    inFlight.set(compensationId, attempt);
    return attempt;
  }

  return {
    attempt(compensationId) {
      return once(compensationId, () => claim(compensationId));
    },
    async attemptClaimed(compensationId, token) {
      // Another attempt of this process is under way (a route's, whose own claim may have lost to this one): wait for
      // it, then run under this claim; the run finds the row done, or does what the other could not.
      for (let running = inFlight.get(compensationId); running; running = inFlight.get(compensationId)) await running;
      return once(compensationId, () => token);
    },
    async idle() {
      await Promise.allSettled([...inFlight.values()]);
    },
  };
}
