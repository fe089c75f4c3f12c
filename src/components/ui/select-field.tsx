import { forwardRef, useId, type ComponentProps } from 'react';
import { cn } from '@/lib/cn';

type SelectFieldProps = Omit<ComponentProps<'select'>, 'id'> & {
  label: string;
  hideLabel?: boolean;
  error?: string;
  options: readonly { value: string; label: string }[];
};

/** A labelled native select: the phone's own picker, big and familiar. */
export const SelectField = forwardRef<HTMLSelectElement, SelectFieldProps>(function SelectField(
  { label, hideLabel, error, options, className, ...props },
  ref,
) {
  const id = useId();
  const errorId = `${id}-error`;
  return (
    <div className={cn('flex min-w-0 flex-col gap-1', className)}>
      <label htmlFor={id} className={hideLabel ? 'sr-only' : 'font-semibold'}>
        {label}
      </label>
      <select
        ref={ref}
        id={id}
        className="min-h-tap w-full rounded border border-line-strong bg-surface px-3 text-base text-ink aria-[invalid=true]:border-2 aria-[invalid=true]:border-warning"
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? errorId : undefined}
        {...props}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      {error ? (
        <p id={errorId} className="text-sm font-semibold text-warning">
          {error}
        </p>
      ) : null}
    </div>
  );
});
