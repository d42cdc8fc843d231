import { z } from 'zod';
import { roleSchema } from './common';
import { stationRefSchema } from './auth';

// OWASP's password guidance: length over composition rules, at least 12 characters for an account without MFA.
const passwordSchema = z.string().min(12, 'password must be at least 12 characters').max(200, 'password must be at most 200 characters');

export const createUserBodySchema = z.object({
  email: z.email({ error: 'email must be an e-mail address' }).max(254, 'email must be at most 254 characters'),
  displayName: z.string().trim().min(1, 'displayName is required').max(100, 'displayName must be at most 100 characters'),
  role: roleSchema,
  stationIds: z.array(z.number().int().positive()).min(1, 'stationIds must name at least one station'),
  password: passwordSchema,
  /** Only a carrier-wide admin may grant it, and only to an admin. */
  carrierWide: z.boolean({ error: 'carrierWide must be true or false' }).optional(),
});
export type CreateUserBody = z.infer<typeof createUserBodySchema>;

export const updateUserBodySchema = z
  .object({
    displayName: z.string().trim().min(1, 'displayName is required').max(100, 'displayName must be at most 100 characters'),
    role: roleSchema,
    stationIds: z.array(z.number().int().positive()).min(1, 'stationIds must name at least one station'),
    active: z.boolean({ error: 'active must be true or false' }),
    password: passwordSchema,
    carrierWide: z.boolean({ error: 'carrierWide must be true or false' }),
  })
  .partial()
  .refine((v) => Object.keys(v).length > 0, 'the body must change at least one field');
export type UpdateUserBody = z.infer<typeof updateUserBodySchema>;

export const userSchema = z.object({
  id: z.number(),
  email: z.string(),
  displayName: z.string(),
  role: roleSchema,
  active: z.boolean(),
  /** For a station admin, only the stations the two of them share. */
  stations: z.array(stationRefSchema),
  /** How many of the user's stations lie outside the viewer's scope (their names are not shown). */
  otherStations: z.number().int(),
  carrierWide: z.boolean(),
  /** Whether the viewer may change this user: every station of the user lies within the viewer's scope. */
  manageable: z.boolean(),
  createdAt: z.string(),
});
export type User = z.infer<typeof userSchema>;
export const userListSchema = z.object({ users: z.array(userSchema), viewer: z.object({ carrierWide: z.boolean() }) });
export type UserList = z.infer<typeof userListSchema>;
