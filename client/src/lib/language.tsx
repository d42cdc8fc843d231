// The language a screen speaks, on react-intl with the shared catalogues (the server renders mails from the same
// ones). Staff screens are in English; the passenger's page picks the passenger's language and can switch.
import { createContext, useCallback, useContext, useEffect, useMemo, useState, type ReactNode } from 'react';
import { IntlProvider, useIntl } from 'react-intl';
import { formatMoney, userLocale } from './money';
import { CATALOGUES, LOCALE_OF, isLanguage, pickLanguage, translator, type Language, type MessageKey, type MessageValues, type Translator } from '@shared/i18n';

interface LanguageState {
  language: Language;
  /** True once the person picked a language themselves: nothing chosen for them replaces it. */
  chosen: boolean;
  /** A language chosen for the person (the booking's): ignored once they chose one. */
  suggest: (language: Language) => void;
  /** The person's own pick, remembered for this tab. */
  choose: (language: Language) => void;
}

const LanguageContext = createContext<LanguageState>({ language: 'en', chosen: false, suggest: () => undefined, choose: () => undefined });
const CHOSEN_KEY = 'bumpboard.language';

/** The language the person picked in this tab, if any. */
export function chosenLanguage(): Language | null {
  try {
    const stored = sessionStorage.getItem(CHOSEN_KEY);
    return stored && isLanguage(stored) ? stored : null;
  } catch {
    return null;
  }
}

export function LanguageProvider({ initial = 'en', remember = false, children }: { initial?: Language; remember?: boolean; children: ReactNode }) {
  const [language, setLanguage] = useState<Language>(initial);
  const [chosen, setChosen] = useState(() => remember && chosenLanguage() !== null);
  const suggest = useCallback((next: Language) => {
    if (!chosen) setLanguage(next);
  }, [chosen]);
  const choose = useCallback((next: Language) => {
    setLanguage(next);
    setChosen(true);
    if (remember) {
      try {
        sessionStorage.setItem(CHOSEN_KEY, next);
      } catch {
        // A private-mode browser may refuse storage; the choice lasts until the page is left.
      }
    }
  }, [remember]);
  const value = useMemo(() => ({ language, chosen, suggest, choose }), [language, chosen, suggest, choose]);
  return (
    <LanguageContext.Provider value={value}>
      <IntlProvider locale={LOCALE_OF[language]} messages={CATALOGUES[language]} defaultLocale="en-GB">
        {children}
      </IntlProvider>
    </LanguageContext.Provider>
  );
}

export function useLanguage(): LanguageState {
  return useContext(LanguageContext);
}

/** t(key, values): a message of the current language, keys checked by the compiler against the catalogues. */
export function useT(): (key: MessageKey, values?: MessageValues) => string {
  const intl = useIntl();
  return useCallback((key: MessageKey, values?: MessageValues) => intl.formatMessage({ id: key }, values), [intl]);
}

/** Money, times, durations and lists in the current language (the shared translator, as mails use). */
export function useFormats(): Translator {
  const { language } = useLanguage();
  return translator(language);
}

/** The browser's languages in order of preference, for the first pick when the booking has none. */
export function browserLanguages(): string[] {
  if (typeof navigator === 'undefined') return [];
  return [...(navigator.languages ?? []), navigator.language].filter(Boolean);
}

export { pickLanguage, type Language };

/**
 * Money as the person reads it: the browser's own regional format when it is in the page's language ("$400.00" in
 * en-US, "400,00 $" in fr-CA), else the language's usual format.
 */
export function useMoney(): (amountMinor: number, currency: string) => string {
  const { language } = useLanguage();
  const browser = userLocale();
  const locale = browser.toLowerCase().split('-')[0] === language ? browser : LOCALE_OF[language];
  return useCallback((amountMinor: number, currency: string) => formatMoney(amountMinor, currency, locale), [locale]);
}

/** Opens the page in the booking's language once the server says it, unless the passenger already picked one here. */
export function useBookingLanguage(language: Language | null | undefined) {
  const { suggest } = useLanguage();
  useEffect(() => {
    if (language) suggest(language);
  }, [language, suggest]);
}
