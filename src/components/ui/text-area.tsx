import { useId } from 'react';

interface TextAreaProps {
  label: string;
  hint?: string;
  value: string;
  onChange: (value: string) => void;
  error?: string | null;
  rows?: number;
  maxLength?: number;
}

/** A labelled text box for a few sentences; its hint and error are read out with it. */
export function TextArea({ label, hint, value, onChange, error, rows = 4, maxLength }: TextAreaProps) {
  const id = useId();
  const describedBy = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-ink-muted">
          {hint}
        </p>
      ) : null}
      <textarea
        id={id}
        rows={rows}
        value={value}
        maxLength={maxLength}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className="w-full rounded border border-line-strong bg-surface p-3 text-base text-ink aria-[invalid=true]:border-2 aria-[invalid=true]:border-warning"
      />
      {error ? (
        <p id={`${id}-error`} className="text-sm font-semibold text-warning">
          {error}
        </p>
      ) : null}
    </div>
  );
}
