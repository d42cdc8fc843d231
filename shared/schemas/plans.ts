import { z } from 'zod';
import { plannerInputSchema } from './planner';

/**
 * What a plan is for: a route "BOS-ORD" (origin-destination IATA codes), or one future flight on it,
 * "BOS-ORD/BB123/2026-06-01" (route, flight designator, local departure date).
 */
export const ROUTE_KEY_MAX_LENGTH = 32;
const ROUTE = /^([A-Z]{3})-([A-Z]{3})$/;
// A designator is a two-character airline code (letters, or a letter and a digit) or a three-letter one, a number
// of up to four digits and an optional suffix letter (IATA Standard Schedules Information Manual, from memory).
const DESIGNATOR = '(?:[A-Z]{2,3}|[A-Z]\\d|\\d[A-Z])\\d{1,4}[A-Z]?';
const FLIGHT = new RegExp(`^([A-Z]{3})-([A-Z]{3})/(${DESIGNATOR})/(\\d{4}-\\d{2}-\\d{2})$`);
export const FLIGHT_DESIGNATOR = new RegExp(`^${DESIGNATOR}$`);

export interface RouteKeyParts {
  origin: string;
  destination: string;
  flight?: { designator: string; date: string };
}

function isCalendarDate(iso: string): boolean {
  const d = new Date(`${iso}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === iso;
}

/** Splits a route key into its parts, or null when it has neither form. */
export function parseRouteKey(key: string): RouteKeyParts | null {
  const route = ROUTE.exec(key);
  if (route) return { origin: route[1], destination: route[2] };
  const flight = FLIGHT.exec(key);
  if (flight) return { origin: flight[1], destination: flight[2], flight: { designator: flight[3], date: flight[4] } };
  return null;
}

export function buildRouteKey(parts: RouteKeyParts): string {
  const route = `${parts.origin}-${parts.destination}`;
  return parts.flight ? `${route}/${parts.flight.designator}/${parts.flight.date}` : route;
}

export const routeKeySchema = z
  .string({ error: (issue) => (issue.input === undefined ? 'routeKey is required' : 'routeKey must be text') })
  .max(ROUTE_KEY_MAX_LENGTH, { error: `routeKey must be at most ${ROUTE_KEY_MAX_LENGTH} characters` })
  .superRefine((key, ctx) => {
    const parts = parseRouteKey(key);
    if (!parts) {
      ctx.addIssue({ code: 'custom', message: 'routeKey must be a route such as BOS-ORD or a flight such as BOS-ORD/BB123/2026-06-01' });
    } else if (parts.origin === parts.destination) {
      ctx.addIssue({ code: 'custom', message: 'routeKey must have a destination different from its origin' });
    } else if (parts.flight && !isCalendarDate(parts.flight.date)) {
      ctx.addIssue({ code: 'custom', message: 'routeKey must carry a real calendar date (YYYY-MM-DD)' });
    }
  });

const stationIdSchema = z
  .number({ error: (issue) => (issue.input === undefined ? 'stationId is required' : 'stationId must be a number') })
  .int({ error: 'stationId must be a whole number' })
  .positive({ error: 'stationId must be positive' });

export const PLAN_NAME_MAX_LENGTH = 100;

export const savePlanBodySchema = z.strictObject({
  stationId: stationIdSchema,
  routeKey: routeKeySchema,
  name: z
    .string({ error: (issue) => (issue.input === undefined ? 'name is required' : 'name must be text') })
    .trim()
    .min(1, { error: 'name is required' })
    .max(PLAN_NAME_MAX_LENGTH, { error: `name must be at most ${PLAN_NAME_MAX_LENGTH} characters` }),
  inputs: plannerInputSchema,
});
export type SavePlanBody = z.infer<typeof savePlanBodySchema>;

/** Query strings arrive as text, so the station id is coerced here and nowhere else. */
export const listPlansQuerySchema = z.object({
  stationId: z.coerce
    .number({ error: 'stationId must be a number' })
    .int({ error: 'stationId must be a whole number' })
    .positive({ error: 'stationId must be positive' }),
  routeKey: routeKeySchema,
});
export type ListPlansQuery = z.infer<typeof listPlansQuerySchema>;

/** The optimum the server computed when the plan was saved; money in integer minor units of inputs.currency. */
export const planResultSchema = z.object({
  bookings: z.number().int(),
  expectedNetMinor: z.number().int(),
});
export type PlanResult = z.infer<typeof planResultSchema>;

export const savedPlanSchema = z.object({
  id: z.number(),
  stationId: z.number(),
  routeKey: z.string(),
  name: z.string(),
  inputs: plannerInputSchema,
  result: planResultSchema,
  createdBy: z.object({ id: z.number(), displayName: z.string() }),
  createdAt: z.string(),
});
export type SavedPlan = z.infer<typeof savedPlanSchema>;
export const savedPlanListSchema = z.object({ plans: z.array(savedPlanSchema) });
export type SavedPlanList = z.infer<typeof savedPlanListSchema>;
