// The medium a compensation is paid in, and the passenger's agreement where the rule asks for one. A prepaid card or
// a travel credit is issued only when its agreement is complete: the exact text the passenger read (rebuilt here
// and compared), their acceptance, the time and the staff member, and the rule's conditions on value and expiry.
import type { DataSource, EntityManager } from 'typeorm';
import { agreementText, missingForAlternative, type Medium, type Regime } from '@shared/compensation';
import type { SessionUser } from '@shared/schemas/auth';
import type { AgreementBody } from '@shared/schemas/payment-media';
import { CompensationEntity, PaymentAgreementEntity } from '../../db/entities';
import type { AgreementMethod } from '../../db/entities/payment-media.entity';
import { badRequest, conflict } from '../../domain/errors';
import { flightChanged, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { compensationRow, passengerNameOf } from '../payments/compensation-view';
import { transferCurrencyProblem } from '../payouts/transfer-currencies';
import { formFor, lockCompensation, paymentFacts, type PaymentFacts } from './payment-facts';

const COUNTER: readonly Medium[] = ['cash', 'cheque'];

function assertAllowed(facts: PaymentFacts, medium: Medium): void {
  if (!facts.terms.media.includes(medium)) {
    throw badRequest(`medium: ${medium} is not allowed under ${facts.terms.ruleRef}; allowed: ${facts.terms.media.join(', ')}`, [{ field: 'medium', rule: `allowed: ${facts.terms.media.join(', ')}` }]);
  }
  assertProviderPays(facts.row, medium);
}

/** The rule may allow a medium the provider cannot pay in this currency: refused naming the currency. */
function assertProviderPays(row: Pick<CompensationEntity, 'currency'>, medium: Medium): void {
  const problem = medium === 'bank-transfer' ? transferCurrencyProblem(row.currency) : null;
  if (problem) throw badRequest(`medium: ${problem}`, [{ field: 'medium', rule: `bank transfers in ${row.currency} are not available` }]);
}

/** The agent picks how the passenger will be paid, among the media the rule allows. */
export async function chooseMedium(db: DataSource, user: SessionUser, id: number, medium: Medium): Promise<CompensationEntity> {
  return db.transaction(async (em) => {
    const row = await lockCompensation(em, user, id);
    if (row.state !== 'due') throw conflict('not_due', `The medium can be chosen only before payment starts; this compensation is ${row.state}.`);
    if (row.medium === medium) return row;
    assertAllowed(await paymentFacts(em, row), medium);
    await em.update(CompensationEntity, { id }, { medium, form: formFor(medium) });
    await audit(em, { actor: user, action: 'compensation.medium_chosen', entityType: 'compensation', entityId: id, stationId: row.stationId, before: { medium: row.medium }, after: { medium } });
    recordEffect(em, flightChanged(row.flightId, row.stationId, ['compensations']));
    return em.findOneByOrFail(CompensationEntity, { id });
  });
}

export interface AcceptanceInput extends Omit<AgreementBody, 'signature'> {
  method: Exclude<AgreementMethod, 'recorded-statement'>;
  signature: string | null;
}

/**
 * Records the passenger's agreement and switches the compensation to that medium. Shared by the desk (a signature on
 * its screen) and the passenger's own phone (staff null).
 */
export async function storeAgreement(em: EntityManager, actor: SessionUser | null, row: CompensationEntity, input: AcceptanceInput): Promise<void> {
  if (row.state !== 'due') throw conflict('not_due', `An agreement can be recorded only before payment starts; this compensation is ${row.state}.`);
  const facts = await paymentFacts(em, row);
  assertAllowed(facts, input.medium);
  const view = await compensationRow(em, row.id);
  const expected = agreementText({
    passengerName: passengerNameOf(view), flight: `${view.carrier_code} ${view.flight_number}`, serviceDate: view.service_date, medium: input.medium,
    cashAmountMinor: row.amountMinor, valueMinor: input.valueMinor, currency: row.currency, expiresOn: input.expiresOn, restrictions: facts.restrictions, ruleRef: facts.terms.ruleRef,
  });
  if (expected !== input.text) throw conflict('agreement_text_changed', 'The text shown is not the current text for this compensation (the amount, value or conditions changed). Show the passenger the new text and ask again.');
  const missing = missingForAlternative({ regime: row.regime as Regime, voluntary: row.voluntary, medium: input.medium, cashAmountMinor: row.amountMinor, valueMinor: input.valueMinor, toldInWriting: true, accepted: true, expiresAt: input.expiresOn });
  if (missing.length) throw conflict('agreement_conditions_unmet', `This ${input.medium} cannot stand in for money: ${missing.join('; ')}.`);
  const acceptedAt = new Date();
  const record = {
    compensationId: row.id, medium: input.medium, text: input.text, cashAmountMinor: row.amountMinor, valueMinor: input.valueMinor, currency: row.currency,
    expiresOn: input.expiresOn, method: input.method, signature: input.signature, statement: null, acceptedAt, staffUserId: actor?.id ?? null,
  };
  await em.upsert(PaymentAgreementEntity, record, ['compensationId']);
  const credit = input.medium === 'travel-credit';
  await em.update(CompensationEntity, { id: row.id }, {
    medium: input.medium, form: formFor(input.medium), voucherAgreedAt: acceptedAt,
    creditValueMinor: credit ? input.valueMinor : null, creditExpiresOn: credit ? input.expiresOn : null,
  });
  await audit(em, {
    actor: actor ?? { label: 'passenger (own phone)' }, action: 'compensation.agreement_recorded', entityType: 'compensation', entityId: row.id, stationId: row.stationId,
    before: { medium: row.medium },
    after: { medium: input.medium, method: input.method, text: input.text, cashGivenUpMinor: row.amountMinor, valueMinor: input.valueMinor, currency: row.currency, expiresOn: input.expiresOn, acceptedAt: acceptedAt.toISOString(), signatureChars: input.signature?.length ?? 0 },
  });
  recordEffect(em, flightChanged(row.flightId, row.stationId, ['compensations']));
}

export async function recordDeskAgreement(db: DataSource, user: SessionUser, id: number, body: AgreementBody): Promise<CompensationEntity> {
  return db.transaction(async (em) => {
    const row = await lockCompensation(em, user, id);
    await storeAgreement(em, user, row, { ...body, method: 'desk-signature' });
    return em.findOneByOrFail(CompensationEntity, { id });
  });
}

/** For the passenger's own page: the same record, accepted on their phone (no staff member). */
export async function recordPhoneAcceptance(em: EntityManager, compensationId: number, input: Omit<AgreementBody, 'signature'>): Promise<void> {
  const row = await lockCompensation(em, null, compensationId);
  await storeAgreement(em, null, row, { ...input, method: 'phone', signature: null });
}

/**
 * The one check before a compensation goes to the provider, on every path that issues (the desk's first issue, a
 * re-issue, and the worker just before it creates the card): the medium is one the rule allows and the provider pays,
 * and a card or credit has its complete agreement. Returns what the provider's card must hold: the money owed, or a
 * travel credit's agreed value, which a rule may require to be more than the money (Canada) and never less (US).
 */
export async function assertReadyToIssue(em: EntityManager, row: CompensationEntity): Promise<number> {
  if (COUNTER.includes(row.medium)) throw conflict('pay_at_counter', `This compensation is paid in ${row.medium} at the counter: record the counter payment with the passenger's signature instead.`);
  const facts = await paymentFacts(em, row);
  if (!facts.terms.media.includes(row.medium)) throw conflict('medium_not_allowed', `${row.medium} is not allowed under ${facts.terms.ruleRef}; choose one of ${facts.terms.media.join(', ')}.`);
  assertProviderPays(row, row.medium);
  if (!facts.terms.needsAgreement.includes(row.medium)) return row.amountMinor;
  const agreement = await em.findOneBy(PaymentAgreementEntity, { compensationId: row.id });
  if (!agreement || agreement.medium !== row.medium) throw conflict('agreement_missing', `A ${row.medium} needs the passenger's recorded agreement first (${facts.terms.ruleRef}).`);
  if (agreement.cashAmountMinor !== row.amountMinor || agreement.currency !== row.currency) throw conflict('agreement_stale', 'The amount owed changed after the passenger agreed: show them the new text and record the agreement again.');
  const accepted = agreement.method === 'phone' || (agreement.method === 'desk-signature' && Boolean(agreement.signature)) || (agreement.method === 'recorded-statement' && Boolean(agreement.statement));
  const missing = missingForAlternative({ regime: row.regime as Regime, voluntary: row.voluntary, medium: row.medium, cashAmountMinor: row.amountMinor, valueMinor: agreement.valueMinor, toldInWriting: agreement.text.length > 0, accepted, expiresAt: agreement.expiresOn });
  if (missing.length) throw conflict('agreement_incomplete', `The agreement is incomplete: ${missing.join('; ')}.`);
  // A prepaid card is money on a card: it holds the amount owed. A credit holds the value the passenger agreed to.
  return row.medium === 'travel-credit' ? agreement.valueMinor : row.amountMinor;
}
