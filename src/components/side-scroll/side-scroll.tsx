import type { ReactNode } from 'react';

interface SideScrollProps {
  /** Names the scrolling box for screen readers, e.g. "Results of Grey roadster". */
  label: string;
  /**
   * What a phone finds further right, finishing "Swipe the table sideways for …", e.g. "adjusted times and rank".
   * Left out for a table that is only displayed from the `sm` width up, where the line would never show.
   */
  more?: string;
  id?: string;
  children: ReactNode;
}

/**
 * A table wider than a phone: it scrolls sideways inside its own box (the page itself never does), the box takes
 * keyboard focus so arrow keys scroll it too, and on a phone a line above it can say what is a swipe away.
 */
export function SideScroll({ label, more, id, children }: SideScrollProps) {
  return (
    <>
      {more ? <p className="text-xs text-ink-muted sm:hidden">{`Swipe the table sideways for ${more}.`}</p> : null}
      <div id={id} className="overflow-x-auto" tabIndex={0} role="region" aria-label={label}>
        {children}
      </div>
    </>
  );
}
