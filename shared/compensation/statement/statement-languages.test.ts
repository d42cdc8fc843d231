// Each rule's statement, in each language, carries every section its rule requires.
// Required content: Reg. 261/2004 Art. 14(2) (Art. 7, 8, 9, enforcement body) and Art. 14(3) (an accessible
// alternative); SOR/2019-150 ss. 11-20 (compensation, payment within 48 h, alternate travel or refund, standards of
// treatment, recourse to the Agency; from memory); 14 CFR 250.9(b) (the prescribed text, in English).
import { describe, expect, it } from 'vitest';
import { LANGUAGES, type Language } from '../../i18n/languages';
import { CATALOGUES } from '../../i18n/catalogues';
import { compensationDue } from '../index';
import type { PriorityRuleInput } from '../../denial/priority-rules.schema';
import { REQUIRED_SECTIONS, accessibleStatementPage, assertStatementComplete, statementHtml, statementText, writtenStatement, type StatementInput } from './index';

const RULES: PriorityRuleInput[] = [{ factor: 'check-in-time', direction: 'latest-first' }];
const base = {
  carrierName: 'Larkfield Air',
  passenger: { name: 'Giulia Ferri', pnr: 'K7Q2XM' },
  flight: { number: 'ZZ 210', date: '2026-07-01', origin: 'FCO', destination: 'HAM' },
  alternate: { flightNumber: 'ZZ 214', plannedArrival: '2026-07-01 16:20' },
  priorityRules: RULES,
};
const INPUTS: Record<string, StatementInput> = {
  'eu-261': {
    ...base, regime: 'eu-261', station: 'Rome Fiumicino (FCO)',
    compensation: compensationDue({ regime: 'eu-261', deniedOn: '2026-07-01', distanceKm: 1326, intraCommunity: true, plannedArrivalDelayMinutes: 150 }),
    enforcementBody: { name: 'Example enforcement body', website: 'enforcement.example' },
  },
  'uk-261': {
    ...base, regime: 'uk-261', station: 'London Heathrow (LHR)',
    compensation: compensationDue({ regime: 'uk-261', deniedOn: '2026-07-01', distanceKm: 900, plannedArrivalDelayMinutes: null }),
  },
  'ca-appr': {
    ...base, regime: 'ca-appr', station: 'Montréal (YUL)',
    compensation: compensationDue({ regime: 'ca-appr', deniedOn: '2026-07-01', plannedArrivalDelayMinutes: 420 }),
  },
  'us-dot': {
    ...base, regime: 'us-dot', station: 'Boston (BOS)',
    compensation: compensationDue({ regime: 'us-dot', deniedOn: '2026-07-01', oneWayFare: { amountMinor: 30_000, currency: 'USD' }, plannedArrivalDelayMinutes: 180, aircraftSeats: 150 }),
  },
};

// Words only that language uses, so a statement left in English (or another language) fails.
const MARK: Record<Language, RegExp> = { en: /Your case/, fr: /Votre situation/, es: /Su caso/, de: /Ihr Fall/, it: /Il suo caso/ };

describe('statements in every language carry every required section', () => {
  for (const [regime, input] of Object.entries(INPUTS)) {
    for (const language of LANGUAGES) {
      it(`${regime} in ${language}`, () => {
        const statement = writtenStatement({ ...input, language });
        expect(statement.language).toBe(language);
        const ids = statement.sections.map((s) => s.id);
        for (const id of REQUIRED_SECTIONS[input.regime]) expect(ids).toContain(id);
        expect(ids.at(-1)).toBe('caution');
        const text = statementText(statement);
        expect(text).toMatch(MARK[language]);
        for (const other of LANGUAGES.filter((l) => l !== language)) expect(text).not.toMatch(MARK[other]);
        // No ICU left unfilled.
        expect(text).not.toMatch(/\{[a-z]+\}/i);
      });
    }
  }

  it('EU in Italian: the amounts of Art. 7 (EUR 250 / 400 / 600, Art. 7(1)) and the enforcement contact', () => {
    const statement = writtenStatement({ ...INPUTS['eu-261'], language: 'it' });
    const body = (id: string) => statement.sections.find((s) => s.id === id)?.body.replace(/\u00a0/g, ' ') ?? '';
    expect(body('compensation')).toContain('250,00 EUR per le tratte aeree pari o inferiori a 1500 km');
    expect(body('compensation')).toContain('600,00 EUR per tutte le altre tratte');
    expect(body('care-due')).toContain('due chiamate telefoniche');
    expect(body('enforcement')).toContain('Sito web: enforcement.example');
    expect(statement.subject).toBe('Negato imbarco sul volo ZZ 210 di Larkfield Air del 2026-07-01: i suoi diritti e la compensazione');
  });

  it('Canada in French: amounts by delay band (CAD 900 / 1,800 / 2,400, SOR/2019-150 s. 20) and 48 hours', () => {
    const statement = writtenStatement({ ...INPUTS['ca-appr'], language: 'fr' });
    const body = (id: string) => statement.sections.find((s) => s.id === id)?.body.replace(/[\u00a0\u202f]/g, ' ') ?? '';
    expect(body('compensation')).toContain('9 heures ou plus : 2 400,00 CAD.');
    expect(body('payment')).toContain('dans les 48 heures');
    expect(body('enforcement')).toContain('Canadian Transportation Agency');
  });

  it('US in German: the prescribed paragraphs stay in English, introduced in German and marked lang="en"', () => {
    const statement = writtenStatement({ ...INPUTS['us-dot'], language: 'de' });
    expect(statement.sections[0].id).toBe('about');
    expect(statement.sections[0].body).toContain('auf Englisch');
    expect(statement.sections.find((s) => s.id === 'us-250-9')?.body).toMatch(/^If you have been denied a reserved seat on Larkfield Air/);
    expect(statementHtml(statement)).toContain('<section lang="en"><h2>Compensation for Denied Boarding</h2>');
  });
});

