import { useEffect, type ReactNode } from 'react';
import { LanguageSwitch } from '../features/offer-your-seat/components/language-switch';
import { setPageTitle } from '../lib/document-title';
import { browserLanguages, chosenLanguage, LanguageProvider, pickLanguage, useLanguage } from '../lib/language';

/**
 * A passenger's page speaks the language the passenger picked in this tab, else the browser's; the switch is
 * always there. The document's lang follows, so screen readers pronounce the page in its language.
 */
export function PassengerLanguage({ children }: { children: ReactNode }) {
  return (
    <LanguageProvider initial={pickLanguage([chosenLanguage(), ...browserLanguages()])} remember>
      {children}
    </LanguageProvider>
  );
}

export function usePassengerDocument(title: string): { language: string; switcher: ReactNode } {
  const { language } = useLanguage();
  useEffect(() => setPageTitle(title), [title]);
  useEffect(() => {
    const previous = document.documentElement.lang;
    document.documentElement.lang = language;
    return () => {
      document.documentElement.lang = previous;
    };
  }, [language]);
  return { language, switcher: <LanguageSwitch /> };
}
