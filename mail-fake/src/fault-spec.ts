// The body of POST /api/faults: which failure to inject, where in the SMTP dialogue, and for how long.
import { z } from 'zod';

export const FAULT_MODES = ['reject-4xx', 'reject-5xx', 'down'] as const;
export const FAULT_STAGES = ['rcpt', 'data'] as const;
export type FaultMode = (typeof FAULT_MODES)[number];
export type FaultStage = (typeof FAULT_STAGES)[number];

/** A day is far longer than any test or demo needs; a cap keeps a typo from wedging the catcher. */
export const MAX_FAULT_SECONDS = 86_400;
export const MAX_FAULT_COUNT = 10_000;

// RFC 5321 section 4.2.1: 4yz is a transient negative reply (retry later), 5yz a permanent one.
// 452 "insufficient system storage" and 550 "mailbox unavailable" are listed in section 4.2.3.
const DEFAULT_CODE: Record<Exclude<FaultMode, 'down'>, number> = { 'reject-4xx': 452, 'reject-5xx': 550 };
const DEFAULT_TEXT: Record<Exclude<FaultMode, 'down'>, string> = {
  'reject-4xx': 'Try again later (fault injected by the local mail catcher)',
  'reject-5xx': 'Mailbox unavailable (fault injected by the local mail catcher)',
};

const faultRequestSchema = z
  .strictObject({
    mode: z.enum(FAULT_MODES, { error: `must be one of ${FAULT_MODES.join(', ')}` }),
    seconds: z.number().positive().max(MAX_FAULT_SECONDS).optional(),
    count: z.number().int().min(1).max(MAX_FAULT_COUNT).optional(),
    stage: z.enum(FAULT_STAGES, { error: `must be one of ${FAULT_STAGES.join(', ')}` }).optional(),
    code: z.number().int().optional(),
    message: z.string().min(1).max(200).regex(/^[\x20-\x7e]+$/, 'must be printable ASCII on one line').optional(),
  })
  .superRefine((request, context) => {
    if (request.mode === 'down') {
      for (const field of ['count', 'stage', 'code', 'message'] as const) {
        if (request[field] !== undefined) {
          context.addIssue({ code: 'custom', path: [field], message: "not allowed with mode 'down' (the listener is closed, no reply is sent)" });
        }
      }
      return;
    }
    if (request.code === undefined) return;
    const [low, high] = request.mode === 'reject-4xx' ? [400, 499] : [500, 599];
    if (request.code < low || request.code > high) {
      context.addIssue({ code: 'custom', path: ['code'], message: `must be between ${low} and ${high} for mode '${request.mode}'` });
    }
  });

/** A validated request with the defaults filled in. */
export type FaultPlan =
  | { mode: 'down'; seconds: number | null }
  | {
      mode: 'reject-4xx' | 'reject-5xx';
      stage: FaultStage;
      code: number;
      message: string;
      seconds: number | null;
      count: number | null;
    };

export type FaultParseResult = { ok: true; plan: FaultPlan } | { ok: false; error: string };

/** Validates a request body; the error names each bad field and the rule it broke. */
export function parseFaultRequest(body: unknown): FaultParseResult {
  if (typeof body !== 'object' || body === null || Array.isArray(body)) {
    return { ok: false, error: 'body: must be a JSON object such as {"mode":"reject-4xx","count":1}' };
  }
  const parsed = faultRequestSchema.safeParse(body);
  if (!parsed.success) {
    const error = parsed.error.issues
      .map((issue) => `${issue.path.length > 0 ? issue.path.join('.') : 'body'}: ${issue.message}`)
      .join('; ');
    return { ok: false, error };
  }
  const request = parsed.data;
  if (request.mode === 'down') return { ok: true, plan: { mode: 'down', seconds: request.seconds ?? null } };
  return {
    ok: true,
    plan: {
      mode: request.mode,
      stage: request.stage ?? 'rcpt',
      code: request.code ?? DEFAULT_CODE[request.mode],
      message: request.message ?? DEFAULT_TEXT[request.mode],
      seconds: request.seconds ?? null,
      count: request.count ?? null,
    },
  };
}
