// Every amount the API accepts: an integer number of minor units of its currency, never a decimal or a string.
import { z } from 'zod';
import { MAX_AMOUNT_MINOR } from '../money/parse';

/** An amount field; each message names the field and the rule ("offerMinor must not be negative"). */
export function minorAmountSchema(field: string) {
  return z
    .number({ error: (issue) => (issue.input === undefined ? `${field} is required` : `${field} must be a number of minor units, not text`) })
    .int({ error: `${field} must be a whole number of minor units (e.g. cents)` })
    .min(0, { error: `${field} must not be negative` })
    .max(MAX_AMOUNT_MINOR, { error: `${field} must be at most ${MAX_AMOUNT_MINOR} minor units` });
}
