import { describe, expect, it } from 'vitest';
import { CAUTION } from '../../notices/notice';
import { volunteerAgreementNotice, volunteerRebookingNotice, type VolunteerNoticeInput } from './notices';

const NBSP = '\u00a0';
const base: VolunteerNoticeInput = {
  station: { iata: 'BOS', name: 'Boston Logan', timeZone: 'America/New_York' },
  flight: { carrierCode: 'ZV', flightNumber: '7123', origin: 'BOS', destination: 'ORD', scheduledDeparture: new Date('2034-01-10T14:00:00Z') },
  pnr: 'ABC234',
  passengerNames: ['Ada Example'],
  agreement: { perPassenger: { amountMinor: 60_000, currency: 'USD' }, extras: ['Meal voucher'], form: 'prepaid-card', voucherRestrictions: ['Valid 12 months.'] },
};
const newFlight = { carrierCode: 'ZV', flightNumber: '7125', origin: 'BOS', destination: 'ORD', departure: new Date('2034-01-10T18:00:00Z'), arrival: new Date('2034-01-10T21:00:00Z') };

describe('volunteerAgreementNotice', () => {
  it('states amount, extras and the cash-equivalent card, in the station zone with the zone named', () => {
    const n = volunteerAgreementNotice(base);
    expect(n.subject).toBe('Confirmed: you gave up your seat on ZV 7123 (booking ABC234)');
    // derived: 14:00 UTC on 10 January is 09:00 EST (UTC-5; IANA tz database).
    expect(n.text).toContain('Tue 10 Jan 2034, 09:00 (America/New_York, GMT-05:00)');
    expect(n.text).toMatch(new RegExp(`Agreed compensation: +USD${NBSP}600\\.00\\n`));
    expect(n.text).toMatch(/Also provided: +Meal voucher/);
    expect(n.text).toMatch(/Form of payment: +Prepaid card/);
    // A voucher's conditions are printed only when a voucher was agreed.
    expect(n.text).not.toContain('Valid 12 months.');
    expect(n.text.trimEnd().endsWith(`Please note: ${CAUTION}`)).toBe(true);
  });

  it('lists the voucher conditions when the volunteer agreed to a voucher, and totals a party', () => {
    const n = volunteerAgreementNotice({ ...base, passengerNames: ['Ada Example', 'Bo Example'], agreement: { ...base.agreement, form: 'voucher' } });
    expect(n.text).toContain(`USD${NBSP}600.00 per passenger, USD${NBSP}1,200.00 in total`);
    expect(n.text).toContain('Conditions of the travel voucher:\n- Valid 12 months.');
    expect(n.subject).toContain('your seats');
  });

  it('escapes passenger-supplied text in the HTML part', () => {
    const n = volunteerAgreementNotice({ ...base, passengerNames: ['<b>Ada</b>'] });
    expect(n.html).toContain('&lt;b&gt;Ada&lt;/b&gt;');
    expect(n.html).not.toContain('<b>Ada');
  });

  it('names the field of a bad input', () => {
    expect(() => volunteerAgreementNotice({ ...base, pnr: 'abc' })).toThrow(/^pnr:/);
    expect(() => volunteerAgreementNotice({ ...base, agreement: { ...base.agreement, perPassenger: { amountMinor: 1.5, currency: 'USD' } } })).toThrow(/^agreement\.perPassenger\.amountMinor:/);
  });
});

describe('volunteerRebookingNotice', () => {
  it('gives the new flight with local times, the planned delay, and what is owed', () => {
    const n = volunteerRebookingNotice({ ...base, newFlight, plannedArrivalDelayMinutes: 195 });
    expect(n.subject).toBe('Your new flight: ZV 7125 to ORD (booking ABC234)');
    expect(n.text).toMatch(/Leaves: +Tue 10 Jan 2034, 13:00 \(America\/New_York, GMT-05:00\)/);
    expect(n.text).toMatch(/Arrives: +Tue 10 Jan 2034, 16:00 \(America\/New_York, GMT-05:00\)/);
    expect(n.text).toContain('3 hours 15 minutes later');
    expect(n.text).toMatch(new RegExp(`Agreed compensation: +USD${NBSP}600\\.00`));
    expect(n.text).toMatch(/Form of payment: +Prepaid card/);
  });

  it('says so when the new flight arrives no later', () => {
    expect(volunteerRebookingNotice({ ...base, newFlight, plannedArrivalDelayMinutes: 0 }).text).toContain('no later than on your original flight');
  });
});

describe('in the booking’s language', () => {
  it('the confirmation and the rebooking notice in French (a Montréal booking): words, amounts and times', () => {
    const fr = { ...base, language: 'fr' as const, agreement: { ...base.agreement, form: 'voucher' as const } };
    const confirmed = volunteerAgreementNotice(fr);
    expect(confirmed.subject).toBe('Confirmation : vous avez cédé votre place sur ZV 7123 (réservation ABC234)');
    expect(confirmed.text).toContain('Mode de paiement');
    expect(confirmed.text).toContain('Conditions du bon de voyage :\n- Valid 12 months.');
    // CLDR French money (from memory): decimal comma, narrow no-break space before the code.
    expect(confirmed.text.replace(/[\u00a0\u202f]/g, ' ')).toContain('600,00 USD');
    expect(confirmed.html).toContain('<html lang="fr">');
    expect(confirmed.text).not.toContain('Form of payment');
    const rebooked = volunteerRebookingNotice({ ...fr, newFlight, plannedArrivalDelayMinutes: 195 });
    expect(rebooked.text).toContain('3 heures 15 minutes plus tard');
    expect(rebooked.text).toContain('Ce qui vous est dû, et comment ce sera payé :');
  });

  it('every language names the form of payment and the caution in its own words', () => {
    const words = { en: 'Prepaid card', fr: 'Carte prépayée', es: 'Tarjeta prepago', de: 'Prepaid-Karte', it: 'Carta prepagata' } as const;
    for (const [language, word] of Object.entries(words)) {
      const n = volunteerAgreementNotice({ ...base, language: language as keyof typeof words });
      expect(n.text, language).toContain(word);
    }
  });
});
