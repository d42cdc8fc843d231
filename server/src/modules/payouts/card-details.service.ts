// Showing a prepaid card's full details once, to the passenger, on their own phone. The link is locked (FOR UPDATE)
// while the provider is asked, so two opens at once cannot both read; it is spent only once the details were read,
// so a provider hiccup leaves it usable. The details pass through in the answer and are kept nowhere: not in the
// database, not in the audit row (which records that they were shown), not in any log line.
import type { BookingProof, CardDetails, CardDetailsLink } from '@shared/schemas/payouts';
import { CompensationEntity } from '../../db/entities';
import { conflict, upstreamFailed } from '../../domain/errors';
import { audit } from '../audit/audit.service';
import { compensationRow } from '../payments/compensation-view';
import { PASSENGER_ACTOR, type PaymentsContext } from '../payments/payments-context';
import { bookingLanguage, countWrongTry, findLink, linkState, markUsed, proofMatches, refuseUnlessReady, wrongProof } from './payment-links';

export async function cardLinkStatus(ctx: PaymentsContext, token: string): Promise<CardDetailsLink> {
  const link = await findLink(ctx.db.manager, token, 'card-details');
  const row = await compensationRow(ctx.db, link.compensationId);
  return { state: linkState(link, ctx.now()), flight: `${row.carrier_code} ${row.flight_number}`, amountMinor: row.amount_minor, currency: row.currency, expiresAt: link.expiresAt.toISOString(), language: bookingLanguage(row.booking_language) };
}

type Outcome = { kind: 'shown'; details: CardDetails } | { kind: 'wrong'; triesLeft: number };

export async function revealCardDetails(ctx: PaymentsContext, token: string, proof: BookingProof): Promise<CardDetails> {
  const outcome = await ctx.db.transaction(async (em): Promise<Outcome> => {
    const link = await findLink(em, token, 'card-details', true);
    refuseUnlessReady(link, ctx.now());
    const row = await compensationRow(em, link.compensationId);
    if (!proofMatches(row, proof)) return { kind: 'wrong', triesLeft: await countWrongTry(em, link) };
    const comp = await em.findOneByOrFail(CompensationEntity, { id: link.compensationId });
    // Only the card the ledger names now, and only while it can be spent: a voided or replaced card shows nothing.
    if (!comp.providerCardId || !['issued', 'settled'].includes(comp.state) || comp.idempotencyKey !== link.attemptKey) {
      throw conflict('card_not_available', 'This card is no longer available. Please contact the airline; you are still owed your compensation.');
    }
    let read;
    try {
      read = await ctx.passenger.readCardDetails(comp.providerCardId);
    } catch (error) {
      ctx.log(`[payouts] compensation ${comp.id}: ${(error as Error).message}`);
      throw upstreamFailed('We could not reach the card issuer just now. Your link still works: please try again in a minute.');
    }
    await markUsed(em, link, ctx.now());
    await audit(em, {
      actor: PASSENGER_ACTOR, action: 'compensation.card_details_shown', entityType: 'compensation', entityId: comp.id, stationId: comp.stationId,
      before: { linkId: link.id }, after: { linkId: link.id, cardId: comp.providerCardId, cardEnding: read.last4 },
    });
    return { kind: 'shown', details: { number: read.number, cvc: read.cvc, expMonth: read.expMonth, expYear: read.expYear, amountMinor: comp.amountMinor, currency: comp.currency } };
  });
  if (outcome.kind === 'wrong') throw wrongProof(outcome.triesLeft);
  return outcome.details;
}
