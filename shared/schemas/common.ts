import { z } from 'zod';
import { minorAmountSchema } from './money';
import { REGIME_NAMES } from '../compensation/labels';

export const ROLES = ['agent', 'supervisor', 'finance', 'admin'] as const;
export const roleSchema = z.enum(ROLES, { error: 'role must be one of agent, supervisor, finance, admin' });
export type Role = z.infer<typeof roleSchema>;
/** The roles that work a flight's denied boarding (its ranking, proposals and denials). */
export const DENIAL_DESK_ROLES = ['agent', 'supervisor', 'admin'] as const satisfies readonly Role[];

export const ROLE_LABELS: Record<Role, string> = {
  agent: 'Gate agent',
  supervisor: 'Supervisor',
  finance: 'Finance',
  admin: 'Admin',
};

export const REGIMES = ['us-dot', 'eu-261', 'uk-261', 'ca-appr'] as const;
export const regimeSchema = z.enum(REGIMES, { error: 'regime must be one of us-dot, eu-261, uk-261, ca-appr' });
export type RegimeCode = z.infer<typeof regimeSchema>;

/** What people read for each regime code; the one labels module of shared/compensation decides the words. */
export const REGIME_LABELS: Readonly<Record<RegimeCode, string>> = REGIME_NAMES;

export const idParamSchema = z.object({ id: z.coerce.number({ error: 'id must be a number' }).int('id must be a whole number').positive('id must be positive') });

export const iataAirportSchema = z.string().regex(/^[A-Z]{3}$/, 'must be a three-letter IATA airport code in capitals');
export const currencySchema = z.string().regex(/^[A-Z]{3}$/, 'must be a three-letter ISO 4217 currency code');

/** Money travels as integer minor units with its currency, from the form to the ledger. */
export const moneySchema = z.object({
  amountMinor: minorAmountSchema('amountMinor'),
  currency: currencySchema,
});
export type Money = z.infer<typeof moneySchema>;

/** The single error shape every API failure answers with. */
export const apiErrorSchema = z.object({
  error: z.string(),
  message: z.string(),
  details: z.array(z.object({ field: z.string(), rule: z.string() })).optional(),
});
export type ApiError = z.infer<typeof apiErrorSchema>;
