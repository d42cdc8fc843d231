// The volunteer policy as the admin edits it (amounts as typed, lists one item per line) and back, checked with the
// same schema the server validates with, so each problem is shown beside its own field.
import { volunteerPolicySchema, type VolunteerPolicy } from '@shared/schemas/volunteers';
import { currencyProblem } from '../../../lib/money';
import { moneyInput, parseMoney } from './money';

export interface PolicyDraft {
  currency: string;
  ladder: string[];
  agentLimit: string;
  /** Blank: supervisors have no limit of their own. */
  supervisorLimit: string;
  raisePolicy: VolunteerPolicy['raisePolicy'];
  sealedBidPricing: VolunteerPolicy['sealedBidPricing'];
  extras: string;
  voucherRestrictions: string;
}

/** Field keys: "currency", "ladder.0"… for one step, "ladder" for the ladder as a whole, "agentLimit", … */
export type PolicyErrors = Partial<Record<string, string>>;

export function draftFromPolicy(p: VolunteerPolicy): PolicyDraft {
  return {
    currency: p.currency,
    ladder: p.ladderMinor.map((m) => moneyInput(m, p.currency)),
    agentLimit: moneyInput(p.agentLimitMinor, p.currency),
    supervisorLimit: p.supervisorLimitMinor === null ? '' : moneyInput(p.supervisorLimitMinor, p.currency),
    raisePolicy: p.raisePolicy,
    sealedBidPricing: p.sealedBidPricing,
    extras: p.extras.join('\n'),
    voucherRestrictions: p.voucherRestrictions.join('\n'),
  };
}

const lines = (text: string) => text.split('\n').map((l) => l.trim()).filter(Boolean);

function fieldOf(path: readonly PropertyKey[]) {
  const [head, index] = path;
  if (head === 'ladderMinor') return index !== undefined && /^\d+$/.test(String(index)) ? `ladder.${String(index)}` : 'ladder';
  if (head === 'agentLimitMinor') return 'agentLimit';
  if (head === 'supervisorLimitMinor') return 'supervisorLimit';
  return String(head ?? 'form');
}

/** The draft's field for a field the server named in a 400 ("ladderMinor.2" is the third step). */
export function draftField(serverField: string) {
  return fieldOf(serverField.split('.'));
}

export function checkPolicyDraft(d: PolicyDraft): { ok: true; policy: VolunteerPolicy } | { ok: false; errors: PolicyErrors } {
  const errors: PolicyErrors = {};
  const currency = d.currency.trim().toUpperCase();
  // Amounts can only be read once the currency is known to Intl; a bad code is reported on its own field.
  let currencyKnown = /^[A-Z]{3}$/.test(currency);
  try {
    if (currencyKnown) new Intl.NumberFormat('en-US', { style: 'currency', currency });
  } catch {
    currencyKnown = false;
  }
  if (!currencyKnown) errors.currency = 'must be a three-letter ISO 4217 currency code';
  const unusable = currencyKnown ? currencyProblem(currency) : null;
  if (unusable !== null) {
    errors.currency = unusable;
    currencyKnown = false;
  }
  const money = (text: string, field: string) => {
    if (!currencyKnown) return 0;
    const r = parseMoney(text, currency);
    if (!r.ok) errors[field] = r.rule;
    return r.ok ? r.minor : 0;
  };
  const candidate = {
    currency,
    ladderMinor: d.ladder.map((s, i) => money(s, `ladder.${i}`)),
    agentLimitMinor: money(d.agentLimit, 'agentLimit'),
    supervisorLimitMinor: d.supervisorLimit.trim() === '' ? null : money(d.supervisorLimit, 'supervisorLimit'),
    raisePolicy: d.raisePolicy,
    sealedBidPricing: d.sealedBidPricing,
    extras: lines(d.extras),
    voucherRestrictions: lines(d.voucherRestrictions),
  };
  // The schema says the ladder must rise; the admin is shown which step breaks the order.
  if (currencyKnown && !Object.keys(errors).some((f) => f.startsWith('ladder.'))) {
    candidate.ladderMinor.forEach((step, i) => {
      if (i > 0 && step <= candidate.ladderMinor[i - 1]) errors[`ladder.${i}`] = `must be above step ${i}`;
    });
  }
  const parsed = volunteerPolicySchema.safeParse(candidate);
  if (!parsed.success) {
    // An amount that could not be read was counted as 0, and a step out of order is already marked: the schema's
    // view of the ladder would only repeat it.
    const unreadableLadder = !currencyKnown || Object.keys(errors).some((f) => f.startsWith('ladder.'));
    for (const issue of parsed.error.issues) {
      const field = fieldOf(issue.path);
      if ((field.startsWith('ladder') && unreadableLadder) || (field.endsWith('Limit') && !currencyKnown)) continue;
      errors[field] ??= issue.message;
    }
  }
  if (Object.keys(errors).length > 0 || !parsed.success) return { ok: false, errors };
  return { ok: true, policy: parsed.data };
}
