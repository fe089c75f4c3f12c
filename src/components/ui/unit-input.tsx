import { forwardRef, useId, type ComponentProps, type ReactNode } from 'react';
import { cn } from '@/lib/cn';

type UnitInputProps = Omit<ComponentProps<'input'>, 'id' | 'type'> & {
  /** Names the input; with `hideLabel` it is read out but not drawn (the corner grid already says where). */
  label: string;
  hideLabel?: boolean;
  /** The unit the value is typed in, always shown beside it: "psi", "mm", "°". */
  unit: string;
  /** Under the input: the change from before, a range. */
  hint?: ReactNode;
  error?: string;
  /** Whether the number can be negative (camber, toe): phones then show a keyboard with a minus sign. */
  signed?: boolean;
};

/** A number typed in the user's unit, with the unit beside it and its error read out with it. */
export const UnitInput = forwardRef<HTMLInputElement, UnitInputProps>(function UnitInput(
  { label, hideLabel = false, unit, hint, error, signed = false, className, ...inputProps },
  ref,
) {
  const id = useId();
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const unitId = `${id}-unit`;
  const describedBy = [unitId, hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ');
  return (
    <div className={cn('flex min-w-0 flex-col gap-1', className)}>
      <label htmlFor={id} className={hideLabel ? 'sr-only' : 'text-sm font-semibold'}>
        {label}
      </label>
      <div
        className={cn(
          'flex min-h-tap min-w-0 items-center rounded border bg-surface focus-within:outline-3 focus-within:outline-offset-2 focus-within:outline-focus',
          error ? 'border-2 border-warning' : 'border-line-strong',
        )}
      >
        <input
          ref={ref}
          id={id}
          type="text"
          inputMode={signed ? 'text' : 'decimal'}
          autoComplete="off"
          spellCheck={false}
          className="tabular-figures min-h-tap w-full min-w-0 bg-transparent px-2 text-right text-base text-ink outline-none"
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          {...inputProps}
        />
        <span id={unitId} className="shrink-0 pr-2 text-sm font-semibold text-ink-muted">
          {unit}
        </span>
      </div>
      {hint ? (
        <div id={hintId} className="tabular-figures text-xs text-ink-muted">
          {hint}
        </div>
      ) : null}
      {error ? (
        <p id={errorId} className="text-xs font-semibold text-warning">
          {error}
        </p>
      ) : null}
    </div>
  );
});
