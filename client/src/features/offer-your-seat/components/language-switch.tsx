import { useId } from 'react';
import { CATALOGUES, LANGUAGES, type Language } from '@shared/i18n';
import { useLanguage, useT } from '../../../lib/language';

/** The passenger's own pick among the languages the station offers, each named in itself. */
export function LanguageSwitch({ offered = LANGUAGES }: { offered?: readonly Language[] }) {
  const { language, choose } = useLanguage();
  const t = useT();
  const id = useId();
  return (
    <label htmlFor={id} className="flex items-center gap-2 text-base font-normal">
      <span>{t('language.choose')}</span>
      <select
        id={id} data-testid="language-switch" value={language} onChange={(e) => choose(e.target.value as Language)}
        className="min-h-11 rounded-lg border-2 border-white bg-white px-2 py-1 text-lg font-bold text-harbour"
      >
        {offered.map((l) => (
          <option key={l} value={l} lang={l}>{CATALOGUES[l]['language.name']}</option>
        ))}
      </select>
    </label>
  );
}
