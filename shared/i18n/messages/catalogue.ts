import type { MessageKey } from './en';

/** A language's catalogue: one message for every key of the English reference, no more. */
export type Catalogue = Record<MessageKey, string>;
export type { MessageKey };
