// The translator a passenger mail is written with: the booking's language, or English when the booking has none or
// one we have no catalogue for (a mail must always go out, in some language the passenger may read).
import { translator, isLanguage, type Translator } from '@shared/i18n';

export const translatorFor = (language: string | null | undefined): Translator => translator(isLanguage(language) ? language : 'en');

/** "2026-03-13 18:00 UTC": a link's expiry, the same in every language. */
export const utcMinute = (at: Date): string => `${at.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
