import { randomInt } from 'node:crypto';
import { Router } from 'express';
import { ID_PREFIX, newId } from '../ids.js';
import { paramInvalid, paramMissing, resourceMissing, StripeApiError } from '../http/errors.js';
import { endpoint, type RunnerDeps } from '../http/runner.js';
import type { Operation } from '../http/types.js';
import type { CardRecord } from '../store/types.js';
import { nowSeconds, originOf, type ResourceDeps } from './context.js';
import { newestFirst, paginate, parseListQuery } from './list.js';
import { applyMetadata, metadataChanges } from './metadata.js';
import { asList, optionalEnum, optionalString, parseCurrency, parseInteger, rejectUnknown, requiredString } from './params.js';
import { cardNumberEnding, ensureSecrets } from './cardSecrets.js';
import { liveEphemeralKey } from './ephemeralKeys.js';
import { renderCard, renderSpendingControls } from './render.js';
import { parseSpendingLimits } from './spendingControls.js';

const OBJECT_NAME = 'issuing.card';
// Real Stripe parameters (stripe-node 23.1 CardCreateParams / CardUpdateParams) the stand-in does not model.
const CREATE_UNSUPPORTED = [
  'exp_month',
  'exp_year',
  'financial_account',
  'lifecycle_controls',
  'personalization_design',
  'pin',
  'replacement_for',
  'replacement_reason',
  'second_line',
  'shipping',
];
const UPDATE_UNSUPPORTED = ['financial_account', 'personalization_design', 'pin', 'shipping'];
/** Virtual cards are valid for a few years; three is common practice for issued virtual cards. */
const VALID_YEARS = 3;

function findCard(deps: ResourceDeps, id: string): CardRecord {
  const card = deps.store.state.cards.get(id);
  if (!card) throw resourceMissing(OBJECT_NAME, id);
  return card;
}

const create =
  (deps: ResourceDeps): Operation =>
  (input) => {
    const p = input.params;
    rejectUnknown(p, ['cardholder', 'currency', 'type', 'status', 'spending_controls', 'metadata'], CREATE_UNSUPPORTED);
    const cardholderId = requiredString(p.cardholder, 'cardholder');
    const currency = parseCurrency(p.currency, 'currency');
    const type = optionalEnum(p.type, 'type', ['virtual', 'physical'] as const);
    if (!type) throw paramMissing('type');
    if (type === 'physical') throw paramInvalid('type', 'this stand-in issues virtual cards only (physical cards need shipping).');
    // Stripe's default for a new card is `inactive` (stripe-node 23.1 CardCreateParams.status docs).
    const status = optionalEnum(p.status, 'status', ['active', 'inactive'] as const) ?? 'inactive';
    const spendingLimits = parseSpendingLimits(p.spending_controls) ?? [];
    const metadata = applyMetadata({}, p.metadata);
    if (!deps.store.state.cardholders.has(cardholderId)) throw resourceMissing('issuing.cardholder', cardholderId, 'cardholder');

    const issued = new Date(deps.now());
    const number = cardNumberEnding(String(randomInt(0, 10_000)).padStart(4, '0'));
    const card: CardRecord = {
      id: newId(ID_PREFIX.card),
      object: 'issuing.card',
      brand: 'Visa',
      cancellation_reason: null,
      cardholder: cardholderId,
      created: nowSeconds(deps),
      currency,
      exp_month: issued.getUTCMonth() + 1,
      exp_year: issued.getUTCFullYear() + VALID_YEARS,
      last4: number.slice(-4),
      livemode: false,
      metadata,
      spending_limits: spendingLimits,
      status,
      type: 'virtual',
      number,
      cvc: String(randomInt(0, 1000)).padStart(3, '0'),
    };
    deps.store.state.cards.set(card.id, card);
    const body = renderCard(card, deps.store.state);
    deps.events.emit('issuing_card.created', body, originOf(input));
    return { status: 200, body };
  };

