// A notice is written once as blocks and rendered twice, as plain text and as HTML, so the two never drift
// apart and every piece of data passes through the one escaping function.
import { translator, type Language, type Translator } from '@shared/i18n';
import { escapeHtml } from './format';

export interface Notice {
  subject: string;
  text: string;
  html: string;
}

export type Block =
  | { kind: 'paragraph'; text: string }
  | { kind: 'facts'; rows: ReadonlyArray<readonly [label: string, value: string]> }
  | { kind: 'list'; title: string; items: readonly string[] }
  | { kind: 'caution'; text: string };

/**
 * Every notice ends with this: the figures come from configured rules, and people with authority decide what
 * is owed.
 */
export const CAUTION = translator('en').t('notice.caution');

/** The notice in the translator's language: the caution and its label too, and the page's lang attribute. */
export function renderNotice(subject: string, blocks: readonly Block[], tr: Translator = translator('en')): Notice {
  if (/[\r\n]/.test(subject)) throw new RangeError('subject: must be one line');
  const all = [...blocks, { kind: 'caution', text: tr.t('notice.caution') } as const];
  const note = tr.t('notice.pleaseNote');
  return {
    subject,
    text: `${all.map((b) => blockText(b, note)).join('\n\n')}\n`,
    html: pageHtml(subject, all.map((b) => blockHtml(b, note)).join('\n'), tr.language),
  };
}

function blockText(block: Block, note: string): string {
  switch (block.kind) {
    case 'paragraph':
      return block.text;
    case 'facts': {
      const width = Math.max(...block.rows.map(([label]) => label.length));
      return block.rows.map(([label, value]) => `${`${label}:`.padEnd(width + 2)}${value}`).join('\n');
    }
    case 'list':
      return [block.title, ...block.items.map((item) => `- ${item}`)].join('\n');
    case 'caution':
      return `${note} ${block.text}`;
  }
}

function blockHtml(block: Block, note: string): string {
  switch (block.kind) {
    case 'paragraph':
      return `<p>${escapeHtml(block.text)}</p>`;
    case 'facts':
      return `<table role="presentation">${block.rows.map(([label, value]) => `<tr><th scope="row" style="text-align:left;padding-right:1em">${escapeHtml(label)}</th><td>${escapeHtml(value)}</td></tr>`).join('')}</table>`;
    case 'list':
      return `<p>${escapeHtml(block.title)}</p><ul>${block.items.map((item) => `<li>${escapeHtml(item)}</li>`).join('')}</ul>`;
    case 'caution':
      return `<p style="font-size:smaller;color:#555"><strong>${escapeHtml(note)}</strong> ${escapeHtml(block.text)}</p>`;
  }
}

/** The viewport line lets a phone's mail app lay the notice out at the screen's width instead of a desktop's. */
function pageHtml(subject: string, body: string, language: Language): string {
  return `<!doctype html>\n<html lang="${language}"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${escapeHtml(subject)}</title></head>\n<body style="font-family:sans-serif;line-height:1.4">\n${body}\n</body></html>\n`;
}
