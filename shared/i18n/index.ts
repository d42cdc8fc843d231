export { LANGUAGES, LOCALE_OF, isLanguage, languagesFor, pickLanguage, type Language } from './languages';
export { CATALOGUES } from './catalogues';
export { translator, type MessageValues, type Translator } from './translate';
export type { Catalogue, MessageKey } from './messages/catalogue';
