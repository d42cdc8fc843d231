import { z } from 'zod';
import { roleSchema } from './common';

export const signInBodySchema = z.object({
  email: z.email({ error: 'email must be an e-mail address' }).max(254, 'email must be at most 254 characters'),
  password: z.string({ error: 'password is required' }).min(1, 'password is required').max(200, 'password must be at most 200 characters'),
});
export type SignInBody = z.infer<typeof signInBodySchema>;

export const stationRefSchema = z.object({ id: z.number(), iata: z.string(), name: z.string(), timeZone: z.string() });

export const sessionUserSchema = z.object({
  id: z.number(),
  email: z.string(),
  displayName: z.string(),
  role: roleSchema,
  stations: z.array(stationRefSchema),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

export const sessionResponseSchema = z.object({
  user: sessionUserSchema.nullable(),
  csrfToken: z.string(),
  demo: z.boolean(),
});
export type SessionResponse = z.infer<typeof sessionResponseSchema>;
