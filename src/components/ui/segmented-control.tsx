import { useId } from 'react';
import { cn } from '@/lib/cn';

interface SegmentedControlProps<T extends string> {
  label: string;
  hideLabel?: boolean;
  options: readonly { value: T; label: string }[];
  value: T;
  onChange: (value: T) => void;
  name?: string;
}

/** One choice of a few, drawn as joined buttons; real radio buttons underneath, so keys and screen readers work. */
export function SegmentedControl<T extends string>({ label, hideLabel, options, value, onChange, name }: SegmentedControlProps<T>) {
  const id = useId();
  return (
    <fieldset className="flex min-w-0 flex-col gap-1">
      <legend className={hideLabel ? 'sr-only' : 'mb-1 text-sm font-semibold'}>{label}</legend>
      <div className="flex overflow-hidden rounded border border-line-strong">
        {options.map((option, i) => {
          const checked = option.value === value;
          return (
            <label
              key={option.value}
              className={cn(
                'relative flex min-h-tap flex-1 cursor-pointer items-center justify-center px-2 text-center font-bold select-none has-[:focus-visible]:outline-3 has-[:focus-visible]:-outline-offset-4 has-[:focus-visible]:outline-focus',
                i > 0 && 'border-l border-line-strong',
                checked ? 'bg-accent text-accent-ink' : 'bg-surface text-ink hover:bg-surface-raised',
              )}
            >
              <input
                type="radio"
                className="sr-only"
                name={name ?? id}
                value={option.value}
                checked={checked}
                onChange={() => onChange(option.value)}
              />
              {checked ? <span aria-hidden="true">✓&nbsp;</span> : null}
              {option.label}
            </label>
          );
        })}
      </div>
    </fieldset>
  );
}
