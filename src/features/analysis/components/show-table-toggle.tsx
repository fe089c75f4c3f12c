import { useId, useLayoutEffect, useRef, useState, type ReactNode } from 'react';
import { MoveHorizontal, Table2 } from 'lucide-react';
import { Button } from '@/components/ui/button';

/** The button under a chart that shows the same numbers as a table (for screen readers, and for reading exact values). */
export function ShowTableToggle({ shown, onToggle, controls }: { shown: boolean; onToggle: () => void; controls: string }) {
  return (
    <Button variant="secondary" className="self-start" aria-expanded={shown} aria-controls={controls} onClick={onToggle}>
      <Table2 aria-hidden="true" className="size-5" />
      {shown ? 'Hide table' : 'Show as table'}
    </Button>
  );
}

/** Stands in for a table while its code arrives. */
export function TableLoading() {
  return <p className="text-sm text-ink-muted">Loading the table…</p>;
}

interface TableBoxProps {
  /** Names the scrolling box for screen readers: the table's caption. */
  label: string;
  /** What lies further right, finishing "Swipe the table sideways for …", e.g. "the setup". */
  more: string;
  id?: string;
  children: ReactNode;
}

/**
 * A chart's table in a box of its own that scrolls sideways when the table is wider (the page itself never does).
 * The box takes keyboard focus so arrow keys scroll it too, and while the table is wider than the box — measured,
 * not guessed from the screen's size — a line above it says what is a swipe away. It is measured before the first
 * paint, so the line never pushes the table down after it is drawn.
 */
export function TableBox({ label, more, id, children }: TableBoxProps) {
  const box = useRef<HTMLDivElement>(null);
  const hintId = useId();
  const [wider, setWider] = useState(false);

  useLayoutEffect(() => {
    const element = box.current;
    if (!element) return;
    const measure = () => setWider(element.scrollWidth > element.clientWidth + 1);
    measure();
    if (typeof ResizeObserver === 'undefined') {
      window.addEventListener('resize', measure);
      return () => window.removeEventListener('resize', measure);
    }
    // The box when the page narrows or widens; the table when its rows change.
    const observer = new ResizeObserver(measure);
    observer.observe(element);
    for (const child of element.children) observer.observe(child);
    return () => observer.disconnect();
  }, []);

  return (
    <>
      {wider ? (
        <p id={hintId} className="flex items-center gap-1 text-xs text-ink-muted">
          <MoveHorizontal aria-hidden="true" className="size-4 shrink-0" />
          {`Swipe the table sideways for ${more}.`}
        </p>
      ) : null}
      <div
        ref={box}
        id={id}
        // A size container, so a group's heading can keep to the box's width while the table is wider.
        className="@container overflow-x-auto"
        tabIndex={0}
        role="region"
        aria-label={label}
        aria-describedby={wider ? hintId : undefined}
      >
        {children}
      </div>
    </>
  );
}
