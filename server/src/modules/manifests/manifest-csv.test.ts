// Line numbers are counted as a text editor shows them (header = line 1); a quoted cell may hold a line break
// (RFC 4180 §2.6), so the row after it starts one line further down.
import { describe, expect, it } from 'vitest';
import { MANIFEST_COLUMNS } from '@shared/schemas/manifest';
import { manifestTemplateCsv, parseManifestCsv } from './manifest-csv';
import { groupManifestRows } from './manifest-rows';

const HEADER = MANIFEST_COLUMNS.join(',');
const row = (over: Partial<Record<(typeof MANIFEST_COLUMNS)[number], string>> = {}) => {
  const base: Record<string, string> = {
    flight_carrier: 'ZZ', flight_number: '107', flight_date: '2026-12-01', pnr: 'ABC123', sequence: '1', first_name: 'Lena', last_name: 'Quill',
    cabin: 'Y', fare_minor: '18950', fare_currency: 'USD', fare_type: 'standard', ssr_codes: '', frequent_flyer_tier: '', is_child: 'false',
    inbound_flight: '', inbound_scheduled_arrival: '', contact_email: 'lena@example.com',
  };
  const cells: Record<string, string> = Object.assign(base, over);
  return MANIFEST_COLUMNS.map((c) => (/[",\n]/.test(cells[c]) ? `"${cells[c].replace(/"/g, '""')}"` : cells[c])).join(',');
};

describe('parseManifestCsv', () => {
  it('reads the template: two rows on lines 2 and 3, no problems', () => {
    const parsed = parseManifestCsv(manifestTemplateCsv());
    expect(parsed.problems).toEqual([]);
    expect(parsed.records.map((r) => r.line)).toEqual([2, 3]);
    const grouped = groupManifestRows(parsed.records);
    expect(grouped.problems).toEqual([]);
    expect([...grouped.flights.values()][0].bookings.get('QX7T2M')?.passengers).toHaveLength(2);
  });

  it('counts lines through CR LF endings, a byte-order mark, blank lines and a quoted line break', () => {
    const text = `\uFEFF${HEADER}\r\n${row({ last_name: 'Two\nLines' })}\r\n\r\n${row({ sequence: '2' })}\r\n`;
    const parsed = parseManifestCsv(text);
    expect(parsed.problems).toEqual([]);
    // line 2-3: the quoted cell; line 4: blank; line 5: the second passenger (derived by counting)
    expect(parsed.records.map((r) => r.line)).toEqual([2, 5]);
    expect(parsed.records[0].cells.last_name).toBe('Two\nLines');
  });

  it('names missing, unknown and repeated header columns on line 1 and reads no rows', () => {
    const header = MANIFEST_COLUMNS.filter((c) => c !== 'pnr').join(',') + ',gate_number,cabin';
    const parsed = parseManifestCsv(`${header}\n${row()}\n`);
    expect(parsed.records).toEqual([]);
    expect(parsed.problems).toEqual(
      expect.arrayContaining([
        { line: 1, field: 'pnr', rule: 'column is missing from the header' },
        { line: 1, field: 'cabin', rule: 'appears more than once in the header' },
        expect.objectContaining({ line: 1, field: 'gate_number' }),
      ]),
    );
  });

  it('accepts the columns in any order', () => {
    const reversed = [...MANIFEST_COLUMNS].reverse();
    const cells = row().split(',').reverse().join(',');
    const parsed = parseManifestCsv(`${reversed.join(',')}\n${cells}\n`);
    expect(parsed.problems).toEqual([]);
    expect(parsed.records[0].cells.pnr).toBe('ABC123');
  });

  it('reports a row with the wrong number of cells on its own line', () => {
    const parsed = parseManifestCsv(`${HEADER}\n${row()}\nZZ,107\n`);
    expect(parsed.records).toHaveLength(1);
    expect(parsed.problems).toEqual([{ line: 3, field: 'row', rule: `has 2 cells; the header has ${MANIFEST_COLUMNS.length}` }]);
  });

  it('refuses an empty file and a header with no rows', () => {
    expect(parseManifestCsv('').problems[0]).toMatchObject({ line: 1, field: 'file' });
    expect(parseManifestCsv(`${HEADER}\n`).problems).toEqual([{ line: 2, field: 'file', rule: 'holds no passenger rows after the header' }]);
  });
});

describe('groupManifestRows', () => {
  const group = (...rows: string[]) => groupManifestRows(parseManifestCsv([HEADER, ...rows].join('\n')).records);

  it('names the column and the rule of each bad cell, with its line', () => {
    const { problems } = group(row(), row({ sequence: '2', fare_minor: '189.50', is_child: 'yes' }));
    expect(problems).toEqual([
      { line: 3, field: 'fare_minor', rule: 'fare_minor must be whole minor units, digits only (18950 for 189.50)' },
      { line: 3, field: 'is_child', rule: 'is_child must be true or false' },
    ]);
  });

  it('refuses the same PNR + sequence twice on one flight, pointing at the first line', () => {
    const { problems, flights } = group(row(), row({ first_name: 'Other' }));
    expect(problems).toEqual([{ line: 3, field: 'sequence', rule: 'passenger ABC123/1 on this flight already appears on line 2' }]);
    expect([...flights.values()][0].bookings.get('ABC123')?.passengers).toHaveLength(1);
  });

  it('allows the same PNR + sequence on two different flights', () => {
    expect(group(row(), row({ flight_number: '109' })).problems).toEqual([]);
  });

  it('wants one contact e-mail per PNR, and an empty cell is fine', () => {
    const { problems } = group(row(), row({ sequence: '2', contact_email: '' }), row({ sequence: '3', contact_email: 'other@example.com' }));
    expect(problems).toEqual([{ line: 4, field: 'contact_email', rule: 'must be the same on every row of PNR ABC123 (an earlier row has lena@example.com)' }]);
  });

  it('keeps a PNR to nine passengers on a flight', () => {
    // nine distinct sequences are allowed; a tenth would need sequence 10, which the column refuses
    const rows = Array.from({ length: 9 }, (_, i) => row({ sequence: String(i + 1) }));
    expect(group(...rows).problems).toEqual([]);
    expect(group(...rows, row({ sequence: '10' })).problems).toEqual([{ line: 11, field: 'sequence', rule: 'sequence must be a whole number from 1 to 9' }]);
  });

  it('groups rows by flight and PNR, upper-casing codes', () => {
    const { flights, problems } = group(row({ pnr: 'abc123', cabin: 'y' }), row({ pnr: 'XYZ789', contact_email: '' }));
    expect(problems).toEqual([]);
    const f = flights.get('ZZ|107|2026-12-01');
    expect([...(f?.bookings.keys() ?? [])]).toEqual(['ABC123', 'XYZ789']);
    expect(f?.lines).toEqual([2, 3]);
  });
});

describe('optional fees in the manifest', () => {
  const withFees = (fees: string, currency = 'USD') => `${HEADER},optional_fees\n${row({ fare_currency: currency })},"${fees}"\n`;

  it('the template carries a fee, and a row with fees reads them in minor units', () => {
    const template = groupManifestRows(parseManifestCsv(manifestTemplateCsv()).records);
    expect([...template.flights.values()][0].bookings.get('QX7T2M')?.passengers[0].row.optional_fees).toEqual([{ kind: 'seat', amountMinor: 3500, currency: 'USD' }]);
    const grouped = groupManifestRows(parseManifestCsv(withFees('seat:3500:USD; bag:4000:USD')).records);
    expect(grouped.problems).toEqual([]);
    expect([...grouped.flights.values()][0].bookings.get('ABC123')?.passengers[0].row.optional_fees).toHaveLength(2);
  });

  it('a bad fee or a fee in another currency than the fare names the column, the fee and the rule', () => {
    expect(groupManifestRows(parseManifestCsv(withFees('seat:35.00:USD')).records).problems).toEqual([
      { line: 2, field: 'optional_fees', rule: 'optional_fees fee 1 must read like "seat:3500:USD" (kind:minor units:currency)' },
    ]);
    expect(groupManifestRows(parseManifestCsv(withFees('seat:3500:USD; bag:4000:EUR')).records).problems).toEqual([
      { line: 2, field: 'optional_fees', rule: "optional_fees must be the fare's currency USD (fee 2 is in EUR)" },
    ]);
  });
});
