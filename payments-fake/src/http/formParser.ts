import { StripeApiError } from './errors.js';

/**
 * A decoded form value: a string leaf, a nested object, or a list built with `key[]=` pushes.
 * Indexed keys (`a[0]`) stay object keys ('0'); resource validators turn them into arrays where the
 * API expects one, so `metadata[0]=x` is never mistaken for an array.
 */
export type FormValue = string | FormObject | FormValue[];
export interface FormObject {
  [key: string]: FormValue;
}

const FORBIDDEN_KEYS = new Set(['__proto__', 'prototype', 'constructor']);

function structureError(key: string): StripeApiError {
  return new StripeApiError(
    400,
    'invalid_request_error',
    `Invalid parameter structure for '${key}': a key is used both as a value and as a nested object.`,
    'parameter_invalid',
    key,
  );
}

function decode(component: string, whole: string): string {
  try {
    return decodeURIComponent(component.replace(/\+/g, ' '));
  } catch {
    throw new StripeApiError(400, 'invalid_request_error', `Malformed percent-encoding in '${whole}'.`, 'parameter_invalid');
  }
}

/** Splits `spending_controls[spending_limits][0][amount]` into its path segments. */
export function splitKey(rawKey: string): string[] {
  const open = rawKey.indexOf('[');
  if (open <= 0) return [rawKey];
  const segments = [rawKey.slice(0, open)];
  const rest = rawKey.slice(open);
  const pattern = /\[([^[\]]*)\]/g;
  let consumed = 0;
  for (const match of rest.matchAll(pattern)) {
    if (match.index !== consumed) break;
    segments.push(match[1]);
    consumed += match[0].length;
  }
  // Anything after the last well-formed bracket (e.g. `a[b]c`) is kept literally, as qs does.
  if (consumed !== rest.length) segments[segments.length - 1] += rest.slice(consumed);
  return segments;
}

function assign(root: FormObject, segments: string[], value: string, rawKey: string): void {
  let node: FormObject | FormValue[] = root;
  for (let i = 0; i < segments.length; i += 1) {
    const segment = segments[i];
    if (FORBIDDEN_KEYS.has(segment)) throw structureError(rawKey);
    const last = i === segments.length - 1;
    if (Array.isArray(node)) {
      if (segment !== '') throw structureError(rawKey);
      if (last) {
        node.push(value);
        return;
      }
      const child: FormObject = {};
      node.push(child);
      node = child;
      continue;
    }
    const nextIsPush = !last && segments[i + 1] === '';
    if (last) {
      if (segment === '') throw structureError(rawKey);
      const existing: FormValue | undefined = Object.hasOwn(node, segment) ? node[segment] : undefined;
      if (existing !== undefined && typeof existing !== 'string') throw structureError(rawKey);
      node[segment] = value; // a repeated scalar key keeps the last value
      return;
    }
    const existing: FormValue | undefined = Object.hasOwn(node, segment) ? node[segment] : undefined;
    if (existing === undefined) {
      const child: FormObject | FormValue[] = nextIsPush ? [] : {};
      node[segment] = child;
      node = child;
    } else if (typeof existing === 'string' || Array.isArray(existing) !== nextIsPush) {
      throw structureError(rawKey);
    } else {
      node = existing;
    }
  }
}

/** Parses an `application/x-www-form-urlencoded` string the way Stripe's API reads the SDK's encoding. */
export function parseForm(input: string): FormObject {
  const root: FormObject = {};
  if (!input) return root;
  for (const pair of input.split('&')) {
    if (!pair) continue;
    const eq = pair.indexOf('=');
    const rawKey = decode(eq === -1 ? pair : pair.slice(0, eq), pair);
    const value = eq === -1 ? '' : decode(pair.slice(eq + 1), pair);
    if (!rawKey) continue;
    assign(root, splitKey(rawKey), value, rawKey);
  }
  return root;
}

/** Deterministic JSON (sorted keys) so two requests with the same parameters compare equal. */
export function canonicalJson(value: FormValue | undefined): string {
  if (value === undefined) return 'null';
  if (typeof value === 'string') return JSON.stringify(value);
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  const keys = Object.keys(value).sort();
  return `{${keys.map((k) => `${JSON.stringify(k)}:${canonicalJson(value[k])}`).join(',')}}`;
}
