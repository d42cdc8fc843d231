import { useEffect, useRef, type MouseEvent } from 'react';
import { ApiRequestError } from '../../lib/api-client';

/** One refused field: its name in the request and the rule it broke, in words. */
export interface FieldProblem {
  field: string;
  rule: string;
}

interface FormProblemsProps {
  /** The server's refusal (its details name each field and rule) or any other failure. */
  error: unknown;
  /** Problems found before sending (a fresh array on each refused submit, so focus moves again). */
  problems?: FieldProblem[] | null;
  /** The field's label as the form shows it, by the field's name in the request. */
  labels?: Record<string, string>;
  /** The DOM id of each field's control, so each line links to the control it names. */
  fieldIds?: Record<string, string>;
  /** Off for a failure that is not an answer to the user's own submit (a list that failed to load). */
  takeFocus?: boolean;
}

const errorText = (error: unknown) => (error instanceof Error ? error.message : String(error));

/**
 * The one error summary of every form: on a refused submit it takes focus (so a screen reader reads it and the
 * keyboard is next to it) and names each field by its label with the rule broken, each line a link to its field.
 */
export function FormProblems({ error, problems, labels = {}, fieldIds = {}, takeFocus = true }: FormProblemsProps) {
  const ref = useRef<HTMLDivElement>(null);
  const details: FieldProblem[] = [...(problems ?? []), ...(error instanceof ApiRequestError ? (error.body.details ?? []) : [])];
  const shown = Boolean(error) || details.length > 0;
  useEffect(() => {
    if (takeFocus && (error || problems?.length)) ref.current?.focus();
  }, [error, problems, takeFocus]);
  if (!shown) return null;
  return (
    <div ref={ref} tabIndex={-1} role="alert" className="mt-2 rounded-md border-2 border-alert bg-card px-3 py-2">
      <p className="font-bold text-alert">{details.length ? 'Not done. Fix the following and try again:' : `Not done: ${errorText(error)}`}</p>
      {details.length > 0 && (
        <ul className="ml-5 list-disc">
          {details.map((d) => {
            const key = d.field.split('.')[0];
            const label = labels[key] ?? labels[d.field] ?? d.field;
            const target = fieldIds[key] ?? fieldIds[d.field];
            return (
              <li key={`${d.field}:${d.rule}`}>
                {target ? (
                  <a href={`#${target}`} className="font-bold text-alert underline" onClick={(e) => focusField(e, target)}>
                    {label}
                  </a>
                ) : (
                  <strong>{label}</strong>
                )}
                : {d.rule}
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}

/** Moves focus to the named control rather than only scrolling to it, so typing goes where the link said. */
function focusField(e: MouseEvent, id: string) {
  const field = document.getElementById(id);
  if (!field) return;
  e.preventDefault();
  field.focus();
  field.scrollIntoView?.({ block: 'center' });
}

/** A schema's refusal (zod issues) as the summary's lines: the field by its path, the rule in the schema's words. */
export const issueProblems = (issues: readonly { path: readonly PropertyKey[]; message: string }[]): FieldProblem[] =>
  issues.map((i) => {
    const field = i.path.map(String).join('.') || 'form';
    // The schema's messages start with the field's code name; the summary names it by its label instead.
    const last = String(i.path.at(-1) ?? '');
    return { field, rule: last && i.message.startsWith(`${last} `) ? i.message.slice(last.length + 1) : i.message };
  });

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
