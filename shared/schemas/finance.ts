// Compensation payments and finance's screens: the ledger, reconciliation with the payment provider, and the
// quarterly report. Money is always integer minor units with an ISO 4217 currency.
import { z } from 'zod';
import { currencySchema, regimeSchema } from './common';
import { mediumSchema, paymentMediaViewSchema } from './payment-media';

export const COMPENSATION_STATES = ['due', 'issuing', 'issued', 'settled', 'failed', 'voided', 'canceled'] as const;
export const compensationStateSchema = z.enum(COMPENSATION_STATES, { error: `state must be one of ${COMPENSATION_STATES.join(', ')}` });
export type CompensationStateCode = z.infer<typeof compensationStateSchema>;

export const COMPENSATION_FORMS = ['prepaid-card', 'voucher'] as const;
export const compensationFormSchema = z.enum(COMPENSATION_FORMS);

export const STATE_LABELS: Record<CompensationStateCode, string> = {
  due: 'Due',
  issuing: 'Issuing',
  issued: 'Issued',
  settled: 'Spent',
  failed: 'Failed',
  voided: 'Voided',
  canceled: 'Canceled by the provider',
};

/**
 * A denial or a volunteer's agreement is a fact; a payment is an attempt to settle it. In these states the attempt
 * was lost (voided by finance, canceled at the provider, refused by it): the passenger is owed again, and finance
 * may re-issue.
 */
export const PAYMENT_LOST_STATES = ['failed', 'voided', 'canceled'] as const satisfies readonly CompensationStateCode[];
/** The money reached the passenger. */
export const PAID_STATES = ['issued', 'settled'] as const satisfies readonly CompensationStateCode[];
export const isPaymentLost = (state: CompensationStateCode) => (PAYMENT_LOST_STATES as readonly string[]).includes(state);

