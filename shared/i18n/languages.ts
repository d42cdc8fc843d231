// The languages passengers can read Bumpboard in, and how one is picked for a person.
import type { Regime } from '../compensation/types';

export const LANGUAGES = ['en', 'fr', 'es', 'de', 'it'] as const;
export type Language = (typeof LANGUAGES)[number];

/** The BCP 47 locale each language formats numbers and dates with. */
export const LOCALE_OF: Readonly<Record<Language, string>> = { en: 'en-GB', fr: 'fr-FR', es: 'es-ES', de: 'de-DE', it: 'it-IT' };

export function isLanguage(value: unknown): value is Language {
  return typeof value === 'string' && (LANGUAGES as readonly string[]).includes(value);
}

/**
 * The languages a station offers, first the ones it must offer. Canada's official languages come first at a
 * Canadian station (English and French for everything a passenger sees); every catalogue is complete, so a
 * station can offer the others too.
 */
export function languagesFor(regime: Regime | null | undefined): readonly Language[] {
  if (regime === 'ca-appr') return ['en', 'fr', 'es', 'de', 'it'];
  return LANGUAGES;
}

/**
 * The first of the candidates ("fr-CA", "de", null…) that the station offers, compared by primary subtag, else
 * English. Candidates come in order of preference: the booking's language, then the browser's.
 */
export function pickLanguage(candidates: ReadonlyArray<string | null | undefined>, offered: readonly Language[] = LANGUAGES): Language {
  for (const candidate of candidates) {
    if (typeof candidate !== 'string') continue;
    const primary = candidate.trim().toLowerCase().split(/[-_]/)[0];
    const hit = offered.find((language) => language === primary);
    if (hit) return hit;
  }
  return 'en';
}
