// Every language has every message, in valid ICU syntax, with the arguments the code passes.
import { describe, expect, it } from 'vitest';
import { CATALOGUES } from './catalogues';
import { argumentsOf, catalogueProblems } from './check';
import { LANGUAGES, pickLanguage } from './languages';
import { en } from './messages/en';
import { translator } from './translate';

describe('catalogues', () => {
  it('are complete in every language: same keys, valid ICU, same arguments as English', () => {
    expect(catalogueProblems(en, CATALOGUES)).toEqual([]);
    expect(Object.keys(CATALOGUES).sort()).toEqual([...LANGUAGES].sort());
  });

  it('the check names a missing key, an extra key, a syntax error and a changed argument', () => {
    const { 'passenger.title': _dropped, ...missing } = CATALOGUES.fr;
    expect(catalogueProblems(en, { fr: missing })).toEqual(['fr: missing key passenger.title']);
    expect(catalogueProblems(en, { de: { ...CATALOGUES.de, 'passenger.typo': 'x' } })).toEqual(['de: extra key passenger.typo']);
    expect(catalogueProblems(en, { es: { ...CATALOGUES.es, 'passenger.offer.hello': 'Hola, {name' } })[0]).toMatch(/^es passenger\.offer\.hello: ICU syntax error/);
    expect(catalogueProblems(en, { it: { ...CATALOGUES.it, 'passenger.offer.hello': 'Ciao {nome}' } })).toEqual([
      'it passenger.offer.hello: arguments {nome} differ from English {name}',
    ]);
  });

  it('reads arguments inside plural and select options', () => {
    expect(argumentsOf(en['notice.rebooking.intro'])).toEqual(['count', 'flight', 'reason']);
  });

  it('every message of every language formats with sample values', () => {
    const sample = (args: string[]) => Object.fromEntries(args.map((a) => [a, ['n', 'count', 'km', 'km2', 'hours', 'a', 'b', 'c'].includes(a) ? 2 : 'x']));
    for (const language of LANGUAGES) {
      const t = translator(language);
      for (const key of Object.keys(en) as (keyof typeof en)[]) {
        expect(() => t.t(key, sample(argumentsOf(en[key])))).not.toThrow();
      }
    }
  });
});

describe('formatting in the passenger language', () => {
  it('money from minor units with the ISO code, in each language', () => {
    // CLDR number formats (from memory): fr/es/de/it put the code after, with a decimal comma.
    expect(translator('en').money('amount', { amountMinor: 60_000, currency: 'EUR' })).toBe('EUR\u00a0600.00');
    expect(translator('fr').money('amount', { amountMinor: 60_000, currency: 'EUR' })).toBe('600,00\u00a0EUR');
    expect(translator('de').money('amount', { amountMinor: 123_456, currency: 'EUR' })).toBe('1.234,56\u00a0EUR');
    expect(() => translator('it').money('agreed', { amountMinor: 1.5, currency: 'EUR' })).toThrow(/agreed\.amountMinor/);
  });

  it('times in the airport zone, named with the offset, across a daylight-saving change', () => {
    // EU summer time ends 01:00 UTC on the last Sunday of October (Directive 2000/84/EC): 25 Oct 2026 in Rome.
    expect(translator('en').dateTime('at', new Date('2026-10-25T00:30:00Z'), 'Europe/Rome')).toBe('Sun 25 Oct 2026, 02:30 (Europe/Rome, GMT+02:00)');
    expect(translator('it').dateTime('at', new Date('2026-10-25T01:30:00Z'), 'Europe/Rome')).toMatch(/^dom 25 ott 2026, 02:30 \(Europe\/Rome, GMT\+01:00\)$/);
    expect(() => translator('fr').dateTime('departure', new Date(), 'Mars/Olympus')).toThrow(/departure time zone/);
  });

  it('plurals and lists in each language (CLDR plural rules: French "one" covers 0 and 1, from memory)', () => {
    expect(translator('en').duration(200)).toBe('3 hours 20 minutes');
    expect(translator('fr').duration(60)).toBe('1 heure');
    expect(translator('de').duration(1)).toBe('1 Minute');
    expect(translator('it').duration(125)).toBe('2 ore e 5 minuti');
    expect(translator('es').list(['Ana', 'Luis', 'Eva'])).toBe('Ana, Luis y Eva');
  });

  it('picks the booking language, else the browser language, among those offered, else English', () => {
    expect(pickLanguage(['it', 'fr-FR'])).toBe('it');
    expect(pickLanguage([null, 'fr-CA'])).toBe('fr');
    expect(pickLanguage(['pt-BR', 'es-MX'])).toBe('es');
    expect(pickLanguage(['pt-BR'])).toBe('en');
    expect(pickLanguage(['de'], ['en', 'fr'])).toBe('en');
  });
});
