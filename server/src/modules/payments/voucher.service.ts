// The desk's view of how each compensation may be paid, and the written offer of a card or credit: the cash amount
// and the restrictions are shown and sent before the passenger is asked to agree to anything. The agreement itself is
// a record of the agreements module (text, signature, time, staff member).
import type { DataSource } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { z } from 'zod';
import type { voucherOfferResponseSchema, voucherTermsSchema } from '@shared/schemas/finance';
import type { PaymentMediaView } from '@shared/schemas/payment-media';
import { CounterPaymentEntity, PaymentAgreementEntity, StationEntity, VoucherOfferEntity } from '../../db/entities';
import { conflict } from '../../domain/errors';
import { audit } from '../audit/audit.service';
import { enqueueMessage } from '../outbox/outbox.service';
import { policyFor } from '../volunteers/policy.service';
import { lockCompensation, paymentFacts } from '../agreements/payment-facts';
import { compensationRow, passengerNameOf, type CompensationRow } from './compensation-view';
import { voucherOffer } from './payment-notices';
import { termsView } from './voucher-rules';
import { OWED_STATES } from '../compensations/payment-deadlines';
import { passengerLinks } from '../payouts/link-resend';
import { transferCurrencyProblem } from '../payouts/transfer-currencies';

type VoucherTerms = z.infer<typeof voucherTermsSchema>;
type VoucherOfferResult = z.infer<typeof voucherOfferResponseSchema>['offer'];

export interface DeskPaymentInfo {
  voucher: VoucherTerms;
  payment: PaymentMediaView;
}

async function byCompensation<T extends { compensationId: number }>(db: DataSource, entity: new () => T, ids: number[]): Promise<Map<number, T>> {
  const rows = await db.getRepository(entity).createQueryBuilder('x').where('x.compensationId IN (:...ids)', { ids }).getMany();
  return new Map(rows.map((r) => [r.compensationId, r]));
}

/** For each compensation of a list: the media its rule allows, the written offer, the agreement and any counter payment. */
export async function paymentInfoFor(db: DataSource, rows: CompensationRow[]): Promise<Map<number, DeskPaymentInfo>> {
  const out = new Map<number, DeskPaymentInfo>();
  if (!rows.length) return out;
  const ids = rows.map((r) => r.id);
  const [offers, agreements, counter, links] = await Promise.all([byCompensation(db, VoucherOfferEntity, ids), byCompensation(db, PaymentAgreementEntity, ids), byCompensation(db, CounterPaymentEntity, ids), passengerLinks(db, ids, Date.now())]);
  const stations = new Map<number, { zone: string; restrictions: string[] }>();
  for (const row of rows) {
    if (!stations.has(row.station_id)) {
      const station = await db.getRepository(StationEntity).findOneByOrFail({ id: row.station_id });
      stations.set(row.station_id, { zone: station.timeZone, restrictions: (await policyFor(db, row.station_id)).voucherRestrictions });
    }
    const station = stations.get(row.station_id)!;
    const lawful = termsView({ regime: row.regime, voluntary: Boolean(row.voluntary), deniedAt: new Date(row.created_at), timeZone: station.zone }, station.restrictions, row.due_by, (OWED_STATES as readonly string[]).includes(row.state), new Date());
    // The desk sees a lawful medium it cannot use here, with why, rather than a choice that is refused once made.
    const transferProblem = lawful.media.includes('bank-transfer') ? transferCurrencyProblem(row.currency) : null;
    const terms = { ...lawful, unavailable: transferProblem ? [{ medium: 'bank-transfer' as const, reason: transferProblem }] : [] };
    const offer = offers.get(row.id);
    const agreement = agreements.get(row.id);
    const paid = counter.get(row.id);
    out.set(row.id, {
      voucher: {
        allowed: terms.media.includes('travel-credit'),
        rule: terms.ruleRef,
        cashAmountMinor: row.amount_minor,
        currency: row.currency,
        restrictions: offer?.restrictions ?? station.restrictions,
        offeredAt: offer?.offeredAt.toISOString() ?? null,
        offerSentTo: offer?.sentTo ?? null,
        agreedAt: agreement?.acceptedAt.toISOString() ?? null,
      },
      payment: {
        terms,
        agreement: agreement
          ? {
              medium: agreement.medium, method: agreement.method, text: agreement.text, cashAmountMinor: agreement.cashAmountMinor, valueMinor: agreement.valueMinor,
              currency: agreement.currency, expiresOn: agreement.expiresOn, acceptedAt: agreement.acceptedAt.toISOString(), staffUserId: agreement.staffUserId, signed: Boolean(agreement.signature),
            }
          : null,
        counterPayment: paid
          ? { medium: paid.medium, drawerId: paid.drawerId, chequeNumber: paid.chequeNumber, amountMinor: paid.amountMinor, currency: paid.currency, paidAt: paid.paidAt.toISOString(), paidByUserId: paid.paidByUserId, receiptText: paid.receiptText }
          : null,
        passengerLink: links.get(row.id) ?? null,
      },
    });
  }
  return out;
}

/** Shows (the answer) and sends (the outbox, when the booking has an address) the cash amount and the restrictions. */
export async function offerVoucher(db: DataSource, user: SessionUser, id: number): Promise<VoucherOfferResult> {
  const result = await db.transaction(async (em) => {
    const entity = await lockCompensation(em, user, id);
    if (entity.state !== 'due') throw conflict('not_due', `A card or credit can be offered only before payment starts; this compensation is ${entity.state}.`);
    const facts = await paymentFacts(em, entity);
    if (!facts.terms.media.includes('travel-credit')) throw conflict('voucher_not_allowed', `No travel credit under ${facts.terms.ruleRef}.`);
    const row = await compensationRow(em, id);
    const restrictions = facts.restrictions;
    const notice = voucherOffer({
      passengerName: passengerNameOf(row), flight: `${row.carrier_code} ${row.flight_number}`, serviceDate: row.service_date,
      amountMinor: row.amount_minor, currency: row.currency, restrictions, rule: facts.terms.ruleRef, language: row.booking_language,
    });
    const offeredAt = new Date();
    if (row.contact_email) {
      await enqueueMessage(em, {
        stationId: row.station_id, flightId: row.flight_id, passengerIds: [row.passenger_id], kind: 'voucher-offer', to: row.contact_email,
        subject: notice.subject, text: notice.text, html: notice.html, dedupeKey: `voucher-offer:${id}:${offeredAt.getTime()}`,
      });
    }
    const offer = { compensationId: id, cashAmountMinor: row.amount_minor, currency: row.currency, restrictions, text: notice.text, sentTo: row.contact_email, offeredByUserId: user.id, offeredAt };
    await em.upsert(VoucherOfferEntity, offer, ['compensationId']);
    await audit(em, { actor: user, action: 'compensation.voucher_offered', entityType: 'compensation', entityId: id, stationId: entity.stationId, after: { cashAmountMinor: row.amount_minor, currency: row.currency, restrictions, sentTo: row.contact_email } });
    return { cashAmountMinor: row.amount_minor, currency: row.currency, restrictions, text: notice.text, sentTo: row.contact_email, offeredAt: offeredAt.toISOString() };
  });
  return result;
}
