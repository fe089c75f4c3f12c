import type { ReactNode } from 'react';
import { cn } from '@/lib/cn';

interface PageMessageProps {
  title: string;
  children?: ReactNode;
  actions?: ReactNode;
  /** "page" fills the window (no shell around it); "in-shell" sits inside the app shell's <main>. */
  variant?: 'page' | 'in-shell';
}

/** A whole-page message (not found, something broke) with room for one or two actions. */
export function PageMessage({ title, children, actions, variant = 'page' }: PageMessageProps) {
  const Wrapper = variant === 'page' ? 'main' : 'div';
  return (
    <Wrapper
      className={cn(
        'mx-auto flex max-w-form flex-col gap-4',
        variant === 'page' ? 'min-h-dvh justify-center px-4 py-10' : 'py-6',
      )}
    >
      <title>{`${title} · Scrubline`}</title>
      <h1 className="text-2xl font-extrabold">{title}</h1>
      {children ? <div className="flex flex-col gap-2 text-ink-muted">{children}</div> : null}
      {actions ? <div className="flex flex-wrap gap-3">{actions}</div> : null}
    </Wrapper>
  );
}
