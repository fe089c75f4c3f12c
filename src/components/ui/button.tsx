import type { ComponentProps } from 'react';
import { cn } from '@/lib/cn';

type Variant = 'primary' | 'secondary' | 'quiet' | 'danger';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-accent text-accent-ink hover:bg-accent-hover',
  secondary: 'border border-line-strong bg-surface text-ink hover:bg-surface-raised',
  quiet: 'text-link hover:bg-accent-soft',
  /** The step that removes or ends something, in the caution colour, so it is not taken for the usual way on. */
  danger: 'border border-warning bg-surface text-warning hover:bg-warning-surface',
};

const BUTTON_BASE =
  'inline-flex min-h-tap items-center justify-center rounded font-bold select-none disabled:cursor-not-allowed disabled:opacity-60';

/**
 * The base's padding and gap give way to the caller's: of two classes setting one property, the stylesheet's
 * order decides, not the class list's, so `px-5 px-3` would keep 5.
 */
const unless = (className = '', prefix: string, base: string) => (` ${className}`.includes(` ${prefix}`) ? null : base);

export function buttonClasses(variant: Variant = 'primary', className?: string): string {
  return cn(BUTTON_BASE, unless(className, 'px-', 'px-5'), unless(className, 'gap-', 'gap-2'), VARIANTS[variant], className);
}

type ButtonProps = ComponentProps<'button'> & {
  variant?: Variant;
  /** Shown instead of the children while the action runs; the button is disabled meanwhile. */
  pendingLabel?: string;
  isPending?: boolean;
};

export function Button({
  variant = 'primary',
  type = 'button',
  pendingLabel,
  isPending = false,
  disabled,
  className,
  children,
  ...props
}: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClasses(variant, className)}
      disabled={disabled || isPending}
      aria-busy={isPending || undefined}
      {...props}
    >
      {isPending && pendingLabel ? pendingLabel : children}
    </button>
  );
}
