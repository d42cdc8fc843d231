// A volunteer's record of their choice and the care given, in each passenger language, refused when incomplete.
import { describe, expect, it } from 'vitest';
import { LANGUAGES } from '@shared/i18n';
import { careSummaryNotice, type CareSummaryInput } from './care-summary';

const input: CareSummaryInput = {
  station: { iata: 'YUL', name: 'Montréal-Trudeau', timeZone: 'America/Toronto' },
  flight: { carrierCode: 'ZZ', flightNumber: '310', origin: 'YUL', destination: 'CDG' },
  pnr: 'K7Q2XM', passengerName: 'Élodie Martin',
  choice: { kind: 'reroute-earliest', detail: 'ZZ 312 tomorrow.' },
  care: [{ kind: 'hotel', description: 'One night (Hôtel Aérogare)', amountMinor: 14_900, currency: 'CAD' }, { kind: 'communication', description: 'Wi-Fi code' }],
};

describe('the care summary mailed to a volunteer', () => {
  it('names the choice and each care item, with its cost, in every language', () => {
    const words: Record<string, [string, string]> = {
      en: ['Re-routing at the earliest opportunity', 'Hotel: One night'], fr: ['Réacheminement dans les meilleurs délais', 'Hôtel : One night'],
      es: ['Transporte alternativo lo antes posible', 'Hotel: One night'], de: ['Anderweitige Beförderung zum frühestmöglichen Zeitpunkt', 'Hotel: One night'],
      it: ['Imbarco su un volo alternativo il prima possibile', 'Albergo: One night'],
    };
    for (const language of LANGUAGES) {
      const notice = careSummaryNotice({ ...input, language });
      expect(notice.subject).toContain('K7Q2XM');
      expect(notice.text).toContain(words[language][0]);
      expect(notice.text).toContain(words[language][1]);
      expect(notice.text).toMatch(/149[.,]00/);
      expect(notice.html).toContain(`<html lang="${language}">`);
    }
  });

  it('refuses a summary with nothing in it, an unknown kind of care or a bad booking reference, naming the field', () => {
    expect(() => careSummaryNotice({ ...input, choice: null, care: [] })).toThrow(/^care:/);
    expect(() => careSummaryNotice({ ...input, care: [{ kind: 'spa' as 'meal', description: 'x' }] })).toThrow(/^care\[0\]\.kind:/);
    expect(() => careSummaryNotice({ ...input, pnr: 'no' })).toThrow(/^pnr:/);
  });
});
