// Money handed over at the counter: cash from a named drawer or a numbered cheque, for exactly the amount owed, with
// the receipt the passenger signed on the desk's screen. The compensation is paid the moment it is recorded; the
// unique compensation key means a repeated request records nothing twice.
import type { DataSource, EntityManager } from 'typeorm';
import { formatMoney } from '@shared/compensation';
import type { SessionUser } from '@shared/schemas/auth';
import type { CounterPaymentBody } from '@shared/schemas/payment-media';
import { refundKindLabel } from '@shared/schemas/refunds';
import { CompensationEntity, CounterPaymentEntity, PaymentAgreementEntity } from '../../db/entities';
import { badRequest, conflict, notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';
import { flightChanged, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { resolvePaymentAlerts } from '../alerts/alerts.service';
import { gateIssue } from '../approvals/approval-gate';
import { compensationRow, passengerNameOf, type CompensationRow } from '../payments/compensation-view';
import { formFor, lockCompensation, paymentFacts } from '../agreements/payment-facts';

function sameRequest(paid: CounterPaymentEntity, body: CounterPaymentBody): boolean {
  return paid.medium === body.medium && paid.amountMinor === body.amountMinor && (paid.drawerId ?? undefined) === body.drawerId && (paid.chequeNumber ?? undefined) === body.chequeNumber;
}

export function receiptLines(view: CompensationRow, paid: Pick<CounterPaymentEntity, 'medium' | 'drawerId' | 'chequeNumber' | 'amountMinor' | 'currency' | 'paidAt'>, staff: string): string[] {
  return [
    // A refund the rule adds is receipted as what it is, never as compensation.
    refundKindLabel(view.source_kind) ? `Receipt for refund no. ${view.id} (${refundKindLabel(view.source_kind)})` : `Receipt for compensation no. ${view.id}`,
    `Passenger: ${passengerNameOf(view)}${view.pnr ? `, booking ${view.pnr}` : ''}`,
    `Flight: ${view.carrier_code} ${view.flight_number} on ${view.service_date}, station ${view.station_iata}`,
    `Rule: ${view.rule_ref}`,
    `Paid: ${formatMoney(paid.amountMinor, paid.currency)} ${paid.medium === 'cash' ? `in cash from drawer ${paid.drawerId}` : `by cheque no. ${paid.chequeNumber}`}`,
    `Paid at: ${paid.paidAt.toISOString()} (UTC), by ${staff}`,
    'The passenger signed below to confirm receipt.',
  ];
}

function isDuplicate(error: unknown): string | null {
  const e = error as { code?: string; sqlMessage?: string };
  if (e?.code !== 'ER_DUP_ENTRY') return null;
  return e.sqlMessage?.includes('uq_counter_cheque') ? 'cheque' : 'compensation';
}

export async function payAtCounter(db: DataSource, user: SessionUser, id: number, body: CounterPaymentBody): Promise<{ replay: boolean; row: CompensationEntity }> {
  try {
    return await db.transaction(async (em) => {
      const row = await lockCompensation(em, user, id);
      const earlier = await em.findOneBy(CounterPaymentEntity, { compensationId: id });
      if (earlier) {
        if (sameRequest(earlier, body)) return { replay: true, row };
        throw conflict('already_paid', `This compensation was already paid at the counter (${earlier.medium}, ${formatMoney(earlier.amountMinor, earlier.currency)}) at ${earlier.paidAt.toISOString()}.`);
      }
      if (row.state !== 'due') throw conflict('not_due', `Only a compensation still due can be paid at the counter; this one is ${row.state}.`);
      if (body.amountMinor !== row.amountMinor) {
        throw badRequest(`amountMinor: must be exactly the amount owed, ${row.amountMinor} (${formatMoney(row.amountMinor, row.currency)})`, [{ field: 'amountMinor', rule: `must equal ${row.amountMinor}` }]);
      }
      const facts = await paymentFacts(em, row);
      if (!facts.terms.media.includes(body.medium)) {
        throw badRequest(`medium: ${body.medium} is not allowed under ${facts.terms.ruleRef}; allowed: ${facts.terms.media.join(', ')}`, [{ field: 'medium', rule: `allowed: ${facts.terms.media.join(', ')}` }]);
      }
      if (!(await gateIssue(em, user, row)).approved) throw conflict('awaiting_approval', 'This amount is above your limit: it now waits for a supervisor of the station to approve it. Pay it once approved.');
      const paidAt = new Date();
      const view = await compensationRow(em, id);
      const paid = { compensationId: id, stationId: row.stationId, medium: body.medium, drawerId: body.drawerId ?? null, chequeNumber: body.chequeNumber ?? null, amountMinor: row.amountMinor, currency: row.currency, paidAt };
      const receiptText = receiptLines(view, paid, user.displayName).join('\n');
      await em.insert(CounterPaymentEntity, { ...paid, receiptText, signature: body.signature, paidByUserId: user.id });
      await em.update(CompensationEntity, { id }, { state: 'settled', medium: body.medium, form: formFor(body.medium) });
      await resolvePaymentAlerts(em, id, `Paid at the counter (${body.medium})`);
      await audit(em, {
        actor: user, action: 'compensation.paid_at_counter', entityType: 'compensation', entityId: id, stationId: row.stationId,
        before: { state: row.state, medium: row.medium },
        after: { state: 'settled', medium: body.medium, drawerId: paid.drawerId, chequeNumber: paid.chequeNumber, amountMinor: row.amountMinor, currency: row.currency, paidAt: paidAt.toISOString() },
      });
      recordEffect(em, flightChanged(row.flightId, row.stationId, ['compensations']));
      return { replay: false, row: await em.findOneByOrFail(CompensationEntity, { id }) };
    });
  } catch (error) {
    const dup = isDuplicate(error);
    if (dup === 'cheque') throw badRequest(`chequeNumber: cheque ${body.chequeNumber} was already used at this station`, [{ field: 'chequeNumber', rule: 'already used at this station' }]);
    if (dup === 'compensation') throw conflict('already_paid', 'This compensation was already paid at the counter.');
    throw error;
  }
}

/** The printable receipt: a counter payment's lines, or the agreement's text for a card or credit. */
export async function receiptFor(db: DataSource | EntityManager, user: SessionUser, id: number) {
  const view = await compensationRow(db, id);
  if (!canSeeStation(user, view.station_id)) throw notFound('Compensation');
  const paid = await db.getRepository(CounterPaymentEntity).findOneBy({ compensationId: id });
  const agreement = await db.getRepository(PaymentAgreementEntity).findOneBy({ compensationId: id });
  const lines = paid
    ? paid.receiptText.split('\n')
    : [`Compensation no. ${view.id}`, `Passenger: ${passengerNameOf(view)}`, `Flight: ${view.carrier_code} ${view.flight_number} on ${view.service_date}`, `Owed: ${formatMoney(view.amount_minor, view.currency)} (${view.rule_ref})`, `State: ${view.state}`];
  const agreed = agreement && agreement.medium === view.medium ? agreement : null;
  return { compensationId: id, lines, agreementText: agreed?.text ?? null, signature: paid?.signature ?? agreed?.signature ?? null };
}
