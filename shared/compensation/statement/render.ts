// Text and HTML renderings of a written statement; HTML escapes every piece of input.
import { translator } from '../../i18n/translate';
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

/** The statement as an article; the English paragraphs of 14 CFR 250.9 are marked lang="en" inside another language. */
export function statementHtml(statement: WrittenStatement): string {
  const sections = statement.sections
    .map((section) => {
      const lang = section.id === 'us-250-9' && statement.language !== 'en' ? ' lang="en"' : '';
      return `<section${lang}><h2>${escapeHtml(section.heading)}</h2>${bodyHtml(section.body)}</section>`;
    })
    .join('');
  return `<article lang="${statement.language}"><h1>${escapeHtml(statement.subject)}</h1>${sections}</article>`;
}

const ACCESSIBLE_CSS = `
  body { font-family: Verdana, Arial, sans-serif; font-size: 1.25rem; line-height: 1.6; color: #000; background: #fff; max-width: 42rem; margin: 0 auto; padding: 1rem; }
  h1 { font-size: 1.6rem; } h2 { font-size: 1.35rem; margin-top: 2rem; }
  a { color: #0645ad; } a:focus, a:hover { outline: 3px solid #000; }
  nav ol { padding-left: 1.5rem; }
  @media (prefers-color-scheme: dark) { body { color: #fff; background: #000; } a { color: #9cf; } }
`;

/**
 * The accessible alternative of the statement (Reg. 261/2004 Art. 14(3)): one page in the passenger's language
 * with its language declared, a title, a table of contents linking to each section, real headings and lists, large
 * text that reflows, high contrast, and no images, tables or scripts, so a screen reader reads it in order.
 */
export function accessibleStatementPage(statement: WrittenStatement): string {
  const anchor = (index: number) => `section-${index + 1}`;
  const contents = statement.sections.map((s, i) => `<li><a href="#${anchor(i)}">${escapeHtml(s.heading)}</a></li>`).join('');
  const sections = statement.sections
    .map((s, i) => {
      const lang = s.id === 'us-250-9' && statement.language !== 'en' ? ' lang="en"' : '';
      return `<section id="${anchor(i)}" aria-labelledby="${anchor(i)}-h"${lang}><h2 id="${anchor(i)}-h">${escapeHtml(s.heading)}</h2>${bodyHtml(s.body)}</section>`;
    })
    .join('\n');
  const title = escapeHtml(statement.subject);
  return `<!doctype html>\n<html lang="${statement.language}"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${title}</title><style>${ACCESSIBLE_CSS}</style></head>\n<body><main><h1>${title}</h1><nav aria-label="${escapeHtml(translator(statement.language).t('statement.contents'))}"><ol>${contents}</ol></nav>\n${sections}</main></body></html>\n`;
}
