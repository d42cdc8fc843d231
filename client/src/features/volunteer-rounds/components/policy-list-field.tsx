import { useId } from 'react';

/** A list edited as text, one item per line, with its error right under it. */
export function PolicyListField({ label, hint, value, onChange, error, rows }: { label: string; hint: string; value: string; onChange: (v: string) => void; error?: string; rows: number }) {
  const id = useId();
  return (
    <div>
      <label htmlFor={id} className="mb-1 block font-bold">{label}</label>
      <textarea
        id={id} rows={rows} value={value} onChange={(e) => onChange(e.target.value)}
        aria-invalid={error ? true : undefined} aria-describedby={`${id}-hint${error ? ` ${id}-error` : ''}`}
        className={`w-full rounded-md border-2 bg-card px-3 py-2 text-lg ${error ? 'border-alert' : 'border-line'}`}
      />
      <p id={`${id}-hint`} className="mt-1 text-sm text-ink-soft">{hint}</p>
      {error && <p id={`${id}-error`} className="mt-1 font-bold text-alert">{error}</p>}
    </div>
  );
}
