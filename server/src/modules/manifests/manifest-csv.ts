// Reads the manifest CSV into rows keyed by column name, each with the line it starts on as an editor shows it
// (header = line 1), so every problem can point at the exact place in the file.
import Papa from 'papaparse';
import { MANIFEST_ALL_COLUMNS, MANIFEST_COLUMNS, type ManifestColumn, type ManifestProblem } from '@shared/schemas/manifest';

export interface CsvRecord {
  line: number;
  /** Every required column; an optional column only when the header has it. */
  cells: Record<ManifestColumn, string>;
}

export interface ParsedCsv {
  records: CsvRecord[];
  problems: ManifestProblem[];
}

/** Lines start after each "\n"; a quoted cell may span lines, so a row's line comes from where its text starts. */
function lineCounter(text: string) {
  let counted = 0;
  let line = 1;
  return (offset: number) => {
    for (; counted < offset; counted++) if (text.charCodeAt(counted) === 10) line++;
    return line;
  };
}

function checkHeader(header: string[], line: number): { columns: (ManifestColumn | null)[]; problems: ManifestProblem[] } {
  const problems: ManifestProblem[] = [];
  const known = new Set<string>(MANIFEST_ALL_COLUMNS);
  const names = header.map((h) => h.trim().toLowerCase());
  const seen = new Set<string>();
  for (const name of names) {
    if (!known.has(name)) problems.push({ line, field: name || '(empty)', rule: `is not a manifest column; the columns are ${MANIFEST_ALL_COLUMNS.join(', ')}` });
    else if (seen.has(name)) problems.push({ line, field: name, rule: 'appears more than once in the header' });
    seen.add(name);
  }
  for (const col of MANIFEST_COLUMNS) if (!seen.has(col)) problems.push({ line, field: col, rule: 'column is missing from the header' });
  return { columns: names.map((n) => (known.has(n) ? (n as ManifestColumn) : null)), problems };
}

export function parseManifestCsv(raw: string): ParsedCsv {
  // Spreadsheet exports often start with a byte-order mark and end lines with CR LF; neither changes line numbers.
  const text = raw.replace(/^\uFEFF/, '').replace(/\r\n?/g, '\n');
  const lineAt = lineCounter(text);
  const records: CsvRecord[] = [];
  const problems: ManifestProblem[] = [];
  // An object, not lets: the parser's callback assigns these, which control-flow narrowing would not see.
  const state = { header: null as (ManifestColumn | null)[] | null, headerBroken: false, previousCursor: 0 };

  Papa.parse<string[]>(text, {
    header: false,
    skipEmptyLines: 'greedy',
    step: (result) => {
      let start = state.previousCursor;
      while (start < text.length && /\s/.test(text[start])) start++;
      state.previousCursor = result.meta.cursor;
      const line = lineAt(start);
      for (const e of result.errors) problems.push({ line, field: 'row', rule: `${e.message} (check the quotes on this line)` });
      const columns = state.header;
      if (!columns) {
        const checked = checkHeader(result.data, line);
        state.header = checked.columns;
        state.headerBroken = checked.problems.length > 0;
        problems.push(...checked.problems);
        return;
      }
      if (state.headerBroken || result.errors.length) return;
      if (result.data.length !== columns.length) {
        problems.push({ line, field: 'row', rule: `has ${result.data.length} cells; the header has ${columns.length}` });
        return;
      }
      const cells = {} as Record<ManifestColumn, string>;
      columns.forEach((col, i) => {
        if (col) cells[col] = result.data[i];
      });
      records.push({ line, cells });
    },
  });

  if (!state.header) problems.push({ line: 1, field: 'file', rule: `is empty; the first line must be the header ${MANIFEST_COLUMNS.join(',')}` });
  else if (!state.headerBroken && records.length === 0 && problems.length === 0) problems.push({ line: 2, field: 'file', rule: 'holds no passenger rows after the header' });
  return { records, problems };
}

export interface TemplateFlight {
  carrier: string;
  number: string;
  date: string;
  cabin: string;
  currency: string;
  /** ISO instants of the flight's schedule: the inbound arrives before it leaves, the onward flight leaves after it lands. */
  departure: string;
  arrival: string;
  destination: string;
}

/** A flight that no station has: the template then shows the layout but names no real flight. */
const PLACEHOLDER: TemplateFlight = { carrier: 'ZZ', number: '123', date: '2027-01-15', cabin: 'Y', currency: 'USD', departure: '2027-01-15T16:00:00Z', arrival: '2027-01-15T18:00:00Z', destination: 'BOS' };

const plusHours = (iso: string, hours: number) => new Date(Date.parse(iso) + hours * 3_600_000).toISOString().replace(/\.000Z$/, 'Z');

/**
 * Header and two invented passengers (one local, one child on a connection with an onward flight), on one of the
 * station's own flights when it has one, so the file imports as it is downloaded.
 */
export function manifestTemplateCsv(flight: TemplateFlight = PLACEHOLDER): string {
  const common = { flight_carrier: flight.carrier, flight_number: flight.number, flight_date: flight.date, cabin: flight.cabin, fare_currency: flight.currency, pnr: 'QX7T2M', last_name: 'Testwell', contact_email: 'mira.testwell@example.com', language: 'en', channel: 'web' };
  const onward = `ZZ9001 ${flight.destination}-${flight.destination === 'YUL' ? 'BOS' : 'YUL'} ${plusHours(flight.arrival, 2)} ${plusHours(flight.arrival, 4)}`;
  const rows: Record<ManifestColumn, string>[] = [
    {
      ...common, sequence: '1', first_name: 'Mira', fare_minor: '18950', fare_type: 'standard', ssr_codes: '', frequent_flyer_tier: 'gold', is_child: 'false', optional_fees: `seat:3500:${flight.currency}`,
      inbound_flight: 'ZZ340', inbound_scheduled_arrival: plusHours(flight.departure, -1.5), itinerary: onward,
      seat: '14C',
    },
    {
      ...common, sequence: '2', first_name: 'Oskar', fare_minor: '14200', fare_type: 'flex', ssr_codes: 'CHLD VGML', frequent_flyer_tier: '', is_child: 'true', optional_fees: '',
      inbound_flight: 'ZZ340', inbound_scheduled_arrival: plusHours(flight.departure, -1.5), itinerary: onward,
      seat: '14D',
    },
  ];
  return `${Papa.unparse({ fields: [...MANIFEST_ALL_COLUMNS], data: rows.map((r) => MANIFEST_ALL_COLUMNS.map((c) => r[c])) }, { newline: '\n' })}\n`;
}
