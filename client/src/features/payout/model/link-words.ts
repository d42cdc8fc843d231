// The words both single-use link pages share: what a spent, expired, locked or unknown link says, and the refusals
// and caution common to both. Each page adds its own words for a link that has done its job.
import type { MessageKey, MessageValues } from '@shared/i18n';

export type T = (key: MessageKey, values?: MessageValues) => string;

export function linkPageWords(t: T, usedText: string) {
  return {
    used: { title: t('paylink.usedTitle'), text: usedText },
    expired: { title: t('paylink.expiredTitle'), text: t('paylink.expiredText') },
    locked: { title: t('paylink.lockedTitle'), text: t('paylink.lockedText') },
    invalid: { title: t('passenger.link.title'), text: t('paylink.invalidText') },
    notMatched: t('paylink.notMatched'),
    offline: t('paylink.offline'),
    broken: t('paylink.broken'),
    caution: t('paylink.caution'),
  };
}