describe('what each rule requires, section by section, in each language', () => {
  for (const language of LANGUAGES) {
    const words = CATALOGUES[language];
    const heading = (statement: ReturnType<typeof writtenStatement>, id: string) => statement.sections.find((x) => x.id === id)?.heading;
    const body = (statement: ReturnType<typeof writtenStatement>, id: string) => statement.sections.find((x) => x.id === id)?.body ?? '';

    it(`EU in ${language}: Art. 14(2) with Art. 7, 8 and 9 and the enforcement body's contact; Art. 14(3) the accessible alternative`, () => {
      const st = writtenStatement({ ...INPUTS['eu-261'], language });
      expect(heading(st, 'compensation')).toBe(words['statement.eu.art7.heading']);
      expect(heading(st, 'remedies')).toBe(words['statement.eu.art8.heading']);
      expect(heading(st, 'care-due')).toBe(words['statement.eu.art9.heading']);
      expect(body(st, 'remedies')).toContain(words['statement.eu.art8.later']);
      expect(body(st, 'care-due')).toContain(words['statement.eu.art9.calls']);
      expect(body(st, 'enforcement')).toContain('Example enforcement body');
      expect(body(st, 'enforcement')).toContain('enforcement.example');
      expect(body(st, 'accessible')).toBe(words['statement.accessible.body']);
      // The priority rules in the passenger's words too (a check-in-time rule).
      expect(body(st, 'priorities')).toContain(words['priorities.volunteersFirst']);
    });

    it(`Canada in ${language}: compensation, payment, alternate travel or refund, care, recourse (SOR/2019-150, from memory)`, () => {
      const st = writtenStatement({ ...INPUTS['ca-appr'], language });
      expect(heading(st, 'payment')).toBe(words['statement.ca.payment.heading']);
      expect(heading(st, 'remedies')).toBe(words['statement.ca.travel.heading']);
      expect(heading(st, 'care-due')).toBe(words['statement.ca.care.heading']);
      expect(heading(st, 'enforcement')).toBe(words['statement.ca.recourse.heading']);
      expect(body(st, 'enforcement')).toContain('Canadian Transportation Agency');
    });

    it(`US in ${language}: the six paragraphs of 14 CFR 250.9(b) in English, with the case in the passenger's language`, () => {
      const st = writtenStatement({ ...INPUTS['us-dot'], language });
      const prescribed = st.sections.filter((x) => x.id === 'us-250-9');
      expect(prescribed).toHaveLength(6);
      expect(prescribed[0].heading).toBe('Compensation for Denied Boarding');
      expect(heading(st, 'case')).toBe(words['statement.case.heading']);
    });
  }
});

