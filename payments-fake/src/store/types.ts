import type { Metadata } from '../resources/metadata.js';

/** Shapes follow the Issuing objects in the stripe-node 23.1 type definitions, trimmed to what the stand-in fills. */
export interface Address {
  city: string;
  country: string;
  line1: string;
  line2: string | null;
  postal_code: string;
  state: string | null;
}

export interface CardholderObject {
  id: string;
  object: 'issuing.cardholder';
  billing: { address: Address };
  company: null;
  created: number;
  email: string | null;
  individual: { first_name: string | null; last_name: string | null } | null;
  livemode: false;
  metadata: Metadata;
  name: string;
  phone_number: string | null;
  preferred_locales: string[] | null;
  requirements: { disabled_reason: null; past_due: string[] };
  spending_controls: null;
  status: 'active' | 'inactive';
  type: 'individual' | 'company';
}

export interface SpendingLimit {
  amount: number;
  categories: string[] | null;
  interval: string;
}

export type CardStatus = 'active' | 'inactive' | 'canceled';

/** A stored card keeps its cardholder as an id; responses expand it to the full cardholder, as Stripe does. */
export interface CardRecord {
  id: string;
  object: 'issuing.card';
  brand: string;
  cancellation_reason: 'lost' | 'stolen' | null;
  cardholder: string;
  created: number;
  currency: string;
  exp_month: number;
  exp_year: number;
  last4: string;
  livemode: false;
  metadata: Metadata;
  spending_limits: SpendingLimit[];
  status: CardStatus;
  type: 'virtual';
  /**
   * The full card number and security code. Never rendered unless an ephemeral key for this card asks for them with
   * `expand[]=number` / `expand[]=cvc`. Older state files lack them; they are made on first need.
   */
  number?: string;
  cvc?: string;
}

/** Stripe's `ephemeral_key` for an Issuing card: made with a nonce, good for reading one card's details briefly. */
export interface EphemeralKeyRecord {
  id: string;
  secret: string;
  cardId: string;
  nonce: string;
  created: number;
  expires: number;
}

/** A `us_bank_account` payment method: the stand-in keeps only what Stripe shows back (routing number, last four). */
export interface PaymentMethodObject {
  id: string;
  object: 'payment_method';
  billing_details: { name: string | null; email: string | null };
  created: number;
  livemode: false;
  metadata: Metadata;
  type: 'us_bank_account';
  us_bank_account: {
    account_holder_type: 'individual' | 'company';
    account_type: 'checking' | 'savings';
    bank_name: string | null;
    last4: string;
    routing_number: string;
  };
}

export type OutboundPaymentStatus = 'processing' | 'posted' | 'failed' | 'returned' | 'canceled';

/** Trimmed `treasury.outbound_payment` (stripe-node 23.1 Treasury.OutboundPayment). */
export interface OutboundPaymentObject {
  id: string;
  object: 'treasury.outbound_payment';
  amount: number;
  created: number;
  currency: string;
  description: string | null;
  destination_payment_method: string;
  financial_account: string;
  livemode: false;
  metadata: Metadata;
  returned_details: { code: string } | null;
  statement_descriptor: string;
  status: OutboundPaymentStatus;
  status_transitions: { posted_at: number | null; failed_at: number | null; returned_at: number | null; canceled_at: number | null };
}

export interface TransactionObject {
  id: string;
  object: 'issuing.transaction';
  amount: number;
  amount_details: { atm_fee: null; cashback_amount: null };
  authorization: null;
  balance_transaction: null;
  card: string;
  cardholder: string;
  created: number;
  currency: string;
  dispute: null;
  livemode: false;
  merchant_amount: number;
  merchant_currency: string;
  merchant_data: { category: string; name: string; city: string | null; country: string | null };
  metadata: Metadata;
  network_data: null;
  type: 'capture';
  wallet: null;
}

export interface EventObject {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: unknown; previous_attributes?: Record<string, unknown> };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
}

export interface IdempotencyRecord {
  key: string;
  method: string;
  path: string;
  fingerprint: string;
  status: number;
  body: string;
  requestId: string;
  createdAtMs: number;
}

export type DeliveryStatus = 'pending' | 'held' | 'delivered' | 'failed';

export interface DeliveryRecord {
  id: string;
  eventId: string;
  eventType: string;
  url: string;
  secret: string;
  payload: string;
  status: DeliveryStatus;
  attempts: number;
  nextAttemptAtMs: number | null;
  createdAtMs: number;
  lastAttemptAtMs: number | null;
  lastStatusCode: number | null;
  lastError: string | null;
  /** Set when a fault rule added this copy; the receiver sees the same event id twice. */
  duplicate: boolean;
}

export interface WebhookEndpoint {
  url: string;
  secret: string;
}

export interface StoreState {
  cardholders: Map<string, CardholderObject>;
  cards: Map<string, CardRecord>;
  transactions: Map<string, TransactionObject>;
  ephemeralKeys: Map<string, EphemeralKeyRecord>;
  paymentMethods: Map<string, PaymentMethodObject>;
  outboundPayments: Map<string, OutboundPaymentObject>;
  events: Map<string, EventObject>;
  idempotency: Map<string, IdempotencyRecord>;
  deliveries: Map<string, DeliveryRecord>;
  /** Endpoint set through the control API; overrides the one given at start-up until reset. */
  webhookEndpoint: WebhookEndpoint | null;
}