const isoDate = (field: string) =>
  z.string().regex(/^\d{4}-\d{2}-\d{2}$/, `${field} must be a date as YYYY-MM-DD`).refine((s) => {
    const d = new Date(`${s}T00:00:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
  }, `${field} must be a real calendar date`);

/** An amount in one currency (declared here, before the report's amountSchema, for the reconciliation summary). */
function amountSchemaBase() {
  return z.object({ currency: z.string(), amountMinor: z.number() });
}

const positiveId = (field: string) => z.coerce.number({ error: `${field} must be a number` }).int(`${field} must be a whole number`).positive(`${field} must be positive`);
const reason = (field: string) => z.string({ error: `${field} is required` }).trim().min(3, `${field} must say why, in at least 3 characters`).max(200, `${field} must be at most 200 characters`);

/** What the provider last reported about the card, kept from its answers and webhooks. */
export const providerCardSchema = z.object({
  cardId: z.string(),
  cardholderId: z.string().nullable(),
  status: z.string(),
  limitMinor: z.number().nullable(),
  spentMinor: z.number(),
  currency: z.string().nullable(),
  last4: z.string().nullable(),
});

export const compensationViewSchema = z.object({
  id: z.number(),
  stationId: z.number(),
  stationIata: z.string(),
  flightId: z.number(),
  flight: z.string(),
  serviceDate: z.string(),
  passengerId: z.number(),
  passengerName: z.string(),
  pnr: z.string(),
  /** fee-refund and cabin-refund pay the refunds a rule adds to a compensation, counted apart from it. */
  sourceKind: z.enum(['volunteer', 'denial', 'top-up', 'fee-refund', 'cabin-refund']),
  regime: z.string(),
  voluntary: z.boolean(),
  band: z.string(),
  ruleRef: z.string(),
  form: compensationFormSchema,
  medium: mediumSchema,
  /** The rule's payment deadline (UTC), or null when it sets none. */
  dueBy: z.string().nullable(),
  amountMinor: z.number(),
  currency: z.string(),
  state: compensationStateSchema,
  lastError: z.string().nullable(),
  voidReason: z.string().nullable(),
  voucherAgreedAt: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
  provider: providerCardSchema.nullable(),
});
export type CompensationView = z.infer<typeof compensationViewSchema>;

// ── The desk: issuing, and a voucher only with the passenger's recorded agreement ──────────────────────────

export const voucherTermsSchema = z.object({
  /** Whether this compensation may be paid as a travel voucher at all under its regime. */
  allowed: z.boolean(),
  rule: z.string(),
  cashAmountMinor: z.number(),
  currency: z.string(),
  restrictions: z.array(z.string()),
  offeredAt: z.string().nullable(),
  offerSentTo: z.string().nullable(),
  agreedAt: z.string().nullable(),
});

export const deskCompensationSchema = compensationViewSchema.extend({ voucher: voucherTermsSchema, payment: paymentMediaViewSchema });
export const deskCompensationsResponseSchema = z.object({ compensations: z.array(deskCompensationSchema) });
export type DeskCompensation = z.infer<typeof deskCompensationSchema>;

export const compensationResponseSchema = z.object({ compensation: compensationViewSchema });

export const voucherOfferResponseSchema = z.object({
  offer: z.object({ cashAmountMinor: z.number(), currency: z.string(), restrictions: z.array(z.string()), text: z.string(), sentTo: z.string().nullable(), offeredAt: z.string() }),
});

export const voucherAgreementBodySchema = z.object({
  agreed: z.literal(true, { error: 'agreed must be true: record an agreement only when the passenger agreed' }),
  statement: z.string({ error: 'statement is required' }).trim().min(10, 'statement must record what the passenger agreed to, in at least 10 characters').max(1000, 'statement must be at most 1000 characters'),
});

export const voidBodySchema = z.object({ reason: reason('reason') });
export const reissueBodySchema = z.object({ reason: reason('reason') });

// ── The ledger ──────────────────────────────────────────────────────────────────────────────────────────────

export const ledgerQuerySchema = z
  .object({
    stationId: positiveId('stationId').optional(),
    from: isoDate('from').optional(),
    to: isoDate('to').optional(),
    regime: regimeSchema.optional(),
    state: compensationStateSchema.optional(),
    medium: mediumSchema.optional(),
    /** Owed and past its rule's deadline, or within the last hours before it. */
    due: z.enum(['overdue', 'due-soon'], { error: 'due must be overdue or due-soon' }).optional(),
    page: z.coerce.number({ error: 'page must be a number' }).int('page must be a whole number').min(1, 'page must be at least 1').max(100_000, 'page must be at most 100000').default(1),
    pageSize: z.coerce.number({ error: 'pageSize must be a number' }).int('pageSize must be a whole number').min(1, 'pageSize must be at least 1').max(200, 'pageSize must be at most 200').default(50),
  })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { message: 'to must not be before from', path: ['to'] });
export type LedgerQuery = z.infer<typeof ledgerQuerySchema>;

export const currencyTotalSchema = z.object({
  currency: z.string(),
  count: z.number(),
  /** Everything the rows are for, owed or paid: a lost payment does not make the passenger owed less. */
  amountMinor: z.number(),
  /** Issued or spent: the money that left. */
  paidMinor: z.number(),
  /** Not paid: due, being issued, or a payment voided, canceled or refused. */
  owedMinor: z.number(),
  /** Of what is owed, the part whose payment was lost (voided, canceled or refused) and waits for a re-issue. */
  lostMinor: z.number(),
});

export const mediumTotalSchema = currencyTotalSchema.extend({ medium: mediumSchema });

export const ledgerResponseSchema = z.object({
  rows: z.array(compensationViewSchema),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
  totals: z.array(currencyTotalSchema),
  /** The same totals per medium: drawers and cheques, transfers and cards at the provider, credits outstanding. */
  byMedium: z.array(mediumTotalSchema),
  /** Refunds the rules add (fees, downgrades) among the filtered rows: counted here, never in the totals above. */
  refundTotals: z.array(currencyTotalSchema),
});
export type LedgerResponse = z.infer<typeof ledgerResponseSchema>;

// ── Reconciliation ──────────────────────────────────────────────────────────────────────────────────────────

export const DIFFERENCE_KINDS = [
  'missing-at-provider',
  'missing-in-ledger',
  'amount-differs',
  'currency-differs',
  'state-differs',
  'card-differs',
  'duplicate-at-provider',
] as const;
export type DifferenceKind = (typeof DIFFERENCE_KINDS)[number];

export const DIFFERENCE_LABELS: Record<DifferenceKind, string> = {
  'missing-at-provider': 'In the ledger, not at the provider or in the register',
  'missing-in-ledger': 'At the provider or in the register, not in the ledger',
  'amount-differs': 'Amount differs',
  'currency-differs': 'Currency differs',
  'state-differs': 'State differs',
  'card-differs': 'Another card or transfer than the ledger names',
  'duplicate-at-provider': 'More than one card or transfer for one compensation',
};

export const startReconciliationBodySchema = z.object({ stationId: positiveId('stationId').optional() });
export const resolveDifferenceBodySchema = z.object({
  note: z.string({ error: 'note is required' }).trim().min(3, 'note must say how it was resolved, in at least 3 characters').max(500, 'note must be at most 500 characters'),
});

export const RUN_STATUSES = ['running', 'completed', 'failed', 'interrupted'] as const;

/** Where each medium's other side is read: the provider's cards or transfers, the counter's records, or nowhere. */
export const RECONCILED_AGAINST = ['provider-cards', 'provider-transfers', 'counter-register', 'outstanding-credits'] as const;
export const RECONCILED_AGAINST_LABELS: Record<(typeof RECONCILED_AGAINST)[number], string> = {
  'provider-cards': 'cards at the provider',
  'provider-transfers': 'bank transfers (outbound payments) at the provider',
  'counter-register': 'drawers and the cheque register',
  'outstanding-credits': 'travel credits issued and not yet used',
};

export const mediumReconciliationSchema = z.object({
  medium: mediumSchema,
  against: z.enum(RECONCILED_AGAINST),
  /** Compensations of this medium in the ledger of the stations compared. */
  ledgerRows: z.number(),
  /** Records read on the other side: cards, outbound payments, counter payments. */
  otherSide: z.number(),
  differences: z.number(),
  /** Per currency: money paid through this medium as the other side records it. */
  paid: z.array(amountSchemaBase()),
  /** Per currency: still to be used (a travel credit's unspent value), a liability of the carrier. */
  outstanding: z.array(amountSchemaBase()),
});
export type MediumReconciliation = z.infer<typeof mediumReconciliationSchema>;

export const reconciliationRunSchema = z.object({
  id: z.number(),
  status: z.enum(RUN_STATUSES),
  stationIds: z.array(z.number()),
  stations: z.array(z.string()),
  startedBy: z.string(),
  startedAt: z.string(),
  finishedAt: z.string().nullable(),
  pagesRead: z.number(),
  cardsSeen: z.number(),
  ledgerRows: z.number(),
  differences: z.number(),
  unresolved: z.number(),
  error: z.string().nullable(),
  /** Empty for runs from before reconciliation read each medium apart. */
  byMedium: z.array(mediumReconciliationSchema),
});
export type ReconciliationRun = z.infer<typeof reconciliationRunSchema>;

export const reconciliationDifferenceSchema = z.object({
  id: z.number(),
  kind: z.enum(DIFFERENCE_KINDS),
  medium: mediumSchema.nullable(),
  compensationId: z.number().nullable(),
  /** The other side's record: a card or outbound payment id, or a drawer or cheque of the counter register. */
  cardId: z.string().nullable(),
  ledgerValue: z.string().nullable(),
  providerValue: z.string().nullable(),
  resolvedAt: z.string().nullable(),
  resolvedBy: z.string().nullable(),
  note: z.string().nullable(),
});
export type ReconciliationDifference = z.infer<typeof reconciliationDifferenceSchema>;

export const reconciliationRunsResponseSchema = z.object({ runs: z.array(reconciliationRunSchema) });
export const reconciliationDetailSchema = z.object({ run: reconciliationRunSchema, differences: z.array(reconciliationDifferenceSchema) });
export const startReconciliationResponseSchema = z.object({ run: reconciliationRunSchema });

// ── The period report ───────────────────────────────────────────────────────────────────────────────────────

export const quarterSchema = z.string({ error: 'quarter is required' }).regex(/^\d{4}-Q[1-4]$/, 'quarter must look like 2026-Q4');

export const reportQuerySchema = z.object({ quarter: quarterSchema, stationId: positiveId('stationId') });

export const amountSchema = z.object({ currency: currencySchema, amountMinor: z.number() });

export const reportLineSchema = z.object({
  code: z.string(),
  label: z.string(),
  /** Passengers; null for a line that is a sum of money only, or that Bumpboard does not track. */
  count: z.number().nullable(),
  amounts: z.array(amountSchema).nullable(),
  note: z.string().nullable(),
  /** Where the line's definition comes from: the form's own wording or instructions, or the rule's article. */
  source: z.string(),
});
export type ReportLine = z.infer<typeof reportLineSchema>;

/** One flight date's figures, from the same items as the lines: the paid sums add up to the paid lines. */
export const reportDaySchema = z.object({
  date: z.string(),
  currency: z.string(),
  /** Paid to volunteers, as the report's paid lines count money (for Form 251: cash equivalents only). */
  voluntaryPaidMinor: z.number(),
  /** Paid to passengers denied boarding involuntarily, counted the same way. */
  involuntaryPaidMinor: z.number(),
  /** Owed to anyone and not paid yet, including payments voided, canceled or refused. */
  owedMinor: z.number(),
});
export type ReportDay = z.infer<typeof reportDaySchema>;

/** The quarter's compensations by the medium they are paid through, with what that medium's own record says. */
export const reportMediumLineSchema = z.object({
  medium: mediumSchema,
  /** Where the paid figure comes from: the drawers, the cheque register, the provider's transfers or cards. */
  recordedIn: z.string(),
  currency: z.string(),
  /** Compensations of the quarter paid, or to be paid, through this medium. */
  count: z.number(),
  /** What they are for: owed whatever became of the payment. */
  owedMinor: z.number(),
  /** What the medium's record says was paid: counted at the counter, sent by transfer, spent on the card. */
  paidMinor: z.number(),
  /** Still on a live card: for a travel credit, the carrier's liability until it is used. */
  outstandingMinor: z.number(),
  /** The value of the travel credits issued (it may be more than the money given up); 0 for other media. */
  creditValueMinor: z.number(),
  /** E.g. how many drawers or cheques. */
  detail: z.string(),
});
export type ReportMediumLine = z.infer<typeof reportMediumLineSchema>;

export const periodReportSchema = z.object({
  quarter: z.string(),
  from: z.string(),
  to: z.string(),
  station: z.object({ id: z.number(), iata: z.string(), name: z.string(), regime: z.string(), currency: z.string() }),
  form: z.enum(['us-form-251', 'eu-261', 'uk-261', 'ca-appr']),
  title: z.string(),
  /** Where the denial categories came from: the denials records, or the compensations alone. */
  source: z.enum(['denials', 'compensations']),
  lines: z.array(reportLineSchema),
  perDay: z.array(reportDaySchema),
  byMedium: z.array(reportMediumLineSchema),
  notes: z.array(z.string()),
});
export type PeriodReport = z.infer<typeof periodReportSchema>;