describe('the passenger\'s choice and the care given', () => {
  const withBoth: StatementInput = {
    ...INPUTS['eu-261'],
    choice: { kind: 'reroute-earliest', detail: 'ZZ 214 at 14:00' },
    care: [{ kind: 'meal', description: 'Meal voucher', amountMinor: 1_500, currency: 'EUR' }, { kind: 'communication', description: 'Two phone calls' }],
  };

  it('appear as "Your choice" and "Care given" in the passenger\'s language', () => {
    const en = writtenStatement(withBoth);
    expect(en.sections.find((s) => s.id === 'choice')).toEqual({ id: 'choice', heading: 'Your choice', body: 'Re-routing at the earliest opportunity: ZZ 214 at 14:00' });
    expect(en.sections.find((s) => s.id === 'care-given')?.body.replace(/\u00a0/g, ' ')).toBe('While you waited, the carrier gave you:\n- Meal: Meal voucher (EUR 15.00)\n- Calls or messages: Two phone calls');
    const es = writtenStatement({ ...withBoth, language: 'es' });
    expect(es.sections.find((s) => s.id === 'choice')?.body).toBe('Transporte alternativo lo antes posible: ZZ 214 at 14:00');
    expect(es.sections.find((s) => s.id === 'care-given')?.heading).toBe('Atención prestada');
    expect(es.sections.find((s) => s.id === 'care-given')?.body).toContain('- Comida: Meal voucher (15,00');
    const fr = writtenStatement({ ...withBoth, language: 'fr', choice: { kind: 'refund-and-return', detail: 'vol retour demandé' } });
    expect(fr.sections.find((s) => s.id === 'choice')?.body).toBe('Remboursement et vol retour vers votre point de départ : vol retour demandé');
  });

  it('are left out when not given', () => {
    const ids = writtenStatement(INPUTS['eu-261']).sections.map((s) => s.id);
    expect(ids).not.toContain('choice');
    expect(ids).not.toContain('care-given');
  });

  it('refuse a blank choice or a care cost that is not whole minor units, naming the field', () => {
    expect(() => writtenStatement({ ...withBoth, choice: { kind: 'refund', detail: ' ' } })).toThrow(/^choice\.detail:/);
    expect(() => writtenStatement({ ...withBoth, care: [{ kind: 'meal', description: 'Meal', amountMinor: 12.5, currency: 'EUR' }] })).toThrow(/^care\[0\]\.amountMinor:/);
    expect(() => writtenStatement({ ...withBoth, care: [{ kind: 'spa', description: 'Massage' }] })).toThrow(/^care\[0\]\.kind: expected one of meal/);
  });
});

describe('the check of what each statement needs, before it is sent', () => {
  it('refuses an EU statement whose enforcement body has no contact details (Art. 14(2))', () => {
    expect(() => writtenStatement({ ...INPUTS['eu-261'], enforcementBody: { name: 'Somebody' } })).toThrow(/^enforcementBody\.website: Art\. 14\(2\)/);
  });

  it('refuses a US statement without the carrier\'s boarding priorities (250.9(b))', () => {
    expect(() => writtenStatement({ ...INPUTS['us-dot'], priorityRules: [] })).toThrow(/^priorityRules:/);
  });

  it('refuses an unknown language', () => {
    expect(() => writtenStatement({ ...INPUTS['uk-261'], language: 'pt' as Language })).toThrow(/^language:/);
  });

  it('refuses a finished statement missing a required section, naming it', () => {
    const statement = writtenStatement(INPUTS['eu-261']);
    const withoutCare = { ...statement, sections: statement.sections.filter((s) => s.id !== 'care-due') };
    expect(() => assertStatementComplete(withoutCare, INPUTS['eu-261'])).toThrow(/^statement\.sections\.care-due:/);
    const us = writtenStatement(INPUTS['us-dot']);
    const shortened = { ...us, sections: us.sections.filter((s) => s.heading !== 'Method of Payment') };
    expect(() => assertStatementComplete(shortened, INPUTS['us-dot'])).toThrow(/^statement\.sections\.us-250-9:/);
    const withChoice = { ...INPUTS['eu-261'], choice: { kind: 'refund', detail: 'ticket refunded' } };
    expect(() => assertStatementComplete(statement, withChoice)).toThrow(/^statement\.sections\.choice:/);
  });
});

describe('the accessible alternative (Art. 14(3))', () => {
  it('is a whole page in the passenger\'s language with a title, contents linking to each heading, and no tables or scripts', () => {
    const statement = writtenStatement({ ...INPUTS['eu-261'], language: 'fr' });
    const page = accessibleStatementPage(statement);
    expect(page).toMatch(/^<!doctype html>\n<html lang="fr">/);
    expect(page).toContain(`<title>${statement.subject.replace(/’/g, '’')}</title>`);
    expect(page).toContain('<nav aria-label="Sommaire"><ol><li><a href="#section-1">Pourquoi vous recevez cet avis</a></li>');
    expect(page).toContain('<h2 id="section-1-h">Pourquoi vous recevez cet avis</h2>');
    expect(page).not.toMatch(/<table|<script|<img/);
    expect(statement.sections.find((s) => s.id === 'accessible')?.body).toContain('lecteur d’écran');
  });
});
