// A compensation's payment terms: the media its rule allows (lawful default first), which need the passenger's
// agreement, the conditions on a card or credit, and the deadline. The rules themselves live in shared/compensation.
import { ALTERNATIVE_CONDITIONS, dueStatus, paymentTerms, type PaymentTerms, type Regime } from '@shared/compensation';
import { REGIMES } from '@shared/compensation/types';
import type { z } from 'zod';
import type { paymentTermsViewSchema } from '@shared/schemas/payment-media';

type TermsView = z.infer<typeof paymentTermsViewSchema>;

/** An instant written with the offset the zone had at that instant, e.g. 2025-03-01T07:42:00.000-05:00. */
export function isoInZone(instant: Date, timeZone: string): string {
  const parts = new Intl.DateTimeFormat('en-CA', { timeZone, timeZoneName: 'longOffset', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', second: '2-digit', hourCycle: 'h23' }).formatToParts(instant);
  const get = (type: string) => parts.find((p) => p.type === type)?.value ?? '';
  const zone = get('timeZoneName').replace('GMT', '');
  const offset = zone === '' ? 'Z' : zone.length === 3 ? `${zone}:00` : zone;
  const millis = String(instant.getUTCMilliseconds()).padStart(3, '0');
  return `${get('year')}-${get('month')}-${get('day')}T${get('hour')}:${get('minute')}:${get('second')}.${millis}${offset}`;
}

export interface TermsFacts {
  regime: string;
  voluntary: boolean;
  /** When the denial or the volunteer's agreement was recorded. */
  deniedAt: Date;
  alternateDepartsAt?: Date | null;
  timeZone: string;
}

function regimeOf(code: string): Regime {
  if (!(REGIMES as readonly string[]).includes(code)) throw new Error(`Unknown regime ${code} on a compensation`);
  return code as Regime;
}

export function termsFor(facts: TermsFacts): PaymentTerms {
  return paymentTerms({
    regime: regimeOf(facts.regime),
    deniedAt: isoInZone(facts.deniedAt, facts.timeZone),
    voluntary: facts.voluntary,
    ...(facts.alternateDepartsAt ? { alternateDepartsAt: isoInZone(facts.alternateDepartsAt, facts.timeZone) } : {}),
  });
}

export function termsView(facts: TermsFacts, restrictions: string[], storedDueBy: Date | null, open: boolean, now: Date): TermsView {
  const terms = termsFor(facts);
  const conditions = ALTERNATIVE_CONDITIONS[facts.voluntary ? 'volunteer' : regimeOf(facts.regime)];
  // The deadline stored when the row was made wins: it was fixed from the facts of that moment.
  const dueBy = storedDueBy ? new Date(storedDueBy).toISOString() : terms.dueBy;
  return { ...terms, dueBy, dueStatus: open ? dueStatus(dueBy, now) : null, conditions, restrictions, timeZone: facts.timeZone };
}

/** The card a travel credit becomes is limited to the carrier's own kind of merchant (Stripe Issuing spending category). */
export const VOUCHER_CATEGORIES = ['airlines_air_carriers'];
