import { Router } from 'express';
import { paramInvalid, resourceMissing } from '../http/errors.js';
import { endpoint, type RunnerDeps } from '../http/runner.js';
import type { Operation } from '../http/types.js';
import type { ResourceDeps } from './context.js';
import { newestFirst, paginate, parseListQuery } from './list.js';
import { asList, optionalString, rejectUnknown } from './params.js';

const OBJECT_NAME = 'event';
// Stripe's events list accepts up to 20 entries in `types` (from memory).
const MAX_TYPES = 20;

/** `issuing_card.*` matches every `issuing_card.` event, as Stripe's `type` filter allows a trailing wildcard. */
function typeMatcher(pattern: string): (type: string) => boolean {
  if (pattern.endsWith('.*')) {
    const prefix = pattern.slice(0, -1);
    return (type) => type.startsWith(prefix);
  }
  return (type) => type === pattern;
}

const list =
  (deps: ResourceDeps): Operation =>
  (input) => {
    const p = input.params;
    const query = parseListQuery(p, ['type', 'types'], ['delivery_success']);
    const type = optionalString(p.type, 'type');
    const types = asList(p.types, 'types').map((entry, index) => {
      if (typeof entry !== 'string' || entry === '') throw paramInvalid(`types[${index}]`, 'expected an event type.');
      return entry;
    });
    if (type && types.length > 0) throw paramInvalid('types', 'use either type or types, not both.');
    if (types.length > MAX_TYPES) throw paramInvalid('types', `at most ${MAX_TYPES} types are allowed.`);
    const matchers = (type ? [type] : types).map(typeMatcher);
    const body = paginate(
      newestFirst(deps.store.state.events.values()),
      query,
      (event) => matchers.length === 0 || matchers.some((matches) => matches(event.type)),
      '/v1/events',
      OBJECT_NAME,
    );
    return { status: 200, body };
  };

const retrieve =
  (deps: ResourceDeps): Operation =>
  (input) => {
    rejectUnknown(input.params, []);
    const event = deps.store.state.events.get(input.pathParams.id);
    if (!event) throw resourceMissing(OBJECT_NAME, input.pathParams.id);
    return { status: 200, body: event };
  };

export function eventsRouter(deps: ResourceDeps, runner: RunnerDeps): Router {
  const router = Router();
  router.get('/', endpoint(list(deps), runner));
  router.get('/:id', endpoint(retrieve(deps), runner));
  return router;
}
