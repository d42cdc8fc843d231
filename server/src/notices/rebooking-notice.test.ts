import { describe, expect, it } from 'vitest';
import { CAUTION } from './notice';
import { rebookingNotice, type RebookingNoticeInput } from './rebooking-notice';

const base: RebookingNoticeInput = {
  station: { iata: 'FCO', name: 'Rome Fiumicino', timeZone: 'Europe/Rome' },
  pnr: 'XYZ789',
  passengerNames: ['Mario Rossi'],
  reason: 'volunteered',
  originalFlight: { carrierCode: 'ZZ', flightNumber: '10', origin: 'FCO', destination: 'LHR', scheduledDeparture: new Date('2026-07-01T08:00:00Z'), scheduledArrival: new Date('2026-07-01T10:40:00Z') },
  newFlight: { carrierCode: 'ZZ', flightNumber: '12', origin: 'FCO', destination: 'LHR', departure: new Date('2026-07-01T11:20:00Z'), arrival: new Date('2026-07-01T14:00:00Z') },
};

describe('rebookingNotice', () => {
  it('names the new flight with local times and says how much later it arrives', () => {
    const notice = rebookingNotice(base);
    expect(notice.subject).toBe('Your new flight: ZZ 12 to LHR (booking XYZ789)');
    expect(notice.text).toContain('You are no longer booked on flight ZZ 10 from FCO to LHR, because you agreed to give up your seat.');
    // derived: Rome is UTC+2 in July (IANA tz database), so 11:20Z is 13:20 local
    expect(notice.text).toMatch(/Leaves: +Wed 1 Jul 2026, 13:20 \(Europe\/Rome, GMT\+02:00\)/);
    // derived: 14:00Z - 10:40Z = 200 minutes
    expect(notice.text).toContain('You are planned to arrive 3 hours 20 minutes later than on your original flight.');
    expect(notice.text).not.toContain('written statement');
    expect(notice.text.trimEnd().endsWith(`Please note: ${CAUTION}`)).toBe(true);
    expect(notice.html).toContain('<strong>Please note:</strong>');
  });

  it('tells a passenger denied boarding that a written statement of rights follows (14 CFR 250.9; Regulation (EC) 261/2004 art. 14(2), from memory)', () => {
    const notice = rebookingNotice({ ...base, reason: 'denied-boarding', passengerNames: ['Mario Rossi', 'Anna Rossi'] });
    expect(notice.text).toContain('more passengers held confirmed bookings than the aircraft had seats');
    expect(notice.text).toContain('We have booked you all on the flight below.');
    expect(notice.text).toContain('You will also receive a written statement of your rights');
  });

  it('says so when the new flight arrives earlier or at the same time', () => {
    const earlier = rebookingNotice({ ...base, newFlight: { ...base.newFlight, arrival: new Date('2026-07-01T10:25:00Z') } });
    expect(earlier.text).toContain('arrive 15 minutes earlier than on your original flight');
    const same = rebookingNotice({ ...base, newFlight: { ...base.newFlight, arrival: base.originalFlight.scheduledArrival } });
    expect(same.text).toContain('arrive at the same time as on your original flight');
  });

  it('escapes names in the HTML part', () => {
    const notice = rebookingNotice({ ...base, passengerNames: ['O\'Brien & <Sons>'] });
    expect(notice.html).toContain('O&#39;Brien &amp; &lt;Sons&gt;');
    expect(notice.html).not.toContain('<Sons>');
  });

  it('refuses bad input with the field named', () => {
    expect(() => rebookingNotice({ ...base, newFlight: { ...base.newFlight, arrival: new Date('x') } })).toThrow(/^newFlight\.arrival:/);
    expect(() => rebookingNotice({ ...base, reason: 'weather' as never })).toThrow(/^reason:/);
    expect(() => rebookingNotice({ ...base, newFlight: { ...base.newFlight, flightNumber: '12345' } })).toThrow(/^newFlight\.flightNumber:/);
  });
});
