import type { ReactNode } from 'react';
import { useArrival } from './use-arrival';

/** A screen's title, a line on what it is for, and its content. The title names the tab and takes focus on arrival. */
export function Page({ title, subtitle, actions, children }: { title: string; subtitle?: ReactNode; actions?: ReactNode; children: ReactNode }) {
  const heading = useArrival(title);
  return (
    <section className="mx-auto max-w-7xl px-4 py-6">
      <header className="mb-5 flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 ref={heading} tabIndex={-1} className="text-3xl font-bold text-harbour">
            {title}
          </h1>
          {subtitle && <p className="mt-1 text-ink-soft">{subtitle}</p>}
        </div>
        {actions}
      </header>
      {children}
    </section>
  );
}

/**
 * A titled card. `headingId` lets an action elsewhere send focus to this panel's heading when the control it came
 * from is gone (the heading can take focus but is not in the Tab order).
 */
export function Panel({ title, children, className = '', headingId }: { title?: string; children: ReactNode; className?: string; headingId?: string }) {
  return (
    <section className={`rounded-lg border-2 border-line bg-card p-4 ${className}`} aria-labelledby={title && headingId ? headingId : undefined}>
      {title && (
        <h2 id={headingId} tabIndex={headingId ? -1 : undefined} className="mb-3 text-xl font-bold">
          {title}
        </h2>
      )}
      {children}
    </section>
  );
}

/** Said plainly where a later release fills a screen, instead of pretending. */
export function ComingNext({ what }: { what: string }) {
  return (
    <p className="rounded-md border-2 border-dashed border-line bg-paper px-4 py-3 text-ink-soft">
      <strong className="text-ink">Not in this release yet:</strong> {what}
    </p>
  );
}

export function Caution({ children }: { children?: ReactNode }) {
  return (
    <p role="note" className="rounded-md border-l-4 border-watch bg-watch-soft px-3 py-2 text-sm">
      <strong>Caution:</strong>{' '}
      {children ?? 'Bumpboard computes what the configured rules say. The applicable regulation, the contract of carriage and the carrier’s compliance staff decide.'}
    </p>
  );
}