const update =
  (deps: ResourceDeps): Operation =>
  (input) => {
    const p = input.params;
    rejectUnknown(p, ['status', 'cancellation_reason', 'metadata', 'spending_controls'], UPDATE_UNSUPPORTED);
    const card = findCard(deps, input.pathParams.id);
    const status = optionalEnum(p.status, 'status', ['active', 'inactive', 'canceled'] as const);
    const reason = optionalEnum(p.cancellation_reason, 'cancellation_reason', ['lost', 'stolen'] as const);
    const spendingLimits = parseSpendingLimits(p.spending_controls);
    const metadata = applyMetadata(card.metadata, p.metadata);
    if (card.status === 'canceled' && status && status !== 'canceled') {
      throw paramInvalid('status', 'a canceled card cannot be reactivated; issue a new card instead.');
    }
    if (card.status === 'canceled' && spendingLimits) {
      throw paramInvalid('spending_controls', 'a canceled card can no longer be changed.');
    }
    if (reason && (status ?? card.status) !== 'canceled') {
      throw paramInvalid('cancellation_reason', 'only allowed when the card is being canceled (status=canceled).');
    }

    const previous: Record<string, unknown> = {};
    if (status && status !== card.status) {
      previous.status = card.status;
      card.status = status;
    }
    if (reason && reason !== card.cancellation_reason) {
      previous.cancellation_reason = card.cancellation_reason;
      card.cancellation_reason = reason;
    }
    const metadataBefore = metadataChanges(card.metadata, metadata);
    if (metadataBefore) {
      previous.metadata = metadataBefore;
      card.metadata = metadata;
    }
    if (spendingLimits && JSON.stringify(spendingLimits) !== JSON.stringify(card.spending_limits)) {
      previous.spending_controls = renderSpendingControls(card.spending_limits, card.currency);
      card.spending_limits = spendingLimits;
    }
    const body = renderCard(card, deps.store.state);
    if (Object.keys(previous).length > 0) deps.events.emit('issuing_card.updated', body, originOf(input), previous);
    return { status: 200, body };
  };

/**
 * `expand[]=number` / `expand[]=cvc` answer only to an ephemeral key made for this very card, the way a platform
 * without its own card-data compliance reads card details (Stripe Issuing, "Display card details": ephemeral key
 * plus nonce). A secret-key request for them is refused, so no server path can fetch them by accident.
 */
const retrieve =
  (deps: ResourceDeps): Operation =>
  (input) => {
    rejectUnknown(input.params, []);
    const expand = asList(input.params.expand, 'expand');
    const secrets = expand.filter((e): e is 'number' | 'cvc' => e === 'number' || e === 'cvc');
    if (input.ephemeralKey) {
      const key = liveEphemeralKey(deps, input.ephemeralKey);
      if (!key) throw new StripeApiError(401, 'authentication_error', 'This ephemeral key is unknown or has expired.', 'ephemeral_key_expired');
      if (key.cardId !== input.pathParams.id) {
        throw new StripeApiError(403, 'invalid_request_error', 'This ephemeral key was made for another card.', 'ephemeral_key_scope');
      }
    } else if (secrets.length) {
      throw paramInvalid('expand', 'number and cvc are only given to an ephemeral key made for this card.');
    }
    const card = findCard(deps, input.pathParams.id);
    const body: Record<string, unknown> = renderCard(card, deps.store.state);
    if (secrets.length) {
      const { number, cvc } = deps.store.mutate(() => ensureSecrets(card));
      if (secrets.includes('number')) body.number = number;
      if (secrets.includes('cvc')) body.cvc = cvc;
    }
    return { status: 200, body };
  };

const list =
  (deps: ResourceDeps): Operation =>
  (input) => {
    const p = input.params;
    const query = parseListQuery(p, ['cardholder', 'status', 'type', 'last4', 'exp_month', 'exp_year'], ['personalization_design']);
    const cardholder = optionalString(p.cardholder, 'cardholder');
    const status = optionalEnum(p.status, 'status', ['active', 'inactive', 'canceled'] as const);
    const type = optionalEnum(p.type, 'type', ['virtual', 'physical'] as const);
    const last4 = optionalString(p.last4, 'last4', 4);
    const expMonth = p.exp_month === undefined ? undefined : parseInteger(p.exp_month, 'exp_month', 1, 12);
    const expYear = p.exp_year === undefined ? undefined : parseInteger(p.exp_year, 'exp_year', 1970, 9999);
    const page = paginate(
      newestFirst(deps.store.state.cards.values()),
      query,
      (card) =>
        (!cardholder || card.cardholder === cardholder) &&
        (!status || card.status === status) &&
        (!type || card.type === type) &&
        (!last4 || card.last4 === last4) &&
        (expMonth === undefined || card.exp_month === expMonth) &&
        (expYear === undefined || card.exp_year === expYear),
      '/v1/issuing/cards',
      OBJECT_NAME,
    );
    return { status: 200, body: { ...page, data: page.data.map((card) => renderCard(card, deps.store.state)) } };
  };

export function cardsRouter(deps: ResourceDeps, runner: RunnerDeps): Router {
  const router = Router();
  router.post('/', endpoint(create(deps), runner));
  router.get('/', endpoint(list(deps), runner));
  router.get('/:id', endpoint(retrieve(deps), runner));
  router.post('/:id', endpoint(update(deps), runner));
  return router;
}
