import type { FormObject } from '../http/formParser.js';
import { resourceMissing, StripeApiError } from '../http/errors.js';
import { optionalString, parseCreatedFilter, parseInteger, rejectUnknown, matchesCreated, type CreatedFilter } from './params.js';

export interface ListObject<T> {
  object: 'list';
  data: T[];
  has_more: boolean;
  url: string;
}

export interface ListQuery {
  limit: number;
  startingAfter?: string;
  endingBefore?: string;
  created?: CreatedFilter;
}

// Stripe list endpoints: `limit` between 1 and 100, default 10 (docs.stripe.com/api/pagination).
const DEFAULT_LIMIT = 10;
const MAX_LIMIT = 100;

/** Reads the common list parameters and rejects anything not in `filters` or the common set. */
export function parseListQuery(params: FormObject, filters: readonly string[], unsupported: readonly string[] = []): ListQuery {
  rejectUnknown(params, ['limit', 'starting_after', 'ending_before', 'created', ...filters], unsupported);
  const query: ListQuery = {
    limit: params.limit === undefined ? DEFAULT_LIMIT : parseInteger(params.limit, 'limit', 1, MAX_LIMIT),
    startingAfter: optionalString(params.starting_after, 'starting_after'),
    endingBefore: optionalString(params.ending_before, 'ending_before'),
    created: parseCreatedFilter(params.created),
  };
  if (query.startingAfter && query.endingBefore) {
    throw new StripeApiError(
      400,
      'invalid_request_error',
      'You may only specify one of these parameters: starting_after, ending_before.',
      'parameter_invalid',
      'ending_before',
    );
  }
  return query;
}

/**
 * Stripe's cursor pagination over a newest-first list: `starting_after` pages towards older objects,
 * `ending_before` towards newer ones, `has_more` says whether that direction has more. Cursors are located
 * in the unfiltered list, so a cursor object that the filters exclude still works.
 */
export function paginate<T extends { id: string; created: number }>(
  newestFirst: T[],
  query: ListQuery,
  matches: (item: T) => boolean,
  url: string,
  objectName: string,
): ListObject<T> {
  const keep = (item: T) => matches(item) && matchesCreated(item.created, query.created);
  const cursor = query.startingAfter ?? query.endingBefore;
  let window = newestFirst;
  if (cursor) {
    const index = newestFirst.findIndex((item) => item.id === cursor);
    if (index === -1) throw resourceMissing(objectName, cursor, query.startingAfter ? 'starting_after' : 'ending_before');
    window = query.startingAfter ? newestFirst.slice(index + 1) : newestFirst.slice(0, index);
  }
  const eligible = window.filter(keep);
  if (query.endingBefore) {
    const start = Math.max(0, eligible.length - query.limit);
    return { object: 'list', data: eligible.slice(start), has_more: start > 0, url };
  }
  return { object: 'list', data: eligible.slice(0, query.limit), has_more: eligible.length > query.limit, url };
}

/** Maps iterate oldest first; Stripe lists newest first. */
export function newestFirst<T>(items: Iterable<T>): T[] {
  return [...items].reverse();
}
