import { useId, type ReactNode } from 'react';

export interface StationOption {
  id: number;
  iata: string;
  name: string;
}

/** A labelled select in the screens' own style. */
export function SelectField({ label, value, onChange, children, id: givenId }: { label: string; value: string; onChange: (v: string) => void; children: ReactNode; id?: string }) {
  const generatedId = useId();
  const id = givenId ?? generatedId;
  return (
    <div>
      <label htmlFor={id} className="mb-1 block font-bold">
        {label}
      </label>
      <select id={id} value={value} onChange={(e) => onChange(e.target.value)} className="w-full rounded-md border-2 border-line bg-card px-3 py-2 text-lg focus:border-harbour">
        {children}
      </select>
    </div>
  );
}

/** A given id lets an error summary link to the field. */
export function DateField({ label, value, onChange, id: givenId, invalid }: { label: string; value: string; onChange: (v: string) => void; id?: string; invalid?: boolean }) {
  const generatedId = useId();
  const id = givenId ?? generatedId;
  return (
    <div>
      <label htmlFor={id} className="mb-1 block font-bold">
        {label}
      </label>
      <input id={id} type="date" value={value} onChange={(e) => onChange(e.target.value)} aria-invalid={invalid || undefined} className={`w-full rounded-md border-2 ${invalid ? 'border-alert' : 'border-line'} bg-card px-3 py-2 text-lg focus:border-harbour`} />
    </div>
  );
}

/** Styled like a secondary button: a plain link, so the browser downloads with the session cookie. */
export function DownloadLink({ href, children }: { href: string; children: ReactNode }) {
  return (
    <a href={href} download className="inline-flex min-h-11 items-center justify-center gap-2 rounded-md border-2 border-harbour bg-card px-4 py-2 font-bold text-harbour hover:bg-harbour-soft">
      {children}
    </a>
  );
}
