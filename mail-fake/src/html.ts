// Escaping and the page frame for the catcher's HTML pages. Every caught value is untrusted sender input.

const HTML_ESCAPES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

/** Safe both as element text and inside a double- or single-quoted attribute value. */
export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (character) => HTML_ESCAPES[character]);
}

/**
 * Sent with every page. A caught message's HTML runs in a sandboxed srcdoc iframe, which inherits this policy,
 * so even a sandbox mistake could not run a script or load a tracking image from elsewhere.
 */
export const PAGE_CONTENT_SECURITY_POLICY =
  "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'; frame-ancestors 'none'";

const PAGE_STYLE = `
  body { font-family: system-ui, sans-serif; margin: 1.5rem; color: #1d1d1d; background: #fafafa; line-height: 1.4; }
  h1 { font-size: 1.3rem; margin: 0 0 0.25rem; }
  .note { color: #555; margin: 0 0 1rem; }
  .status { padding: 0.4rem 0.6rem; border: 1px solid #c9c9c9; background: #fff; display: inline-block; margin-bottom: 1rem; }
  .status.fault { border-color: #b45309; background: #fff7ed; }
  table { border-collapse: collapse; width: 100%; background: #fff; }
  th, td { text-align: left; padding: 0.35rem 0.5rem; border-bottom: 1px solid #e2e2e2; vertical-align: top; }
  th { background: #f0f0f0; }
  td.when { white-space: nowrap; }
  pre { white-space: pre-wrap; word-break: break-word; background: #fff; border: 1px solid #e2e2e2; padding: 0.6rem; }
  iframe { width: 100%; height: 28rem; border: 1px solid #c9c9c9; background: #fff; }
  a { color: #1d4ed8; }
`;

export function renderPage(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>${PAGE_STYLE}</style>
</head>
<body>
${body}
</body>
</html>
`;
}
