// One translator per language, on FormatJS (@formatjs/intl createIntl): the same catalogues and the same ICU
// messages render the passenger's pages in the browser and the mails and statements on the server.
import { createIntl, createIntlCache, type IntlShape } from '@formatjs/intl';
import { minorUnitExponent, assertMoney } from '../compensation/money';
import { minorToDecimalString } from '../money/format';
import { assertTimeZone, offsetAt } from '../time';
import { CATALOGUES } from './catalogues';
import { LOCALE_OF, isLanguage, type Language } from './languages';
import type { MessageKey } from './messages/catalogue';

export type MessageValues = Record<string, string | number>;

export interface Translator {
  language: Language;
  locale: string;
  t(key: MessageKey, values?: MessageValues): string;
  /** "USD 600.00", "600,00 USD": the ISO code, since "$" alone does not say which dollar; exact from minor units. */
  money(field: string, money: { amountMinor: number; currency: string }): string;
  /** Wall-clock date and time in the zone, with the zone named and its offset that day. */
  dateTime(field: string, at: Date | string, timeZone: string): string;
  /** "21:05" in the zone. */
  time(at: Date | string, timeZone: string): string;
  /** "3 hours 20 minutes"; whole minutes, rounded, sign dropped. */
  duration(minutes: number): string;
  /** "A, B and C" in the language's way. */
  list(items: readonly string[]): string;
}

const cache = createIntlCache();
const translators = new Map<Language, Translator>();

/** Formatting errors (a bad argument, a missing key) are defects: they throw rather than mail half a sentence. */
function intlFor(language: Language): IntlShape<string> {
  return createIntl(
    {
      locale: LOCALE_OF[language],
      messages: CATALOGUES[language],
      onError: (error) => {
        throw error;
      },
    },
    cache,
  );
}

function instant(field: string, at: Date | string): Date {
  const date = typeof at === 'string' ? new Date(at) : at;
  if (!(date instanceof Date) || Number.isNaN(date.getTime())) throw new RangeError(`${field}: expected a valid date and time`);
  return date;
}

export function translator(language: Language): Translator {
  if (!isLanguage(language)) throw new RangeError(`language: expected one of en, fr, es, de, it, got ${JSON.stringify(language)}`);
  const known = translators.get(language);
  if (known) return known;
  const intl = intlFor(language);
  const locale = LOCALE_OF[language];
  const t = (key: MessageKey, values?: MessageValues) => intl.formatMessage({ id: key }, values) as string;
  const made: Translator = {
    language,
    locale,
    t,
    money(field, money) {
      assertMoney(field, money);
      const exponent = minorUnitExponent(money.currency);
      return new Intl.NumberFormat(locale, {
        style: 'currency', currency: money.currency, currencyDisplay: 'code', minimumFractionDigits: exponent, maximumFractionDigits: exponent,
      }).format(minorToDecimalString(money.amountMinor, exponent) as Intl.StringNumericLiteral);
    },
    dateTime(field, at, timeZone) {
      const date = instant(field, at);
      assertTimeZone(`${field} time zone`, timeZone);
      const format = new Intl.DateTimeFormat(locale, {
        timeZone, weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23',
      });
      // English keeps the house form "Tue 2 Jun 2026, 07:35" on every runtime; other languages take Intl's order.
      const part = (type: Intl.DateTimeFormatPartTypes) => format.formatToParts(date).find((p) => p.type === type)?.value ?? '';
      const wall = language === 'en'
        ? `${part('weekday')} ${part('day')} ${part('month')} ${part('year')}, ${part('hour')}:${part('minute')}`
        : format.format(date);
      return `${wall} (${timeZone}, GMT${offsetAt(date, timeZone)})`;
    },
    time(at, timeZone) {
      return new Intl.DateTimeFormat(locale, { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(instant('time', at));
    },
    duration(minutes) {
      const total = Math.round(Math.abs(minutes));
      const hours = Math.floor(total / 60);
      const rest = total % 60;
      if (hours === 0) return t('duration.minutes', { n: rest });
      if (rest === 0) return t('duration.hours', { n: hours });
      return t('duration.both', { hours: t('duration.hours', { n: hours }), minutes: t('duration.minutes', { n: rest }) });
    },
    list(items) {
      return new Intl.ListFormat(locale, { type: 'conjunction', style: 'long' }).format(items);
    },
  };
  translators.set(language, made);
  return made;
}
