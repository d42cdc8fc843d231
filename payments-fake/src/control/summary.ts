import type { ControlDeps } from './controlRouter.js';

function countBy<T>(items: Iterable<T>, key: (item: T) => string): Record<string, number> {
  const counts: Record<string, number> = {};
  for (const item of items) counts[key(item)] = (counts[key(item)] ?? 0) + 1;
  return counts;
}

export function summarize(deps: ControlDeps) {
  const state = deps.store.state;
  const endpoint = deps.webhooks.endpoint();
  return {
    cardholders: state.cardholders.size,
    cards: { total: state.cards.size, byStatus: countBy(state.cards.values(), (card) => card.status) },
    transactions: state.transactions.size,
    events: { total: state.events.size, byType: countBy(state.events.values(), (event) => event.type) },
    idempotencyKeys: state.idempotency.size,
    webhooks: {
      endpoint: endpoint ? { url: endpoint.url, secretSet: Boolean(endpoint.secret) } : null,
      deliveries: countBy(state.deliveries.values(), (delivery) => delivery.status),
    },
    faults: { api: deps.apiFaults.list(), webhooks: deps.webhookFaults.list() },
    dataDir: deps.store.dataDir,
  };
}
