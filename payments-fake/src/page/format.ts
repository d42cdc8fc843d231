const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (char) => ESCAPES[char]);
}

/** "EUR 600.00" from 60000 minor units, using the currency's ISO 4217 decimals as the runtime knows them. */
export function formatMinor(amount: number, currency: string): string {
  const code = currency.toUpperCase();
  let digits = 2;
  try {
    digits = new Intl.NumberFormat('en', { style: 'currency', currency: code }).resolvedOptions().maximumFractionDigits ?? 2;
  } catch {
    // Unknown to ICU: show two decimals rather than fail the page.
  }
  const major = (amount / 10 ** digits).toFixed(digits);
  return `${code} ${major}`;
}

export function formatTime(unixSeconds: number): string {
  return new Date(unixSeconds * 1000).toISOString().replace('T', ' ').replace(/\.\d+Z$/, ' UTC');
}

export function formatMetadata(metadata: Record<string, string>): string {
  const entries = Object.entries(metadata);
  if (entries.length === 0) return '<span class="muted">none</span>';
  return entries.map(([key, value]) => `<code>${escapeHtml(key)}</code>=${escapeHtml(value)}`).join('<br>');
}
