// Text and HTML renderings of a written statement; HTML escapes every piece of input.
import type { WrittenStatement } from './types';

export function statementText(statement: WrittenStatement): string {
  const parts = [statement.subject, '='.repeat(statement.subject.length), ''];
  for (const section of statement.sections) {
    parts.push(section.heading, '-'.repeat(section.heading.length), section.body, '');
  }
  return parts.join('\n');
}

export function escapeHtml(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

function bodyHtml(body: string): string {
  const html: string[] = [];
  let listOpen = false;
  for (const line of body.split('\n')) {
    const item = line.startsWith('- ');
    if (item && !listOpen) html.push('<ul>');
    if (!item && listOpen) html.push('</ul>');
    listOpen = item;
    if (item) html.push(`<li>${escapeHtml(line.slice(2))}</li>`);
    else if (line.trim() !== '') html.push(`<p>${escapeHtml(line)}</p>`);
  }
  if (listOpen) html.push('</ul>');
  return html.join('');
}

export function statementHtml(statement: WrittenStatement): string {
  const sections = statement.sections
    .map((section) => `<section><h2>${escapeHtml(section.heading)}</h2>${bodyHtml(section.body)}</section>`)
    .join('');
  return `<article><h1>${escapeHtml(statement.subject)}</h1>${sections}</article>`;
}
