import { Minus, Plus } from 'lucide-react';
import { cn } from '@/lib/cn';

interface StepperProps {
  label: string;
  value: number;
  onChange: (value: number) => void;
  min?: number;
  max?: number;
  step?: number;
  /** How the value reads on screen, e.g. "2 cones" or "+0.5 psi". */
  format?: (value: number) => string;
  /** Large (56 px) buttons for gloved hands at the car. */
  size?: 'lg' | 'md';
  /** A word under the number ("cones"), for a narrow stepper beside another control. */
  caption?: string;
  /** On the narrowest phones (under 360 px) the buttons are narrower, not shorter, to share a row with another control. */
  squeeze?: boolean;
}

/** A whole number (or a fixed step) changed with − and + buttons: big targets, no keyboard needed. */
export function Stepper({ label, value, onChange, min = -Infinity, max = Infinity, step = 1, format, size = 'lg', caption, squeeze = false }: StepperProps) {
  const round = (n: number) => Math.round(n * 1e6) / 1e6;
  const button = cn(
    'inline-flex shrink-0 items-center justify-center rounded border border-line-strong bg-surface text-ink hover:bg-surface-raised disabled:opacity-50',
    size === 'lg' ? 'size-tap-lg' : 'size-tap',
    squeeze && 'max-[359px]:w-12',
  );
  return (
    <div role="group" aria-label={label} className={cn('flex min-w-0 items-center gap-2', squeeze && 'max-[359px]:gap-1')}>
      <button
        type="button"
        className={button}
        onClick={() => onChange(Math.max(min, round(value - step)))}
        disabled={value - step < min - 1e-9}
        aria-label={`Less: ${label}`}
      >
        <Minus aria-hidden="true" className="size-6" />
      </button>
      <output
        className={cn('tabular-figures text-center text-2xl font-bold', caption ? 'flex w-12 flex-col leading-none' : 'min-w-16 flex-1')}
        aria-live="polite"
      >
        {format ? format(value) : value}
        {caption ? <span className="text-xs font-semibold text-ink-muted"> {caption}</span> : null}
      </output>
      <button
        type="button"
        className={button}
        onClick={() => onChange(Math.min(max, round(value + step)))}
        disabled={value + step > max + 1e-9}
        aria-label={`More: ${label}`}
      >
        <Plus aria-hidden="true" className="size-6" />
      </button>
    </div>
  );
}
