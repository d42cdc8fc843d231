import type { StoreState } from '../store/types.js';
import { allTimeLimit, spentOnCard } from '../resources/render.js';
import { escapeHtml, formatMetadata, formatMinor, formatTime } from './format.js';

const RECENT_EVENTS = 50;
const TITLE = 'Local payments stand-in (test data)';

function money(amount: number, currency: string): string {
  return `${formatMinor(amount, currency)} <span class="muted">(${amount})</span>`;
}

function table(headers: string[], rows: string[][], empty: string): string {
  if (rows.length === 0) return `<p class="muted">${empty}</p>`;
  const head = headers.map((h) => `<th scope="col">${h}</th>`).join('');
  const body = rows.map((cells) => `<tr>${cells.map((c) => `<td>${c}</td>`).join('')}</tr>`).join('\n');
  return `<table><thead><tr>${head}</tr></thead><tbody>\n${body}\n</tbody></table>`;
}

function cardholderRows(state: StoreState): string[][] {
  return [...state.cardholders.values()].reverse().map((c) => [
    `<code>${c.id}</code>`,
    escapeHtml(c.name),
    escapeHtml(c.email ?? ''),
    c.status,
    formatMetadata(c.metadata),
    formatTime(c.created),
  ]);
}

function cardRows(state: StoreState): string[][] {
  return [...state.cards.values()].reverse().map((card) => {
    const limit = allTimeLimit(card);
    const holder = state.cardholders.get(card.cardholder);
    return [
      `<code>${card.id}</code>`,
      escapeHtml(holder?.name ?? card.cardholder),
      limit === null ? '<span class="muted">no all_time limit</span>' : money(limit, card.currency),
      money(spentOnCard(card.id, state), card.currency),
      card.currency,
      `<span class="status-${card.status}">${card.status}</span>`,
      formatMetadata(card.metadata),
      formatTime(card.created),
    ];
  });
}

function eventRows(state: StoreState): string[][] {
  return [...state.events.values()]
    .slice(-RECENT_EVENTS)
    .reverse()
    .map((event) => {
      const object = event.data.object as { id?: string };
      return [`<code>${event.id}</code>`, escapeHtml(event.type), `<code>${escapeHtml(object.id ?? '')}</code>`, String(event.pending_webhooks), formatTime(event.created)];
    });
}

/** A plain overview for people checking what the app sent; no scripts, refresh to update. */
export function renderPage(state: StoreState): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${TITLE}</title>
<style>
  body { font-family: system-ui, sans-serif; margin: 1.5rem; color: #1a1a1a; background: #fff; line-height: 1.4; }
  h1 { font-size: 1.4rem; } h2 { font-size: 1.1rem; margin-top: 2rem; }
  table { border-collapse: collapse; width: 100%; font-size: 0.9rem; }
  th, td { border: 1px solid #bbb; padding: 0.3rem 0.5rem; text-align: left; vertical-align: top; }
  th { background: #eee; }
  .muted { color: #555; }
  .status-canceled { text-decoration: line-through; }
  .note { border-left: 4px solid #888; padding-left: 0.75rem; }
</style>
</head>
<body>
<h1>${TITLE}</h1>
<p class="note">Nothing here is real money. This page lists what the app created through the Stripe SDK against the local stand-in. Amounts are shown in major units, with the stored minor-unit integer in brackets.</p>
<h2>Cardholders (${state.cardholders.size})</h2>
${table(['ID', 'Name', 'E-mail', 'Status', 'Metadata', 'Created'], cardholderRows(state), 'No cardholders yet.')}
<h2>Cards (${state.cards.size})</h2>
${table(['ID', 'Cardholder', 'Amount (all_time limit)', 'Spent', 'Currency', 'Status', 'Metadata', 'Created'], cardRows(state), 'No cards yet.')}
<h2>Recent events (latest ${RECENT_EVENTS})</h2>
${table(['ID', 'Type', 'Object', 'Pending webhooks', 'Created'], eventRows(state), 'No events yet.')}
</body>
</html>`;
}
