import { useEffect, useRef } from 'react';
import { ApiRequestError } from '../../lib/api-client';

/** The problems of the last submit as a list that takes focus, each naming the field and the rule broken. */
export function FormProblems({ error, labels }: { error: Error | null; labels: Record<string, string> }) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (error) ref.current?.focus();
  }, [error]);
  if (!error) return null;
  const details = error instanceof ApiRequestError ? (error.body.details ?? []) : [];
  return (
    <div ref={ref} tabIndex={-1} role="alert" className="rounded-md border-2 border-alert bg-card px-3 py-2">
      <p className="font-bold text-alert">{details.length ? 'Not saved. Fix the following and save again:' : `Not saved: ${error.message}`}</p>
      {details.length > 0 && (
        <ul className="ml-5 list-disc">
          {details.map((d) => (
            <li key={`${d.field}:${d.rule}`}>
              <strong>{labels[d.field.split('.')[0]] ?? d.field}</strong>: {d.rule}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

/** The message beside one field, from the server's answer. */
export const fieldError = (error: Error | null, field: string) => (error instanceof ApiRequestError ? error.body.details?.find((d) => d.field === field || d.field.startsWith(`${field}.`))?.rule : undefined);

/** Seats typed as "J 12, Y 138": a cabin letter and a number each. Null when the text cannot be read that way. */
export function parseSeats(text: string): Record<string, number> | null {
  const out: Record<string, number> = {};
  for (const part of text.split(',').map((p) => p.trim()).filter(Boolean)) {
    const m = /^([A-Za-z])\s*[:=]?\s*(\d{1,4})$/.exec(part);
    if (!m) return null;
    out[m[1].toUpperCase()] = Number(m[2]);
  }
  return Object.keys(out).length ? out : null;
}

export const seatsText = (seats: Record<string, number>) => Object.entries(seats).map(([c, n]) => `${c} ${n}`).join(', ');

/** A message after an action, in words, that takes focus so a screen reader hears it and the keyboard stays near. */
export function ResultMessage({ text, tone = 'calm' }: { text: string | null; tone?: 'calm' | 'alert' }) {
  const ref = useRef<HTMLParagraphElement>(null);
  useEffect(() => {
    if (text) ref.current?.focus();
  }, [text]);
  if (!text) return null;
  return (
    <p ref={ref} tabIndex={-1} role="status" className={`rounded-md border-l-4 px-3 py-2 font-bold ${tone === 'calm' ? 'border-calm bg-card text-calm' : 'border-alert bg-card text-alert'}`}>
      {text}
    </p>
  );
}
