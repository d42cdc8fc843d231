import { useId, type InputHTMLAttributes } from 'react';

interface Props extends Omit<InputHTMLAttributes<HTMLInputElement>, 'onChange' | 'value'> {
  label: string;
  value: string;
  onChange: (v: string) => void;
  error?: string;
  hint?: string;
}

/** A labelled input whose error sits right under it and is announced to screen readers. */
export function TextField({ label, value, onChange, error, hint, className = '', id: givenId, ...rest }: Props) {
  const generatedId = useId();
  // A given id lets an error summary link to this field.
  const id = givenId ?? generatedId;
  const describedBy = [error ? `${id}-error` : '', hint ? `${id}-hint` : ''].filter(Boolean).join(' ') || undefined;
  return (
    <div className={className}>
      <label htmlFor={id} className="mb-1 block font-bold">
        {label}
      </label>
      <input
        {...rest}
        id={id}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`w-full rounded-md border-2 bg-card px-3 py-2 text-lg ${error ? 'border-alert' : 'border-line'} focus:border-harbour`}
      />
      {hint && (
        <p id={`${id}-hint`} className="mt-1 text-sm text-ink-soft">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="mt-1 font-bold text-alert">
          {error}
        </p>
      )}
    </div>
  );
}
