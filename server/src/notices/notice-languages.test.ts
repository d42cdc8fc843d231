// Both notices in each passenger language: the words, the amounts and the local times, and the page's lang.
import { describe, expect, it } from 'vitest';
import { LANGUAGES } from '@shared/i18n';
import { rebookingNotice, type RebookingNoticeInput } from './rebooking-notice';
import { volunteerConfirmation, type VolunteerConfirmationInput } from './volunteer-confirmation';

const NBSP = /[\u00a0\u202f]/g;

const volunteer: VolunteerConfirmationInput = {
  station: { iata: 'FCO', name: 'Roma Fiumicino', timeZone: 'Europe/Rome' },
  flight: { carrierCode: 'ZZ', flightNumber: '10', origin: 'FCO', destination: 'LHR', scheduledDeparture: new Date('2026-07-01T08:00:00Z') },
  pnr: 'XYZ789',
  passengerNames: ['Mario Rossi', 'Anna Rossi'],
  agreedTotal: { amountMinor: 80_000, currency: 'EUR' },
  rebooking: { carrierCode: 'ZZ', flightNumber: '12', origin: 'FCO', destination: 'LHR', departure: new Date('2026-07-01T11:20:00Z'), arrival: new Date('2026-07-01T14:00:00Z') },
};

const rebooking: RebookingNoticeInput = {
  station: volunteer.station,
  pnr: 'XYZ789',
  passengerNames: ['Mario Rossi'],
  reason: 'denied-boarding',
  originalFlight: { carrierCode: 'ZZ', flightNumber: '10', origin: 'FCO', destination: 'LHR', scheduledDeparture: new Date('2026-07-01T08:00:00Z'), scheduledArrival: new Date('2026-07-01T10:40:00Z') },
  newFlight: { carrierCode: 'ZZ', flightNumber: '12', origin: 'FCO', destination: 'LHR', departure: new Date('2026-07-01T11:20:00Z'), arrival: new Date('2026-07-01T14:00:00Z') },
};

describe('notices in the booking\'s language', () => {
  it('the volunteer confirmation in Italian: plural words, amount with a decimal comma, Rome time (UTC+2 in July, Directive 2000/84/EC)', () => {
    const n = volunteerConfirmation({ ...volunteer, language: 'it' });
    expect(n.subject).toBe('Confermato: ha ceduto i vostri posti su ZZ 10 (prenotazione XYZ789)');
    const text = n.text.replace(NBSP, ' ');
    expect(text).toContain('Gentile Mario Rossi e Anna Rossi,');
    expect(text).toMatch(/Passeggeri: +Mario Rossi e Anna Rossi/);
    expect(text).toContain('800,00 EUR in totale per i passeggeri indicati sopra');
    // derived: 08:00Z is 10:00 in Rome in July; 14:00Z is 16:00
    expect(text).toContain('in partenza da Roma Fiumicino (FCO) il mer 1 lug 2026, 10:00 (Europe/Rome, GMT+02:00)');
    expect(text).toMatch(/Arrivo: +mer 1 lug 2026, 16:00/);
    expect(text).toContain('Nota: Gli importi di questo messaggio');
    expect(n.html).toContain('<html lang="it">');
  });

  it('the rebooking notice in French and German: the reason, and the delay in words (3 h 20 min later, derived)', () => {
    const fr = rebookingNotice({ ...rebooking, language: 'fr' });
    expect(fr.subject).toBe('Votre nouveau vol : ZZ 12 pour LHR (réservation XYZ789)');
    expect(fr.text).toContain('car il y avait plus de passagers avec une réservation confirmée que de sièges');
    expect(fr.text).toContain('Votre arrivée est prévue 3 heures 20 minutes plus tard que sur votre vol d’origine.');
    expect(fr.html).toContain('<html lang="fr">');
    const de = rebookingNotice({ ...rebooking, language: 'de', reason: 'volunteered' });
    expect(de.text).toContain('weil Sie zugestimmt haben, Ihren Sitzplatz abzugeben');
    expect(de.text).toContain('Ihre Ankunft ist 3 Stunden 20 Minuten später geplant');
  });

  it('every language renders both notices without English words left in the passenger\'s text', () => {
    for (const language of LANGUAGES) {
      const texts = [volunteerConfirmation({ ...volunteer, language }).text, rebookingNotice({ ...rebooking, language }).text];
      for (const text of texts) {
        expect(text).not.toMatch(/\{[a-z]+\}/i);
        if (language !== 'en') expect(text).not.toMatch(/Booking reference|Please note|Arrives/);
      }
    }
  });

  it('refuses an unknown language, naming the field', () => {
    expect(() => rebookingNotice({ ...rebooking, language: 'pt' as never })).toThrow(/^language:/);
  });
});
