// A travel voucher instead of money, only where the regime allows it, and only after the passenger was shown and
// sent the cash amount and the voucher's restrictions and then agreed. Both steps are kept and audited.
import type { DataSource, EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { z } from 'zod';
import type { voucherOfferResponseSchema, voucherTermsSchema } from '@shared/schemas/finance';
import { CompensationEntity, VoucherOfferEntity } from '../../db/entities';
import { conflict, notFound } from '../../http/errors';
import { canSeeStation } from '../../http/require-role';
import { audit } from '../audit/audit.service';
import { enqueueMessage } from '../outbox/outbox.service';
import { notifyOutbox } from '../outbox/outbox-signal';
import { policyFor } from '../volunteers/policy.service';
import { compensationRow, passengerNameOf, type CompensationRow } from './compensation-view';
import { voucherOffer } from './payment-notices';
import { voucherRuleFor } from './voucher-rules';

type VoucherTerms = z.infer<typeof voucherTermsSchema>;
type VoucherOfferResult = z.infer<typeof voucherOfferResponseSchema>['offer'];

async function lockVisible(em: EntityManager, user: SessionUser, id: number): Promise<CompensationEntity> {
  const row = await em.findOne(CompensationEntity, { where: { id }, lock: { mode: 'pessimistic_write' } });
  if (!row || !canSeeStation(user, row.stationId)) throw notFound('Compensation');
  return row;
}

function assertOpenForVoucher(row: CompensationEntity): void {
  if (row.state !== 'due') throw conflict('not_due', `A voucher can be chosen only before payment starts; this compensation is ${row.state}.`);
  const rule = voucherRuleFor(row.regime, row.voluntary);
  if (!rule.allowed) throw conflict('voucher_not_allowed', rule.rule);
}

/** The desk's view of the voucher choice for each compensation of a flight. */
export async function voucherTermsFor(db: DataSource, rows: CompensationRow[]): Promise<Map<number, VoucherTerms>> {
  const out = new Map<number, VoucherTerms>();
  if (!rows.length) return out;
  const offers = await db.getRepository(VoucherOfferEntity).createQueryBuilder('o').where('o.compensationId IN (:...ids)', { ids: rows.map((r) => r.id) }).getMany();
  const offerOf = new Map(offers.map((o) => [o.compensationId, o]));
  const restrictionsOf = new Map<number, string[]>();
  for (const row of rows) {
    if (!restrictionsOf.has(row.station_id)) restrictionsOf.set(row.station_id, (await policyFor(db, row.station_id)).voucherRestrictions);
    const rule = voucherRuleFor(row.regime, Boolean(row.voluntary));
    const offer = offerOf.get(row.id);
    out.set(row.id, {
      allowed: rule.allowed,
      rule: rule.rule,
      cashAmountMinor: row.amount_minor,
      currency: row.currency,
      restrictions: offer?.restrictions ?? restrictionsOf.get(row.station_id) ?? [],
      offeredAt: offer?.offeredAt.toISOString() ?? null,
      offerSentTo: offer?.sentTo ?? null,
      agreedAt: offer?.agreedAt?.toISOString() ?? row.voucher_agreed_at?.toISOString() ?? null,
    });
  }
  return out;
}

/** Shows (the answer) and sends (the outbox, when the booking has an address) the cash amount and the restrictions. */
export async function offerVoucher(db: DataSource, user: SessionUser, id: number): Promise<VoucherOfferResult> {
  const result = await db.transaction(async (em) => {
    const entity = await lockVisible(em, user, id);
    assertOpenForVoucher(entity);
    const existing = await em.findOneBy(VoucherOfferEntity, { compensationId: id });
    if (existing?.agreedAt) throw conflict('already_agreed', 'The passenger already agreed to a voucher.');
    const row = await compensationRow(em, id);
    const restrictions = (await policyFor(em, entity.stationId)).voucherRestrictions;
    const notice = voucherOffer({
      passengerName: passengerNameOf(row), flight: `${row.carrier_code} ${row.flight_number}`, serviceDate: row.service_date,
      amountMinor: row.amount_minor, currency: row.currency, restrictions, rule: voucherRuleFor(row.regime, Boolean(row.voluntary)).rule,
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
  if (result.sentTo) notifyOutbox();
  return result;
}

/** Records the passenger's agreement, in their words; the compensation will then be issued as a voucher. */
export async function recordVoucherAgreement(db: DataSource, user: SessionUser, id: number, statement: string): Promise<CompensationEntity> {
  return db.transaction(async (em) => {
    const entity = await lockVisible(em, user, id);
    const offer = await em.findOneBy(VoucherOfferEntity, { compensationId: id });
    if (offer?.agreedAt && entity.form === 'voucher') return entity;
    assertOpenForVoucher(entity);
    if (!offer) throw conflict('voucher_not_offered', 'Show and send the passenger the cash amount and the voucher’s restrictions first (voucher offer), then record their agreement.');
    const agreedAt = new Date();
    await em.update(VoucherOfferEntity, { compensationId: id }, { agreedAt, statement, agreedRecordedByUserId: user.id });
    await em.update(CompensationEntity, { id }, { form: 'voucher', voucherAgreedAt: agreedAt });
    await audit(em, { actor: user, action: 'compensation.voucher_agreed', entityType: 'compensation', entityId: id, stationId: entity.stationId, before: { form: entity.form }, after: { form: 'voucher', voucherAgreedAt: agreedAt.toISOString(), statement, cashAmountMinor: offer.cashAmountMinor, currency: offer.currency } });
    return em.findOneByOrFail(CompensationEntity, { id });
  });
}
