import type { ReactNode } from 'react';

/** The passenger's page: phone-first, large type, no staff navigation; the caution always at the foot. */
export function PassengerFrame({ title, caution, language, switcher, children }: { title: string; caution: string; language?: string; switcher?: ReactNode; children: ReactNode }) {
  return (
    <div className="min-h-screen bg-paper text-ink" lang={language}>
      <header className="bg-harbour px-4 py-3 text-white">
        <div className="mx-auto flex max-w-xl flex-wrap items-center justify-between gap-x-4 gap-y-2">
          <p className="flex items-center gap-2 text-xl font-bold">
            <span aria-hidden className="inline-block h-5 w-5 rounded-full bg-signal" />
            {title}
          </p>
          {switcher}
        </div>
      </header>
      <main className="mx-auto max-w-xl space-y-4 px-4 py-5 text-xl">
        {children}
        <p role="note" className="rounded-lg border-l-8 border-watch bg-watch-soft px-4 py-3 text-base" data-testid="passenger-caution">
          {caution}
        </p>
      </main>
    </div>
  );
}

/** A link that cannot be used (spent, expired, locked or unknown): what happened and who can help. */
export function LinkProblem({ title, text }: { title: string; text: string }) {
  return (
    <div role="alert" className="rounded-xl border-4 border-alert bg-card p-6" data-testid="link-problem">
      <h1 className="text-3xl font-bold text-alert">{title}</h1>
      <p className="mt-3 text-xl">{text}</p>
    </div>
  );
}

export function BigButton({ className = '', ...props }: React.ButtonHTMLAttributes<HTMLButtonElement>) {
  return (
    <button
      {...props}
      className={`min-h-16 w-full rounded-xl border-4 border-harbour bg-harbour px-5 py-3 text-2xl font-bold text-white disabled:cursor-not-allowed disabled:opacity-60 ${className}`}
    />
  );
}

export const BOX = 'w-full rounded-xl border-4 border-line bg-card px-4 py-3 text-2xl focus:border-harbour';

export function Problem({ text }: { text: string }) {
  return (
    <p role="alert" className="rounded-lg border-l-8 border-alert bg-alert-soft px-4 py-3 text-xl font-bold text-alert">
      {text}
    </p>
  );
}

/** Which problem page a refused link shows; null when the error is not about the link itself. */
export function linkProblemOf(code: string | undefined): 'used' | 'expired' | 'locked' | 'invalid' | null {
  if (code === 'link_used') return 'used';
  if (code === 'link_expired') return 'expired';
  if (code === 'link_locked') return 'locked';
  if (code === 'link_invalid') return 'invalid';
  return null;
}
