import { useId, type ComponentProps, type ReactNode } from 'react';
import { cn } from '@/lib/cn';

type TextFieldProps = Omit<ComponentProps<'input'>, 'id'> & {
  label: string;
  /** Always visible under the label, e.g. a rule the value must follow. */
  hint?: ReactNode;
  error?: string;
  /** Extra control beside the input (a show/hide button). */
  trailing?: ReactNode;
};

const INPUT_CLASSES =
  'min-h-tap w-full rounded border border-line-strong bg-surface px-3 text-base text-ink placeholder:text-ink-muted aria-[invalid=true]:border-warning aria-[invalid=true]:border-2';

/**
 * What every e-mail address field takes: the phone's keyboard with @ on it, and no capital letter, correction
 * or spelling marks put on an address. Spread into a `TextField`, with its own `autoComplete`.
 */
export const EMAIL_INPUT = { type: 'email', inputMode: 'email', autoCapitalize: 'none', autoCorrect: 'off', spellCheck: false } as const;

/** A labelled input whose hint and error are announced with it (aria-describedby). */
export function TextField({ label, hint, error, trailing, className, ...inputProps }: TextFieldProps) {
  const id = useId();
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ') || undefined;

  return (
    <div className={cn('flex flex-col gap-1', className)}>
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      {hint ? (
        <p id={hintId} className="text-sm text-ink-muted">
          {hint}
        </p>
      ) : null}
      <div className="flex items-stretch gap-2">
        <input
          id={id}
          className={INPUT_CLASSES}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          {...inputProps}
        />
        {trailing}
      </div>
      {error ? (
        <p id={errorId} className="text-sm font-semibold text-warning">
          {error}
        </p>
      ) : null}
    </div>
  );
}
