// The desk sends a passenger a fresh payout or card-details link when the old one expired, was lost, or locked after
// wrong booking proofs. In one transaction: every live link of that compensation and purpose dies (its expiry moves
// to now, so an old mail answers "expired"), a new link is made and mailed through the outbox, and the staff member
// is audited. Refused once the link's job is done (the card's details were shown, the account was given), because
// a new link would then either reveal a card twice or take a second account for the same money.
import { In, type DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { PassengerLinkView } from '@shared/schemas/payment-media';
import { AuditLogEntity, CompensationEntity, PaymentLinkEntity, PayoutEntity, type PaymentLinkPurpose } from '../../db/entities';
import { conflict, notFound, tooManyRequests, type DomainError } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { flightChanged, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { enqueueMessage } from '../outbox/outbox.service';
import { compensationRow, passengerNameOf } from '../payments/compensation-view';
import type { PaymentsContext } from '../payments/payments-context';
import { createLink, linkState } from './payment-links';
import { newLinkNotice } from './payout-notices';

/**
 * New links a compensation may get per purpose in any hour: enough for a passenger who lost two mails, few enough
 * that a mistaken or hostile desk session cannot flood a mailbox (our own choice; no rule sets a figure).
 */
export const MAX_NEW_LINKS_PER_HOUR = 3;

export interface NewLinkResult {
  compensationId: number;
  purpose: PaymentLinkPurpose;
  expiresAt: string;
  flightId: number;
  stationId: number;
}

/** Which link this compensation's current payment attempt uses: a payout for a bank transfer, else the card's page. */
function purposeOf(comp: CompensationEntity, payout: PayoutEntity | null): PaymentLinkPurpose | null {
  if (!comp.idempotencyKey) return null;
  if (payout) return 'payout';
  if (comp.providerCardId && ['issued', 'settled'].includes(comp.state)) return 'card-details';
  return null;
}

/**
 * The one check, for the desk's button and for the action: why this compensation's link may not be replaced, or
 * null when it may. `links` are the compensation's links of that purpose.
 */
export function replaceRefusal(comp: CompensationEntity, payout: PayoutEntity | null, links: readonly PaymentLinkEntity[]): DomainError | null {
  const purpose = purposeOf(comp, payout);
  if (!purpose) return conflict('no_passenger_link', 'This compensation has no passenger link to replace: only a bank transfer waiting for the account, or an issued prepaid card, has one.');
  if (purpose === 'payout' && payout!.state !== 'awaiting-details') {
    return conflict('link_job_done', 'The passenger already gave their bank account for this payment, so a new link would take nothing. A lost transfer is re-issued instead.');
  }
  if (links.some((l) => l.attemptKey === comp.idempotencyKey && l.usedAt)) {
    return conflict('link_job_done', 'The card details were already shown to the passenger once; for their safety they are not shown again. A lost card is voided and re-issued instead.');
  }
  return null;
}

/** For the desk: each compensation's current passenger link, where it stands, and whether the desk may replace it. */
export async function passengerLinks(db: DataSource, ids: number[], now: number): Promise<Map<number, PassengerLinkView>> {
  const out = new Map<number, PassengerLinkView>();
  if (!ids.length) return out;
  const comps = await db.getRepository(CompensationEntity).findBy({ id: In(ids) });
  const allLinks = await db.getRepository(PaymentLinkEntity).find({ where: { compensationId: In(ids) }, order: { id: 'ASC' } });
  for (const comp of comps) {
    const payout = comp.idempotencyKey ? await db.getRepository(PayoutEntity).findOneBy({ attemptKey: comp.idempotencyKey }) : null;
    const purpose = purposeOf(comp, payout);
    const links = allLinks.filter((l) => l.compensationId === comp.id && l.purpose === purpose);
    const current = links.filter((l) => l.attemptKey === comp.idempotencyKey).at(-1);
    if (!purpose || !current) continue;
    out.set(comp.id, { purpose, state: linkState(current, now), expiresAt: current.expiresAt.toISOString(), replaceable: replaceRefusal(comp, payout, links) === null });
  }
  return out;
}

export async function sendNewLink(ctx: PaymentsContext, user: SessionUser, id: number): Promise<NewLinkResult> {
  const result = await ctx.db.transaction(async (em) => {
    const comp = await em.findOne(CompensationEntity, { where: { id }, lock: { mode: 'pessimistic_write' } });
    if (!comp || !canSeeStation(user, comp.stationId)) throw notFound('Compensation');
    const attemptKey = comp.idempotencyKey;
    const payout = attemptKey ? await em.findOneBy(PayoutEntity, { attemptKey }) : null;
    const purpose = purposeOf(comp, payout);
    const links = purpose ? await em.find(PaymentLinkEntity, { where: { compensationId: id, purpose }, lock: { mode: 'pessimistic_write' } }) : [];
    const refusal = replaceRefusal(comp, payout, links);
    if (refusal || !purpose || !attemptKey) throw refusal ?? new Error('a link purpose always has its payment attempt');
    const now = ctx.now();
    // Counted by the app's clock, which the link expiries use too; the first link (mailed at issue) does not count.
    const sent = await em.findBy(AuditLogEntity, { entityType: 'compensation', entityId: String(id), action: 'compensation.link_resent' });
    const lastHour = sent.filter((a) => Date.parse((a.after as { sentAt?: string } | null)?.sentAt ?? '') > now - 3_600_000).length;
    if (lastHour >= MAX_NEW_LINKS_PER_HOUR) {
      throw tooManyRequests(`compensation: at most ${MAX_NEW_LINKS_PER_HOUR} new links an hour; please wait before sending another.`);
    }
    const row = await compensationRow(em, id);
    if (!row.contact_email) throw conflict('no_contact_email', 'contactEmail: the booking has no e-mail address to send the new link to.');
    const live = links.filter((l) => !l.usedAt && l.expiresAt.getTime() > now).map((l) => l.id);
    if (live.length) await em.update(PaymentLinkEntity, live, { expiresAt: new Date(now) });
    const link = await createLink(em, ctx, { compensationId: id, purpose, attemptKey });
    const words = {
      passengerName: passengerNameOf(row), flight: `${row.carrier_code} ${row.flight_number}`, serviceDate: row.service_date,
      amountMinor: comp.amountMinor, currency: comp.currency, url: link.url, expiresAt: link.expiresAt, compensationId: id, language: row.booking_language,
    };
    const notice = newLinkNotice({ ...words, purpose });
    const [made]: { n: number | string }[] = await em.query('SELECT COUNT(*) AS n FROM payment_links WHERE compensation_id = ? AND purpose = ?', [id, purpose]);
    await enqueueMessage(em, {
      stationId: comp.stationId, flightId: comp.flightId, passengerIds: [comp.passengerId], kind: 'compensation-receipt', to: row.contact_email,
      subject: notice.subject, text: notice.text, html: notice.html, dedupeKey: `${purpose}-link:${id}:${attemptKey}:${made.n}`,
    });
    await audit(em, {
      actor: user, action: 'compensation.link_resent', entityType: 'compensation', entityId: id, stationId: comp.stationId,
      before: { liveLinksKilled: live, linksInLastHour: lastHour }, after: { purpose, attemptKey, sentAt: new Date(now).toISOString(), linkExpiresAt: link.expiresAt.toISOString() },
    });
    recordEffect(em, flightChanged(comp.flightId, comp.stationId, ['compensations']));
    return { compensationId: id, purpose, expiresAt: link.expiresAt.toISOString(), flightId: comp.flightId, stationId: comp.stationId };
  });
  return result;
}
