import { describe, expect, it } from 'vitest';
import { CAUTION } from './notice';
import { volunteerConfirmation, type VolunteerConfirmationInput } from './volunteer-confirmation';

const NBSP = '\u00a0';

const base: VolunteerConfirmationInput = {
  station: { iata: 'BOS', name: 'Boston Logan', timeZone: 'America/New_York' },
  flight: { carrierCode: 'ZZ', flightNumber: '123', origin: 'BOS', destination: 'ORD', scheduledDeparture: new Date('2026-06-02T11:35:00Z') },
  pnr: 'ABC123',
  passengerNames: ['Ada Lovelace'],
  agreedTotal: { amountMinor: 60_000, currency: 'USD' },
  extras: ['meal voucher'],
  voucherRestrictions: ['Valid for one year from today'],
  rebooking: { carrierCode: 'ZZ', flightNumber: '456', origin: 'BOS', destination: 'ORD', departure: new Date('2026-06-02T15:00:00Z'), arrival: new Date('2026-06-02T17:30:00Z') },
};

describe('volunteerConfirmation', () => {
  it('states the agreement in plain words with local times and the zone named', () => {
    const notice = volunteerConfirmation(base);
    expect(notice.subject).toBe('Confirmed: you gave up your seat on ZZ 123 (booking ABC123)');
    expect(notice.text).toContain('Dear Ada Lovelace,');
    // derived: 11:35Z is 07:35 in New York in June (UTC-4, IANA tz database)
    expect(notice.text).toContain('scheduled to leave Boston Logan (BOS) on Tue 2 Jun 2026, 07:35 (America/New_York, GMT-04:00)');
    expect(notice.text).toMatch(new RegExp(`Agreed compensation: +USD${NBSP}600\\.00\\n`));
    expect(notice.text).toMatch(/Also provided: +meal voucher/);
    expect(notice.text).toMatch(/Your new flight: +ZZ 456 from BOS to ORD/);
    expect(notice.text).toMatch(/Arrives: +Tue 2 Jun 2026, 13:30 \(America\/New_York, GMT-04:00\)/);
    expect(notice.text).toContain('- Valid for one year from today');
  });

  it('ends the text and the HTML with the caution about who decides what is owed', () => {
    const notice = volunteerConfirmation(base);
    expect(notice.text.trimEnd().endsWith(`Please note: ${CAUTION}`)).toBe(true);
    expect(CAUTION).toMatch(/regulation, the contract of carriage and the carrier's compliance staff decide/);
    expect(notice.html).toMatch(/<p[^>]*><strong>Please note:<\/strong> Amounts in this message[^<]*<\/p>\s*<\/body>/);
  });

  it('escapes passenger-supplied text in the HTML part', () => {
    const notice = volunteerConfirmation({ ...base, passengerNames: ['<script>alert(1)</script> Doe'], extras: ['"hotel" & meal'] });
    expect(notice.html).not.toContain('<script>');
    expect(notice.html).toContain('&lt;script&gt;alert(1)&lt;/script&gt; Doe');
    expect(notice.html).toContain('&quot;hotel&quot; &amp; meal');
    // plain text is not HTML: it carries the name as given
    expect(notice.text).toContain('Dear <script>alert(1)</script> Doe,');
  });

  it('speaks to a party in the plural and says the amount covers everyone named', () => {
    const notice = volunteerConfirmation({ ...base, passengerNames: ['Ada Lovelace', 'Alan Turing'], agreedTotal: { amountMinor: 120_000, currency: 'USD' } });
    expect(notice.subject).toContain('your seats on ZZ 123');
    expect(notice.text).toContain('Dear Ada Lovelace and Alan Turing,');
    expect(notice.text).toContain(`USD${NBSP}1,200.00 in total for the passengers named above`);
  });

  it('says plainly when the new flight is not booked yet, and leaves out empty sections', () => {
    const notice = volunteerConfirmation({ ...base, rebooking: null, extras: [], voucherRestrictions: [] });
    expect(notice.text).toContain('Your new flight is not booked yet.');
    expect(notice.text).not.toContain('Also provided');
    expect(notice.text).not.toContain('Conditions of the travel credit');
  });

  it('refuses bad input with the field named', () => {
    expect(() => volunteerConfirmation({ ...base, pnr: 'abc' })).toThrow(/^pnr:/);
    expect(() => volunteerConfirmation({ ...base, passengerNames: [] })).toThrow(/^passengerNames:/);
    expect(() => volunteerConfirmation({ ...base, agreedTotal: { amountMinor: 600.5, currency: 'USD' } })).toThrow(/^agreedTotal\.amountMinor:/);
    expect(() => volunteerConfirmation({ ...base, station: { ...base.station, timeZone: 'Boston' } })).toThrow(/time zone/);
    expect(() => volunteerConfirmation({ ...base, flight: { ...base.flight, destination: 'Chicago' } })).toThrow(/^flight\.destination:/);
  });
});
