import { Router } from 'express';
import { ID_PREFIX, newId } from '../ids.js';
import { paramInvalid, resourceMissing, StripeApiError } from '../http/errors.js';
import { endpoint, type RunnerDeps } from '../http/runner.js';
import type { Operation } from '../http/types.js';
import type { TransactionObject } from '../store/types.js';
import { nowSeconds, type ResourceDeps } from './context.js';
import { newestFirst, paginate, parseListQuery } from './list.js';
import { optionalString, rejectUnknown } from './params.js';
import { allTimeLimit, spentOnCard } from './render.js';

const OBJECT_NAME = 'issuing.transaction';

export interface SettleRequest {
  /** Minor units spent; defaults to everything left under the card's `all_time` limit. */
  amount?: number;
  merchantName?: string;
}

/**
 * Test helper: the passenger spends on the card. Records an `issuing.transaction` of type `capture`
 * and emits `issuing_transaction.created`. Capture amounts are negative, money leaving the Issuing balance
 * (Stripe Issuing transactions guide, from memory). Spending beyond the `all_time` limit is refused,
 * as the real card would decline it.
 */
export function settleCard(deps: ResourceDeps, cardId: string, request: SettleRequest): TransactionObject {
  const state = deps.store.state;
  const card = state.cards.get(cardId);
  if (!card) throw resourceMissing('issuing.card', cardId);
  if (card.status !== 'active') {
    throw new StripeApiError(400, 'invalid_request_error', `Card ${cardId} is ${card.status}; only active cards can be spent.`, 'card_not_active', 'card');
  }
  const limit = allTimeLimit(card);
  const remaining = limit === null ? null : limit - spentOnCard(card.id, state);
  const amount = request.amount ?? remaining;
  if (amount === null) throw paramInvalid('amount', 'required when the card has no all_time spending limit.');
  if (!Number.isSafeInteger(amount) || amount <= 0) throw paramInvalid('amount', 'must be a positive integer in minor units.');
  if (remaining !== null && amount > remaining) {
    throw paramInvalid('amount', `${amount} exceeds the ${remaining} ${card.currency} left under the card's all_time limit.`);
  }
  return deps.store.mutate(() => {
    const transaction: TransactionObject = {
      id: newId(ID_PREFIX.transaction),
      object: 'issuing.transaction',
      amount: -amount,
      amount_details: { atm_fee: null, cashback_amount: null },
      authorization: null,
      balance_transaction: null,
      card: card.id,
      cardholder: card.cardholder,
      created: nowSeconds(deps),
      currency: card.currency,
      dispute: null,
      livemode: false,
      merchant_amount: -amount,
      merchant_currency: card.currency,
      merchant_data: { category: 'miscellaneous', name: request.merchantName ?? 'Local test merchant', city: null, country: null },
      metadata: {},
      network_data: null,
      type: 'capture',
      wallet: null,
    };
    state.transactions.set(transaction.id, transaction);
    deps.events.emit('issuing_transaction.created', transaction, { requestId: null, idempotencyKey: null, apiVersion: null });
    return transaction;
  });
}

const retrieve =
  (deps: ResourceDeps): Operation =>
  (input) => {
    rejectUnknown(input.params, []);
    const transaction = deps.store.state.transactions.get(input.pathParams.id);
    if (!transaction) throw resourceMissing(OBJECT_NAME, input.pathParams.id);
    return { status: 200, body: transaction };
  };

const list =
  (deps: ResourceDeps): Operation =>
  (input) => {
    const p = input.params;
    const query = parseListQuery(p, ['card', 'cardholder', 'type']);
    const card = optionalString(p.card, 'card');
    const cardholder = optionalString(p.cardholder, 'cardholder');
    const type = optionalString(p.type, 'type');
    const body = paginate(
      newestFirst(deps.store.state.transactions.values()),
      query,
      (t) => (!card || t.card === card) && (!cardholder || t.cardholder === cardholder) && (!type || t.type === type),
      '/v1/issuing/transactions',
      OBJECT_NAME,
    );
    return { status: 200, body };
  };

export function transactionsRouter(deps: ResourceDeps, runner: RunnerDeps): Router {
  const router = Router();
  router.get('/', endpoint(list(deps), runner));
  router.get('/:id', endpoint(retrieve(deps), runner));
  return router;
}
