import { z } from 'zod';

const trigger = {
  count: z.number().int().positive().optional(),
  probability: z.number().min(0).max(1).optional(),
  seed: z.number().int().optional(),
};
const millis = z.number().int().nonnegative().max(600_000);

export const apiFaultSchema = z.strictObject({
  kind: z.enum(['error500', 'timeout', 'drop']),
  phase: z.enum(['before', 'after']).optional(),
  holdMs: millis.optional(),
  method: z.enum(['GET', 'POST']).optional(),
  pathPrefix: z.string().startsWith('/v1/').optional(),
  ...trigger,
});

export const webhookFaultSchema = z.strictObject({
  kind: z.enum(['duplicate', 'delay', 'reorder']),
  delayMs: millis.optional(),
  maxHoldMs: millis.optional(),
  ...trigger,
});

export const endpointSchema = z.strictObject({
  url: z.url({ protocol: /^https?$/ }),
  secret: z.string().min(1),
});

export const settleSchema = z.strictObject({
  amount: z.number().int().positive().optional(),
  merchant_name: z.string().min(1).max(100).optional(),
});

/** First problem as "field: rule", so a test author sees which field was wrong. */
export function describeIssue(error: z.ZodError): { message: string; param?: string } {
  const issue = error.issues[0];
  const param = issue.path.join('.');
  return { message: param ? `${param}: ${issue.message}` : issue.message, param: param || undefined };
}
