import type { FormObject, FormValue } from '../http/formParser.js';
import { paramInvalid, paramMissing, paramUnknown, paramUnsupported } from '../http/errors.js';

/** Every endpoint accepts `expand`; the stand-in already returns the objects Bumpboard reads expanded. */
const ALWAYS_ALLOWED = ['expand'];

function join(prefix: string, key: string): string {
  return prefix ? `${prefix}[${key}]` : key;
}

/**
 * Rejects parameters the endpoint does not know, naming the first offender as Stripe does.
 * `unsupported` lists real Stripe parameters this stand-in chooses not to model.
 */
export function rejectUnknown(
  params: FormObject,
  allowed: readonly string[],
  unsupported: readonly string[] = [],
  prefix = '',
): void {
  for (const key of Object.keys(params)) {
    if (allowed.includes(key) || (!prefix && ALWAYS_ALLOWED.includes(key))) continue;
    throw unsupported.includes(key) ? paramUnsupported(join(prefix, key)) : paramUnknown(join(prefix, key));
  }
}

export function optionalString(value: FormValue | undefined, param: string, maxLength = 5000): string | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'string') throw paramInvalid(param, 'expected a string.');
  if (value.length > maxLength) throw paramInvalid(param, `must be at most ${maxLength} characters.`);
  return value;
}

export function requiredString(value: FormValue | undefined, param: string, maxLength = 5000): string {
  const text = optionalString(value, param, maxLength);
  if (text === undefined || text === '') throw paramMissing(param);
  return text;
}

export function optionalEnum<T extends string>(
  value: FormValue | undefined,
  param: string,
  allowed: readonly T[],
): T | undefined {
  const text = optionalString(value, param);
  if (text === undefined) return undefined;
  if (!(allowed as readonly string[]).includes(text)) {
    throw paramInvalid(param, `must be one of ${allowed.join(', ')} (got '${text}').`);
  }
  return text as T;
}

/** Integers arrive as decimal strings; amounts are integer minor units, so no sign, point or exponent. */
export function parseInteger(value: FormValue | undefined, param: string, min: number, max = Number.MAX_SAFE_INTEGER): number {
  if (value === undefined || value === '') throw paramMissing(param);
  if (typeof value !== 'string' || !/^-?\d+$/.test(value)) throw paramInvalid(param, 'expected an integer.');
  const number = Number(value);
  if (!Number.isSafeInteger(number) || number < min || number > max) {
    throw paramInvalid(param, `must be an integer between ${min} and ${max}.`);
  }
  return number;
}

export function asObject(value: FormValue | undefined, param: string): FormObject {
  if (value === undefined) return {};
  if (typeof value === 'string' || Array.isArray(value)) throw paramInvalid(param, 'expected a hash (use param[key]=value).');
  return value;
}

/** Accepts `a[0]=…&a[1]=…` (what the SDK sends) or `a[]=…` pushes; indices must be 0…n-1. */
export function asList(value: FormValue | undefined, param: string): FormValue[] {
  if (value === undefined) return [];
  if (Array.isArray(value)) return value;
  if (typeof value === 'string') {
    if (value === '') return [];
    throw paramInvalid(param, 'expected an array (use param[0]=value).');
  }
  const keys = Object.keys(value);
  const indices = keys.map(Number).sort((a, b) => a - b);
  if (!indices.every((index, position) => Number.isInteger(index) && index === position)) {
    throw paramInvalid(param, 'array indices must be 0, 1, 2, … without gaps.');
  }
  return indices.map((index) => value[String(index)]);
}

const KNOWN_CURRENCIES = new Set(Intl.supportedValuesOf('currency').map((code) => code.toLowerCase()));

/** Three-letter ISO 4217 code (as known to the runtime's ICU data), returned lowercase as Stripe does. */
export function parseCurrency(value: FormValue | undefined, param: string): string {
  const code = requiredString(value, param).toLowerCase();
  if (!/^[a-z]{3}$/.test(code) || !KNOWN_CURRENCIES.has(code)) {
    throw paramInvalid(param, `'${code}' is not an ISO 4217 currency code.`);
  }
  return code;
}

export interface CreatedFilter {
  gt?: number;
  gte?: number;
  lt?: number;
  lte?: number;
}

/** `created=<unix>` or `created[gt|gte|lt|lte]=<unix>`. */
export function parseCreatedFilter(value: FormValue | undefined): CreatedFilter | undefined {
  if (value === undefined) return undefined;
  if (typeof value === 'string') {
    const exact = parseInteger(value, 'created', 0);
    return { gte: exact, lte: exact };
  }
  const range = asObject(value, 'created');
  rejectUnknown(range, ['gt', 'gte', 'lt', 'lte'], [], 'created');
  const filter: CreatedFilter = {};
  for (const bound of ['gt', 'gte', 'lt', 'lte'] as const) {
    if (range[bound] !== undefined) filter[bound] = parseInteger(range[bound], `created[${bound}]`, 0);
  }
  return filter;
}

export function matchesCreated(created: number, filter: CreatedFilter | undefined): boolean {
  if (!filter) return true;
  if (filter.gt !== undefined && !(created > filter.gt)) return false;
  if (filter.gte !== undefined && !(created >= filter.gte)) return false;
  if (filter.lt !== undefined && !(created < filter.lt)) return false;
  if (filter.lte !== undefined && !(created <= filter.lte)) return false;
  return true;
}
