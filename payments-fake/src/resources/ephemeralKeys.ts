import { Router } from 'express';
import { ID_PREFIX, newId } from '../ids.js';
import { paramInvalid, paramMissing, resourceMissing } from '../http/errors.js';
import { endpoint, type RunnerDeps } from '../http/runner.js';
import type { Operation } from '../http/types.js';
import type { EphemeralKeyRecord } from '../store/types.js';
import { nowSeconds, type ResourceDeps } from './context.js';
import { rejectUnknown, requiredString } from './params.js';

/**
 * How long an Issuing ephemeral key reads its card. Stripe documents keys as short-lived without a figure we could
 * cite here; fifteen minutes is the stand-in's own choice (marked: not from a source).
 */
export const EPHEMERAL_KEY_SECONDS = 15 * 60;

export function renderEphemeralKey(key: EphemeralKeyRecord) {
  return {
    id: key.id,
    object: 'ephemeral_key',
    associated_objects: [{ id: key.cardId, type: 'issuing.card' }],
    created: key.created,
    expires: key.expires,
    livemode: false,
    secret: key.secret,
  };
}

// POST /v1/ephemeral_keys with `issuing_card` and `nonce` (stripe-node 23.1 EphemeralKeyCreateParams). Stripe
// requires the nonce for card keys, so a key is bound to the one session that asked for it.
const create =
  (deps: ResourceDeps): Operation =>
  (input) => {
    const p = input.params;
    rejectUnknown(p, ['issuing_card', 'nonce'], ['customer', 'verification_session']);
    const cardId = requiredString(p.issuing_card, 'issuing_card');
    if (p.nonce === undefined || p.nonce === '') throw paramMissing('nonce');
    const nonce = requiredString(p.nonce, 'nonce', 200);
    if (!/^[\w-]{16,200}$/.test(nonce)) throw paramInvalid('nonce', 'expected the single-use nonce made for this card.');
    const card = deps.store.state.cards.get(cardId);
    if (!card) throw resourceMissing('issuing.card', cardId, 'issuing_card');
    const created = nowSeconds(deps);
    const key: EphemeralKeyRecord = {
      id: newId(ID_PREFIX.ephemeralKey),
      secret: newId(ID_PREFIX.ephemeralSecret),
      cardId,
      nonce,
      created,
      expires: created + EPHEMERAL_KEY_SECONDS,
    };
    deps.store.state.ephemeralKeys.set(key.id, key);
    return { status: 200, body: renderEphemeralKey(key) };
  };

export function ephemeralKeysRouter(deps: ResourceDeps, runner: RunnerDeps): Router {
  const router = Router();
  router.post('/', endpoint(create(deps), runner));
  return router;
}

/** The live key behind an `ek_test_…` secret, or null when unknown or expired. */
export function liveEphemeralKey(deps: ResourceDeps, secret: string): EphemeralKeyRecord | null {
  for (const key of deps.store.state.ephemeralKeys.values()) {
    if (key.secret === secret) return key.expires > nowSeconds(deps) ? key : null;
  }
  return null;
}
