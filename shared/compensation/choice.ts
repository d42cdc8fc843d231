// What the desk may offer a denied passenger and what the passenger's choice sets for the rest of the case.
import { APPR_OTHER_CARRIERS_AFTER_MINUTES, CHOICE_OFFERS, type ChoiceKind, type ChoiceOffer } from './choice-rules';
import { REGIMES, type Regime } from './types';
import { assertWholeMinutes } from './validation';

export { CHOICE_KINDS, CHOICE_OFFERS, APPR_OTHER_CARRIERS_AFTER_MINUTES, type ChoiceKind, type ChoiceOffer, type ChoiceEffects } from './choice-rules';

function assertRegime(regime: unknown): asserts regime is Regime {
  if (!REGIMES.includes(regime as Regime)) throw new RangeError(`regime: unknown regime ${JSON.stringify(regime)}; expected one of ${REGIMES.join(', ')}`);
}

/** The choices the regime offers a denied passenger, volunteers and involuntarily denied alike (EU/UK Art. 4(1), 4(3)). */
export function choicesFor(regime: Regime): readonly ChoiceOffer[] {
  assertRegime(regime);
  return CHOICE_OFFERS[regime];
}

/** The offer for a kind; a kind the regime does not offer is a RangeError naming the field. */
export function choiceOffer(regime: Regime, kind: ChoiceKind): ChoiceOffer {
  const offer = choicesFor(regime).find((o) => o.kind === kind);
  if (!offer) {
    throw new RangeError(`kind: ${JSON.stringify(kind)} is not a choice under ${regime}; use one of ${choicesFor(regime).map((o) => o.kind).join(', ')}`);
  }
  return offer;
}

/**
 * Canada: which carriers the rebooking must look at, from the departure of the next flight of this carrier or a
 * partner, in minutes after the original departure. At 9 hours or more, any carrier on a reasonable route.
 */
export function apprRebookingCarriers(nextOwnDepartureMinutes: number | null): 'own-or-partner' | 'any-carrier' {
  if (nextOwnDepartureMinutes === null) return 'any-carrier';
  assertWholeMinutes('nextOwnDepartureMinutes', nextOwnDepartureMinutes);
  return nextOwnDepartureMinutes < APPR_OTHER_CARRIERS_AFTER_MINUTES ? 'own-or-partner' : 'any-carrier';
}
