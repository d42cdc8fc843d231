// Art. 7 compensation for denied boarding under Reg. (EC) 261/2004 (Art. 4(3)) and the UK's retained version.
import { formatMoney, groupThousands } from './money';
import type { CompensationInput, CompensationResult } from './types';
import { findExemption } from './exemptions';
import { bandEdgeWarning } from './geodesic';
import { assertDistanceKm, formatMinutes, rowInForce } from './validation';
import {
  EU_STYLE_AMOUNTS,
  EXACTLY_3500_KM_POLICY,
  REDUCTION_MAX_DELAY_MINUTES,
  bandAmountMinor,
  distanceBand,
  type DistanceBand,
  type EuStyleRegime,
} from './eu-uk-rules';

function bandWords(regime: EuStyleRegime, band: DistanceBand): string {
  const internal = regime === 'eu-261' ? 'intra-Community' : 'UK domestic';
  if (band === 'a') return 'flights of 1,500 km or less';
  if (band === 'b') return `${internal} flights over 1,500 km and other flights between 1,500 and 3,500 km`;
  return `all other flights (over 3,500 km, not ${internal})`;
}

export function euStyleCompensation(regime: EuStyleRegime, input: CompensationInput, deniedOn: string): CompensationResult {
  const row = rowInForce(EU_STYLE_AMOUNTS[regime], deniedOn, regime);
  const rulesInForce = { effectiveFrom: row.effectiveFrom, source: row.source };
  const instrument = regime === 'eu-261' ? 'Reg. (EC) 261/2004' : 'Retained Reg. 261/2004 (UK)';
  if (input.distanceKm === undefined) {
    throw new RangeError(`distanceKm: required for ${regime} (great-circle distance to the final destination, Art. 7(4))`);
  }
  assertDistanceKm('distanceKm', input.distanceKm);
  const distanceKm = input.distanceKm;
  const reviewFlags: string[] = [];
  const edge = bandEdgeWarning(distanceKm);
  if (edge) reviewFlags.push(edge.message);
  const notes = [
    `Distance is the direct great-circle distance from the departure airport to the final destination, also for connections (CJEU C-559/16 Bossen, 7 Sep 2017).`,
    `Paid in cash, by bank transfer or cheque; travel vouchers only with the passenger's signed agreement (${instrument} Art. 7(3)).`,
    `Re-routing or reimbursement (Art. 8) and care (Art. 9) are due in addition.`,
  ];

  if (input.exemption !== undefined) {
    const rule = findExemption(regime, input.exemption);
    return {
      amountMinor: 0,
      currency: row.currency,
      band: 'exempt',
      ruleRef: rule.ruleRef,
      explanation: `Not eligible: ${rule.summary}.`,
      notes,
      reviewFlags,
      rulesInForce,
    };
  }

  if (input.ticket === 'free' || input.ticket === 'non-public-reduced') {
    const what = input.ticket === 'free' ? 'travels free of charge' : 'travels at a reduced fare not available to the public';
    return {
      amountMinor: 0, currency: row.currency, band: 'out-of-scope', ruleRef: `${instrument} Art. 3(3)`, notes, reviewFlags, rulesInForce,
      explanation: `Outside the Regulation: the passenger ${what} (Art. 3(3)); a ticket bought with frequent-flyer points or under another commercial programme would be covered.`,
    };
  }
  if (input.ticket === 'frequent-flyer') {
    notes.push(`A ticket issued under a frequent-flyer or other commercial programme is covered like a ticket bought for money (${instrument} Art. 3(3)).`);
  }

  const intra = input.intraCommunity ?? false;
  const band = distanceBand(distanceKm, intra);
  if (!intra && distanceKm === 3500) notes.push(`Policy: ${EXACTLY_3500_KM_POLICY}.`);
  const fullAmountMinor = bandAmountMinor(row, band);
  const delay = input.plannedArrivalDelayMinutes;
  const limit = REDUCTION_MAX_DELAY_MINUTES[band];
  const reducible = delay !== null && delay <= limit;
  const reduce = reducible && input.applyReroutingReduction === true;
  const amountMinor = reduce ? fullAmountMinor / 2 : fullAmountMinor;

  const distanceText = `${groupThousands(Math.round(distanceKm))} km${intra ? (regime === 'eu-261' ? ' (intra-Community)' : ' (UK domestic)') : ''}`;
  let reductionText: string;
  if (delay === null) {
    reductionText = 'No re-routing was offered, so the Art. 7(2) reduction does not apply.';
  } else if (!reducible) {
    reductionText = `The re-routing arrives ${formatMinutes(delay)} after the scheduled arrival, more than ${formatMinutes(limit)}: the Art. 7(2) reduction does not apply.`;
  } else if (reduce) {
    reductionText = `The re-routing arrives ${formatMinutes(delay)} after the scheduled arrival, within ${formatMinutes(limit)}: the carrier halves it under Art. 7(2).`;
  } else {
    reductionText = `The re-routing arrives ${formatMinutes(delay)} after the scheduled arrival, within ${formatMinutes(limit)}: the carrier may halve it under Art. 7(2) but has not chosen to.`;
  }
  return {
    amountMinor,
    currency: row.currency,
    band: `${regime === 'eu-261' ? 'eu' : 'uk'}-${band}`,
    ruleRef: `${instrument} Art. 7(1)(${band})${reduce ? ', Art. 7(2)' : ''}`,
    explanation: `${distanceText}: ${formatMoney(fullAmountMinor, row.currency)} for ${bandWords(regime, band)}. ${reductionText}`,
    notes,
    reviewFlags,
    fullAmountMinor,
    reducibleUnderArt7_2: reducible,
    rulesInForce,
  };
}
