import type {
  CardholderObject,
  CardRecord,
  DeliveryRecord,
  EventObject,
  IdempotencyRecord,
  StoreState,
  TransactionObject,
  WebhookEndpoint,
  EphemeralKeyRecord,
  PaymentMethodObject,
  OutboundPaymentObject,
} from './types.js';
import { readSnapshot, writeSnapshot } from './persistence.js';

const SNAPSHOT_VERSION = 1;

interface Snapshot {
  version: number;
  cardholders: CardholderObject[];
  cards: CardRecord[];
  transactions: TransactionObject[];
  ephemeralKeys?: EphemeralKeyRecord[];
  paymentMethods?: PaymentMethodObject[];
  outboundPayments?: OutboundPaymentObject[];
  events: EventObject[];
  idempotency: IdempotencyRecord[];
  deliveries: DeliveryRecord[];
  webhookEndpoint: WebhookEndpoint | null;
}

function emptyState(): StoreState {
  return {
    cardholders: new Map(),
    cards: new Map(),
    transactions: new Map(),
    ephemeralKeys: new Map(),
    paymentMethods: new Map(),
    outboundPayments: new Map(),
    events: new Map(),
    idempotency: new Map(),
    deliveries: new Map(),
    webhookEndpoint: null,
  };
}

function byId<T extends { id: string }>(items: T[] | undefined): Map<string, T> {
  return new Map((items ?? []).map((item) => [item.id, item]));
}

function fromSnapshot(raw: unknown): StoreState {
  const snapshot = raw as Partial<Snapshot>;
  if (snapshot.version !== SNAPSHOT_VERSION) {
    throw new Error(`payments-fake: unsupported state file version ${String(snapshot.version)}.`);
  }
  return {
    cardholders: byId(snapshot.cardholders),
    cards: byId(snapshot.cards),
    transactions: byId(snapshot.transactions),
    ephemeralKeys: byId(snapshot.ephemeralKeys),
    paymentMethods: byId(snapshot.paymentMethods),
    outboundPayments: byId(snapshot.outboundPayments),
    events: byId(snapshot.events),
    idempotency: new Map((snapshot.idempotency ?? []).map((record) => [record.key, record])),
    deliveries: byId(snapshot.deliveries),
    webhookEndpoint: snapshot.webhookEndpoint ?? null,
  };
}

/**
 * All stand-in state in memory, mirrored to `<dataDir>/state.json` after every change.
 * Maps keep insertion order, which is creation order, so lists need no extra sequence numbers.
 */
export class FakeStore {
  state: StoreState;
  private depth = 0;

  constructor(readonly dataDir: string | null) {
    const raw = dataDir ? readSnapshot(dataDir) : null;
    this.state = raw ? fromSnapshot(raw) : emptyState();
  }

  /** Runs a change and persists once the outermost change finishes, so one request is one atomic write. */
  mutate<T>(change: (state: StoreState) => T): T {
    this.depth += 1;
    try {
      return change(this.state);
    } finally {
      this.depth -= 1;
      if (this.depth === 0) this.persist();
    }
  }

  reset(): void {
    this.state = emptyState();
    this.persist();
  }

  private persist(): void {
    if (!this.dataDir) return;
    const s = this.state;
    const snapshot: Snapshot = {
      version: SNAPSHOT_VERSION,
      cardholders: [...s.cardholders.values()],
      cards: [...s.cards.values()],
      transactions: [...s.transactions.values()],
      ephemeralKeys: [...s.ephemeralKeys.values()],
      paymentMethods: [...s.paymentMethods.values()],
      outboundPayments: [...s.outboundPayments.values()],
      events: [...s.events.values()],
      idempotency: [...s.idempotency.values()],
      deliveries: [...s.deliveries.values()],
      webhookEndpoint: s.webhookEndpoint,
    };
    writeSnapshot(this.dataDir, snapshot);
  }
}
