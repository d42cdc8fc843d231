// The passenger's choice and the care given, for the written statement and the passenger's notices.
import type { DataSource, EntityManager } from 'typeorm';
import type { ChoiceKind, Regime } from '@shared/compensation';
import { translator, type Language, type MessageKey } from '@shared/i18n';
import { CareGivenEntity, CompensationEntity, PassengerChoiceEntity } from '../../db/entities';

export interface StatementChoice {
  /** 'refund' | 'refund-and-return' | 'reroute-earliest' | 'reroute-later' (see shared/compensation/choice-rules.ts). */
  kind: ChoiceKind;
  /** What the rule says follows from the choice, in the passenger's language, with the agent's note when there is one. */
  detail: string;
}

export interface StatementCareItem {
  kind: 'meal' | 'refreshment' | 'hotel' | 'transport' | 'communication';
  description: string;
  /** Present when the care had a cost (a meal voucher's value, a hotel night), in minor units of `currency`. */
  amountMinor?: number;
  currency?: string;
}

export interface ChoiceAndCare {
  /** Null while the desk has recorded no choice for this passenger. */
  choice: StatementChoice | null;
  /** Care handed over or booked so far, oldest first; empty when none was given. */
  care: StatementCareItem[];
}

/** Which case: the compensation row, or the denial (or volunteer) and the passenger it is for. */
export type ChoiceAndCareKey = { compensationId: number } | { sourceKind: 'denial' | 'volunteer'; sourceId: number; passengerId: number };

/**
 * What a statement or notice says about the passenger's choice and the care given. Reads inside the caller's
 * transaction when given an EntityManager, so a statement queued in the same transaction as a record sees it.
 * A case with no compensation row yet answers `{ choice: null, care: [] }`.
 */
export async function choiceAndCareForStatement(db: DataSource | EntityManager, key: ChoiceAndCareKey, language: Language = 'en'): Promise<ChoiceAndCare> {
  const comp = await db.getRepository(CompensationEntity).findOneBy('compensationId' in key ? { id: key.compensationId } : { sourceKind: key.sourceKind, sourceId: key.sourceId, passengerId: key.passengerId });
  if (!comp) return { choice: null, care: [] };
  const [choice, given] = await Promise.all([
    db.getRepository(PassengerChoiceEntity).findOneBy({ compensationId: comp.id }),
    db.getRepository(CareGivenEntity).find({ where: { compensationId: comp.id }, order: { id: 'ASC' } }),
  ]);
  return {
    choice: choice ? { kind: choice.kind, detail: choiceDetail(language, comp.regime as Regime, choice.kind, choice.note) } : null,
    care: given.map((g) => ({
      kind: g.kind,
      description: g.hotelName ? `${g.description} (${g.hotelName})` : g.description,
      ...(g.amountMinor !== null && g.currency !== null ? { amountMinor: g.amountMinor, currency: g.currency } : {}),
    })),
  };
}

const DETAIL_KEY: Record<Regime, MessageKey> = {
  'eu-261': 'statement.choice.detail.eu', 'uk-261': 'statement.choice.detail.eu', 'ca-appr': 'statement.choice.detail.ca', 'us-dot': 'statement.choice.detail.us',
};
/** ICU select keys cannot hold hyphens. */
const KIND_SELECTOR: Record<ChoiceKind, string> = { refund: 'refund', 'refund-and-return': 'refundAndReturn', 'reroute-earliest': 'rerouteEarliest', 'reroute-later': 'rerouteLater' };

/** What the choice means under the rule, in the passenger's words; the agent's note stays as the agent wrote it. */
export function choiceDetail(language: Language, regime: Regime, kind: ChoiceKind, note: string): string {
  const tr = translator(language);
  const meaning = tr.t(DETAIL_KEY[regime], { kind: KIND_SELECTOR[kind] });
  return note.trim() ? `${meaning} ${tr.t('statement.choice.note', { note: note.trim() })}` : meaning;
}
