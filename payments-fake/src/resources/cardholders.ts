import { Router } from 'express';
import { ID_PREFIX, newId } from '../ids.js';
import { paramInvalid, resourceMissing } from '../http/errors.js';
import type { FormObject } from '../http/formParser.js';
import { endpoint, type RunnerDeps } from '../http/runner.js';
import type { Operation } from '../http/types.js';
import type { Address, CardholderObject } from '../store/types.js';
import { nowSeconds, originOf, type ResourceDeps } from './context.js';
import { newestFirst, paginate, parseListQuery } from './list.js';
import { applyMetadata } from './metadata.js';
import { asList, asObject, optionalEnum, optionalString, rejectUnknown, requiredString } from './params.js';

const OBJECT_NAME = 'issuing.cardholder';
// From the stripe-node 23.1 parameter docs: the name "will be printed on cards", at most 24 characters,
// "cannot contain any special characters or numbers".
const NAME_MAX = 24;
const NAME_PATTERN = /^\p{L}[\p{L} .'-]*$/u;
const LOCALES = ['de', 'en', 'es', 'fr', 'it'] as const;

function parseAddress(value: FormObject[string] | undefined): Address {
  const param = 'billing[address]';
  if (value === undefined) throw paramInvalid(param, 'a billing address is required.');
  const address = asObject(value, param);
  rejectUnknown(address, ['line1', 'line2', 'city', 'state', 'postal_code', 'country'], [], param);
  const country = requiredString(address.country, `${param}[country]`).toUpperCase();
  if (!/^[A-Z]{2}$/.test(country)) throw paramInvalid(`${param}[country]`, 'expected a two-letter ISO 3166-1 country code.');
  return {
    line1: requiredString(address.line1, `${param}[line1]`, 200),
    line2: optionalString(address.line2, `${param}[line2]`, 200) || null,
    city: requiredString(address.city, `${param}[city]`, 200),
    state: optionalString(address.state, `${param}[state]`, 200) || null,
    postal_code: requiredString(address.postal_code, `${param}[postal_code]`, 20),
    country,
  };
}

function parseIndividual(value: FormObject[string] | undefined): CardholderObject['individual'] {
  if (value === undefined) return null;
  const individual = asObject(value, 'individual');
  rejectUnknown(individual, ['first_name', 'last_name'], ['card_issuing', 'dob', 'verification'], 'individual');
  return {
    first_name: optionalString(individual.first_name, 'individual[first_name]', 100) ?? null,
    last_name: optionalString(individual.last_name, 'individual[last_name]', 100) ?? null,
  };
}

const create =
  (deps: ResourceDeps): Operation =>
  (input) => {
    const p = input.params;
    rejectUnknown(
      p,
      ['name', 'billing', 'email', 'phone_number', 'metadata', 'status', 'type', 'individual', 'preferred_locales'],
      ['company', 'spending_controls'],
    );
    const name = requiredString(p.name, 'name');
    if (name.length > NAME_MAX) throw paramInvalid('name', `must be at most ${NAME_MAX} characters (printed on the card).`);
    if (!NAME_PATTERN.test(name)) throw paramInvalid('name', 'may contain only letters, spaces, hyphens, apostrophes and periods.');
    const billing = asObject(p.billing, 'billing');
    rejectUnknown(billing, ['address'], [], 'billing');
    const address = parseAddress(billing.address);
    const email = optionalString(p.email, 'email', 800);
    if (email && !/^[^@\s]+@[^@\s]+$/.test(email)) throw paramInvalid('email', 'expected an e-mail address.');
    const locales = asList(p.preferred_locales, 'preferred_locales').map((locale, index) =>
      optionalEnum(locale, `preferred_locales[${index}]`, LOCALES) as string,
    );
    const cardholder: CardholderObject = {
      id: newId(ID_PREFIX.cardholder),
      object: 'issuing.cardholder',
      billing: { address },
      company: null,
      created: nowSeconds(deps),
      email: email || null,
      individual: parseIndividual(p.individual),
      livemode: false,
      metadata: applyMetadata({}, p.metadata),
      name,
      phone_number: optionalString(p.phone_number, 'phone_number', 20) || null,
      preferred_locales: locales.length > 0 ? locales : null,
      requirements: { disabled_reason: null, past_due: [] },
      spending_controls: null,
      status: optionalEnum(p.status, 'status', ['active', 'inactive'] as const) ?? 'active',
      type: optionalEnum(p.type, 'type', ['individual', 'company'] as const) ?? 'individual',
    };
    deps.store.state.cardholders.set(cardholder.id, cardholder);
    deps.events.emit('issuing_cardholder.created', cardholder, originOf(input));
    return { status: 200, body: cardholder };
  };

const retrieve =
  (deps: ResourceDeps): Operation =>
  (input) => {
    rejectUnknown(input.params, []);
    const cardholder = deps.store.state.cardholders.get(input.pathParams.id);
    if (!cardholder) throw resourceMissing(OBJECT_NAME, input.pathParams.id);
    return { status: 200, body: cardholder };
  };

const list =
  (deps: ResourceDeps): Operation =>
  (input) => {
    const p = input.params;
    const query = parseListQuery(p, ['email', 'phone_number', 'status', 'type']);
    const email = optionalString(p.email, 'email');
    const phone = optionalString(p.phone_number, 'phone_number');
    const status = optionalEnum(p.status, 'status', ['active', 'inactive', 'blocked'] as const);
    const type = optionalEnum(p.type, 'type', ['individual', 'company'] as const);
    const body = paginate(
      newestFirst(deps.store.state.cardholders.values()),
      query,
      (c) => (!email || c.email === email) && (!phone || c.phone_number === phone) && (!status || c.status === status) && (!type || c.type === type),
      '/v1/issuing/cardholders',
      OBJECT_NAME,
    );
    return { status: 200, body };
  };

export function cardholdersRouter(deps: ResourceDeps, runner: RunnerDeps): Router {
  const router = Router();
  router.post('/', endpoint(create(deps), runner));
  router.get('/', endpoint(list(deps), runner));
  router.get('/:id', endpoint(retrieve(deps), runner));
  return router;
}
