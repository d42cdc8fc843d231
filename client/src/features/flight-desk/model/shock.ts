// The common-shock choices a supervisor can make, and how the current one reads on screen.
import type { Forecast } from '@shared/schemas/flight-desk';

export type CommonShock = NonNullable<Forecast['shock']>;
export type ShockChoice = 'none' | 'weather' | 'custom';

/**
 * A weather day: everyone's show-up moves together a little. Intra-class correlation 0.02 of a beta-binomial, a
 * mild setting of our own (common practice: small positive correlation widens the tail without moving the mean).
 */
export const WEATHER_DAY_RHO = 0.02;

export function shockChoiceOf(shock: CommonShock | null): ShockChoice {
  if (!shock) return 'none';
  if (shock.kind === 'beta-binomial' && shock.rho === WEATHER_DAY_RHO) return 'weather';
  return 'custom';
}

export function describeShock(shock: CommonShock | null) {
  if (!shock) return 'None (passengers show up independently of each other)';
  if (shock.kind === 'beta-binomial') {
    const name = shock.rho === WEATHER_DAY_RHO ? 'Weather day' : 'Custom';
    return `${name} (everyone’s show-up moves together; correlation ${shock.rho})`;
  }
  const parts = shock.scenarios.map((s) => `${Math.round(s.weight * 100)} % chance show rates × ${s.probabilityFactor}`);
  return `Scenarios (${parts.join('; ')})`;
}

/** The body the server expects for a choice; a custom correlation is validated by the shared schema on submit. */
export function shockFor(choice: ShockChoice, customRho: string): CommonShock | null {
  if (choice === 'none') return null;
  if (choice === 'weather') return { kind: 'beta-binomial', rho: WEATHER_DAY_RHO };
  return { kind: 'beta-binomial', rho: Number(customRho.replace(',', '.')) };
}
