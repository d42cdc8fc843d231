import { useId } from 'react';

interface Props {
  /** Read by screen readers in place of a visible label: the cell's row and column say the rest. */
  label: string;
  value: string;
  onChange: (v: string) => void;
  error?: string;
  className?: string;
  inputMode?: 'decimal' | 'numeric' | 'text';
  maxLength?: number;
}

/** An input for a table cell, its error right under it and announced with it. */
export function CellInput({ label, value, onChange, error, className = 'w-24', inputMode = 'decimal', maxLength }: Props) {
  const id = useId();
  return (
    <div>
      <input
        id={id}
        aria-label={label}
        value={value}
        inputMode={inputMode}
        maxLength={maxLength}
        autoComplete="off"
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className={`rounded-md border-2 bg-card px-2 py-1 text-lg ${error ? 'border-alert' : 'border-line'} focus:border-harbour ${className}`}
      />
      {error && (
        <p id={`${id}-error`} className="mt-1 max-w-56 text-sm font-bold text-alert">
          {error}
        </p>
      )}
    </div>
  );
}
