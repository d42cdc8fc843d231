// The two human pages: the inbox list (newest first) and one message with its text and its HTML kept inert.
import { escapeHtml, renderPage } from './html.js';
import { BUMPBOARD_ID_HEADER, MESSAGE_ID_HEADER, type StoredMessage } from './message.js';
import type { ActiveFault } from './faults.js';

export const CATCHER_LABEL = 'Local mail catcher (test mail)';

export interface CatcherStatus {
  smtpPort: number | null;
  smtpListening: boolean;
  fault: ActiveFault | null;
}

export function renderInboxPage(messages: StoredMessage[], status: CatcherStatus): string {
  const rows = messages.map(
    (message) => `<tr>
<td class="when">${escapeHtml(message.receivedAt)}</td>
<td>${escapeHtml(message.from)}</td>
<td>${escapeHtml(message.to.join(', '))}</td>
<td><a href="/messages/${encodeURIComponent(message.id)}">${escapeHtml(message.subject || '(no subject)')}</a></td>
</tr>`,
  );
  const list =
    messages.length === 0
      ? '<p>No messages yet.</p>'
      : `<table>
<thead><tr><th>Received (UTC)</th><th>From</th><th>To</th><th>Subject</th></tr></thead>
<tbody>
${rows.join('\n')}
</tbody>
</table>`;
  const body = `<h1>${CATCHER_LABEL}</h1>
<p class="note">Messages sent to this catcher never leave this machine. ${messages.length} message${messages.length === 1 ? '' : 's'}, newest first. JSON: <a href="/api/messages">/api/messages</a></p>
${renderStatus(status)}
${list}`;
  return renderPage(CATCHER_LABEL, body);
}

export function renderMessagePage(message: StoredMessage): string {
  const headerRows: Array<[string, string]> = [
    ['Received (UTC)', message.receivedAt],
    ['From', message.from],
    ['To (envelope)', message.to.join(', ')],
    ['Subject', message.subject],
    [MESSAGE_ID_HEADER, message.headers[MESSAGE_ID_HEADER] ?? '(none)'],
    [BUMPBOARD_ID_HEADER, message.headers[BUMPBOARD_ID_HEADER] ?? '(none)'],
  ];
  const headerTable = headerRows
    .map(([name, value]) => `<tr><th>${escapeHtml(name)}</th><td>${escapeHtml(value)}</td></tr>`)
    .join('\n');
  const body = `<p><a href="/">&larr; ${CATCHER_LABEL}</a></p>
<h1>${escapeHtml(message.subject || '(no subject)')}</h1>
<table>
${headerTable}
</table>
<h2>Text</h2>
<pre>${escapeHtml(message.text || '(no text part)')}</pre>
<h2>HTML</h2>
${renderHtmlPart(message.html)}
<p><a href="/api/messages/${encodeURIComponent(message.id)}">JSON</a></p>`;
  return renderPage(`${message.subject || '(no subject)'} - ${CATCHER_LABEL}`, body);
}

export function renderNotFoundPage(id: string): string {
  const body = `<p><a href="/">&larr; ${CATCHER_LABEL}</a></p>
<h1>No such message</h1>
<p>There is no message with id <code>${escapeHtml(id)}</code>. It may have been cleared.</p>`;
  return renderPage(`No such message - ${CATCHER_LABEL}`, body);
}

function renderHtmlPart(html: string | null): string {
  if (html === null) return '<p>(no HTML part)</p>';
  // An empty sandbox attribute applies every restriction: no scripts, no forms, no top navigation, and a
  // unique origin, so the message cannot reach this page or the JSON API. srcdoc needs no extra route.
  return `<iframe sandbox="" referrerpolicy="no-referrer" title="HTML part of the message" srcdoc="${escapeHtml(html)}"></iframe>
<details><summary>HTML source</summary><pre>${escapeHtml(html)}</pre></details>`;
}

function renderStatus(status: CatcherStatus): string {
  const smtp = status.smtpListening
    ? `SMTP listening on 127.0.0.1:${status.smtpPort}`
    : `SMTP not accepting connections (port ${status.smtpPort ?? 'not bound'})`;
  if (status.fault === null) return `<p class="status">${escapeHtml(smtp)}. No fault injected.</p>`;
  const fault = status.fault;
  const what =
    fault.mode === 'down'
      ? 'refusing connections'
      : `answering ${fault.code} at ${fault.stage === 'rcpt' ? 'RCPT TO' : 'DATA'}`;
  const limits = [
    fault.until === null ? null : `until ${fault.until}`,
    fault.remaining === null ? null : `${fault.remaining} more message${fault.remaining === 1 ? '' : 's'}`,
  ].filter((limit) => limit !== null);
  const span = limits.length === 0 ? 'until cleared' : limits.join(' or ');
  return `<p class="status fault">${escapeHtml(`${smtp}. Fault injected: ${what}, ${span}.`)}</p>`;
}
