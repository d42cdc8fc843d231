import type { FormValue } from '../http/formParser.js';
import type { SpendingLimit } from '../store/types.js';
import { paramInvalid, paramMissing } from '../http/errors.js';
import { asList, asObject, optionalEnum, parseInteger, rejectUnknown } from './params.js';

// Intervals from the stripe-node 23.1 `SpendingLimit.Interval` type.
const INTERVALS = ['all_time', 'daily', 'monthly', 'per_authorization', 'weekly', 'yearly'] as const;
const UNMODELLED = [
  'allowed_card_presences',
  'allowed_categories',
  'allowed_merchant_countries',
  'blocked_card_presences',
  'blocked_categories',
  'blocked_merchant_countries',
];

/** `spending_controls[spending_limits][i][amount|interval|categories]`; returns undefined when the param is absent. */
export function parseSpendingLimits(value: FormValue | undefined): SpendingLimit[] | undefined {
  if (value === undefined) return undefined;
  const param = 'spending_controls';
  const controls = asObject(value, param);
  rejectUnknown(controls, ['spending_limits'], UNMODELLED, param);
  return asList(controls.spending_limits, `${param}[spending_limits]`).map((item, index) => {
    const itemParam = `${param}[spending_limits][${index}]`;
    const limit = asObject(item, itemParam);
    rejectUnknown(limit, ['amount', 'interval', 'categories'], [], itemParam);
    const interval = optionalEnum(limit.interval, `${itemParam}[interval]`, INTERVALS);
    if (!interval) throw paramMissing(`${itemParam}[interval]`);
    const categories = asList(limit.categories, `${itemParam}[categories]`).map((category, i) => {
      if (typeof category !== 'string' || category === '') throw paramInvalid(`${itemParam}[categories][${i}]`, 'expected a category name.');
      return category;
    });
    return {
      amount: parseInteger(limit.amount, `${itemParam}[amount]`, 0),
      categories: categories.length > 0 ? categories : null,
      interval,
    };
  });
}
