import { useT } from '../../../lib/language';

/** A tampered or expired link: nothing can be done here, and nothing is kept. */
export function LinkInvalid() {
  const t = useT();
  return (
    <div role="alert" className="rounded-xl border-4 border-alert bg-card p-6" data-testid="link-invalid">
      <h1 className="text-3xl font-bold text-alert">{t('passenger.link.title')}</h1>
      <p className="mt-3 text-xl">{t('passenger.link.outOfDate')}</p>
      <p className="mt-3 text-2xl font-bold">{t('passenger.link.ask')}</p>
      <p className="mt-3 text-lg text-ink-soft">{t('passenger.link.nothing')}</p>
    </div>
  );
}
