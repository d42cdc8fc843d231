// The carrier's boarding-priority rules for involuntary denial: an ordered list of factors.
import { z } from 'zod';

export const checkInTimeRuleSchema = z.strictObject({
  factor: z.literal('check-in-time'),
  direction: z.enum(['latest-first', 'earliest-first']),
});

export const farePaidRuleSchema = z.strictObject({
  factor: z.literal('fare-paid'),
  direction: z.enum(['lowest-first', 'highest-first']),
});

export const frequentFlyerTierRuleSchema = z.strictObject({
  factor: z.literal('frequent-flyer-tier'),
  direction: z.literal('none-first').default('none-first'),
});

export const seatAssignedBeforeGateRuleSchema = z.strictObject({
  factor: z.literal('seat-assigned-before-gate'),
  direction: z.literal('unassigned-first').default('unassigned-first'),
});

export const partySizeRuleSchema = z.strictObject({
  factor: z.literal('party-size'),
  direction: z.enum(['smallest-first', 'largest-first']),
});

export const priorityRuleSchema = z.discriminatedUnion('factor', [
  checkInTimeRuleSchema,
  farePaidRuleSchema,
  frequentFlyerTierRuleSchema,
  seatAssignedBeforeGateRuleSchema,
  partySizeRuleSchema,
]);

export const priorityRulesSchema = z
  .array(priorityRuleSchema)
  .min(1, 'at least one factor is needed so the order is the carrier\'s, not chance')
  .superRefine((rules, context) => {
    const seen = new Set<string>();
    rules.forEach((rule, index) => {
      if (seen.has(rule.factor)) {
        context.addIssue({ code: 'custom', path: [index, 'factor'], message: `factor ${rule.factor} is listed twice` });
      }
      seen.add(rule.factor);
    });
  });

export type PriorityRule = z.output<typeof priorityRuleSchema>;
export type PriorityRuleInput = z.input<typeof priorityRuleSchema>;
export type PriorityFactor = PriorityRule['factor'];

/** Parses a rules list; a failure is a RangeError naming the path, e.g. "rules[1].direction: ...". */
export function parsePriorityRules(rules: unknown): PriorityRule[] {
  const result = priorityRulesSchema.safeParse(rules);
  if (result.success) return result.data;
  const issue = result.error.issues[0];
  const path = issue.path.map((part) => (typeof part === 'number' ? `[${part}]` : `.${String(part)}`)).join('');
  throw new RangeError(`rules${path}: ${issue.message}`);
}
