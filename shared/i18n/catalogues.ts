import { de } from './messages/de';
import { en } from './messages/en';
import { es } from './messages/es';
import { fr } from './messages/fr';
import { it } from './messages/it';
import type { Catalogue } from './messages/catalogue';
import type { Language } from './languages';

export const CATALOGUES: Readonly<Record<Language, Catalogue>> = { en, fr, es, de, it };
