// The booking channel travels in the feed's booking.added event and in the manifest's optional channel column; a bad
// value is refused by the field's name, and a PNR whose rows disagree is refused at the line that disagrees.
import { describe, expect, it } from 'vitest';
import { MANIFEST_ALL_COLUMNS, MANIFEST_OPTIONAL_COLUMNS, type ManifestColumn } from '@shared/schemas/manifest';
import { integrationEventSchema } from '@shared/schemas/integration-events';
import { groupManifestRows } from './manifest-rows';
import { manifestTemplateCsv, parseManifestCsv } from './manifest-csv';

// Every column present and empty, then the ones this test sets: a column added later needs no change here.
const blank = Object.fromEntries(MANIFEST_ALL_COLUMNS.map((c) => [c, ''])) as Record<ManifestColumn, string>;
const cells = (over: Record<string, string>) => ({
  ...blank, flight_carrier: 'ZZ', flight_number: '107', flight_date: '2027-01-15', pnr: 'CHN001', sequence: '1', first_name: 'Ada', last_name: 'Brook',
  cabin: 'Y', fare_minor: '18950', fare_currency: 'USD', fare_type: '', ssr_codes: '', frequent_flyer_tier: '', is_child: '',
  inbound_flight: '', inbound_scheduled_arrival: '', contact_email: '', language: '', itinerary: '', channel: '', ...over,
});

describe('the booking channel in the manifest', () => {
  it('is an optional column, listed with the others and filled in the template', () => {
    expect(MANIFEST_OPTIONAL_COLUMNS).toContain('channel');
    const parsed = parseManifestCsv(manifestTemplateCsv());
    expect(MANIFEST_ALL_COLUMNS).toContain('channel');
    const { flights, problems } = groupManifestRows(parsed.records);
    expect(problems).toEqual([]);
    expect([...flights.values()][0].bookings.get('QX7T2M')?.channel).toBe('web');
  });

  it('is kept per booking, empty or missing meaning not known', () => {
    const { flights, problems } = groupManifestRows([
      { line: 2, cells: cells({ channel: 'Agency' }) },
      { line: 3, cells: cells({ sequence: '2', channel: '' }) },
      { line: 4, cells: cells({ pnr: 'CHN002' }) },
    ]);
    expect(problems).toEqual([]);
    const bookings = [...flights.values()][0].bookings;
    expect(bookings.get('CHN001')?.channel).toBe('agency');
    expect(bookings.get('CHN002')?.channel).toBeNull();
  });

  it('names the field and the rule for a channel we do not know, and for rows of one PNR that disagree', () => {
    const { problems } = groupManifestRows([
      { line: 2, cells: cells({ channel: 'fax' }) },
      { line: 3, cells: cells({ pnr: 'CHN003', channel: 'web' }) },
      { line: 4, cells: cells({ pnr: 'CHN003', sequence: '2', channel: 'app' }) },
    ]);
    expect(problems).toEqual([
      { line: 2, field: 'channel', rule: 'channel must be one of web, app, agency, corporate, or empty' },
      { line: 4, field: 'channel', rule: 'must be the same on every row of PNR CHN003 (an earlier row has web)' },
    ]);
  });
});

describe('the booking channel in the feed', () => {
  const event = {
    id: 'e1', occurredAt: '2026-07-01T08:00:00Z', flight: { carrier: 'ZZ', number: '10', date: '2026-07-01' }, type: 'booking.added', pnr: 'ABC123',
    passengers: [{ firstName: 'A', lastName: 'B', cabin: 'Y', fareMinor: 100, fareCurrency: 'EUR' }],
  };

  it('is optional, and refused by name when it is not one we know', () => {
    expect(integrationEventSchema.parse(event)).toMatchObject({ channel: null });
    expect(integrationEventSchema.parse({ ...event, channel: 'corporate' })).toMatchObject({ channel: 'corporate' });
    const refused = integrationEventSchema.safeParse({ ...event, channel: 'fax' });
    expect(refused.success).toBe(false);
    expect(refused.error?.issues[0]).toMatchObject({ path: ['channel'], message: 'channel must be one of web, app, agency, corporate' });
  });
});
