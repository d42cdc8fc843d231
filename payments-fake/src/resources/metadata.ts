import type { FormValue } from '../http/formParser.js';
import { paramInvalid } from '../http/errors.js';

export type Metadata = Record<string, string>;

// Limits from Stripe's metadata guide (docs.stripe.com/metadata): 50 pairs, 40-character keys, 500-character values.
const MAX_KEYS = 50;
const MAX_KEY_LENGTH = 40;
const MAX_VALUE_LENGTH = 500;

/**
 * Applies a `metadata` parameter to the current metadata: keys are merged, an empty value removes a key,
 * and `metadata=` (empty string) clears everything, which is how Stripe lets callers unset metadata.
 */
export function applyMetadata(current: Metadata, value: FormValue | undefined): Metadata {
  if (value === undefined) return current;
  if (value === '') return {};
  if (typeof value === 'string' || Array.isArray(value)) {
    throw paramInvalid('metadata', 'expected a hash of string values (metadata[key]=value).');
  }
  const next: Metadata = { ...current };
  for (const [key, raw] of Object.entries(value)) {
    const param = `metadata[${key}]`;
    if (typeof raw !== 'string') throw paramInvalid(param, 'metadata values must be strings, not nested objects.');
    if (key.length > MAX_KEY_LENGTH) throw paramInvalid(param, `metadata keys must be at most ${MAX_KEY_LENGTH} characters.`);
    if (raw.length > MAX_VALUE_LENGTH) {
      throw paramInvalid(param, `metadata values must be at most ${MAX_VALUE_LENGTH} characters.`);
    }
    if (raw === '') delete next[key];
    else next[key] = raw;
  }
  if (Object.keys(next).length > MAX_KEYS) throw paramInvalid('metadata', `at most ${MAX_KEYS} keys are allowed.`);
  return next;
}

/** Previous values of the keys an update changed, the way `previous_attributes.metadata` reports them. */
export function metadataChanges(before: Metadata, after: Metadata): Metadata | null {
  const changed: Metadata = {};
  let any = false;
  for (const key of new Set([...Object.keys(before), ...Object.keys(after)])) {
    if (before[key] !== after[key]) {
      changed[key] = before[key] ?? '';
      any = true;
    }
  }
  return any ? changed : null;
}
