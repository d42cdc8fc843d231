import type { RequestHandler } from 'express';
import type { ZodType, z } from 'zod';
import { badRequest, type FieldProblem } from './errors';

type Part = 'body' | 'query' | 'params';

function problems(error: z.ZodError, part: Part): FieldProblem[] {
  return error.issues.map((i) => ({ field: i.path.length ? i.path.join('.') : part, rule: i.message }));
}

/** Parses one part of the request with a shared schema; a failure is a 400 naming each field and its rule. */
export function parse<S extends ZodType>(schema: S, value: unknown, part: Part = 'body'): z.infer<S> {
  const result = schema.safeParse(value ?? {});
  if (!result.success) {
    const details = problems(result.error, part);
    throw badRequest(`${details[0].field}: ${details[0].rule}`, details);
  }
  return result.data;
}

/** Middleware form: stores the parsed value in res.locals[part] (Express 5's req.query is read-only). */
export function validate<S extends ZodType>(schema: S, part: Part = 'body'): RequestHandler {
  return (req, res, next) => {
    res.locals[part] = parse(schema, req[part], part);
    next();
  };
}
