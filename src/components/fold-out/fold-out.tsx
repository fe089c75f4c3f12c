import { Suspense, useEffect, useId, useRef, useState, type ComponentType, type ReactNode } from 'react';
import { ChevronDown, ChevronRight } from 'lucide-react';
import { ErrorBoundary } from '@/components/errors/error-boundary';

interface FoldOutProps {
  /** The button's icon beside the chevron. */
  icon: ComponentType<{ 'aria-hidden'?: boolean | 'true'; className?: string }>;
  /** The button's words, e.g. "Comments (3)". */
  label: ReactNode;
  /** Read out after the label: what it is about, e.g. "run 3". */
  what: string;
  /** The word joining the label to `what` when read out: "Comments (3) on run 3", "Earlier readings of Set B". */
  joiner?: 'on' | 'of';
  /** Shown while the content's code loads, and when it cannot. */
  loadingText: string;
  failedText: string;
  defaultOpen?: boolean;
  /** The page was opened for this section (a notification's link): open from the start, and scrolled to once. */
  revealed?: boolean;
  /** Rendered only once opened, so a long list asks for nothing up front; usually a lazy component. */
  children: ReactNode;
}

/** A section folded away under its button: comments, photos. Its content loads and renders on first open. */
export function FoldOut({ icon: Icon, label, what, joiner = 'on', loadingText, failedText, defaultOpen = false, revealed = false, children }: FoldOutProps) {
  const [open, setOpen] = useState(defaultOpen || revealed);
  const panelId = useId();
  const ref = useRef<HTMLDivElement>(null);
  const scrolled = useRef(false);
  // Once, to the middle of the screen, so what the section is about (a run's times) shows above it.
  useEffect(() => {
    if (!revealed || scrolled.current) return;
    scrolled.current = true;
    ref.current?.scrollIntoView?.({ block: 'center' });
  }, [revealed]);
  const Chevron = open ? ChevronDown : ChevronRight;
  return (
    <div ref={ref} className="flex flex-col gap-2">
      <button
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((v) => !v)}
        className="inline-flex min-h-tap items-center gap-1 self-start font-semibold text-link"
      >
        <Chevron aria-hidden="true" className="size-4" />
        <Icon aria-hidden="true" className="size-4" />
        {label}
        <span className="sr-only"> {joiner} {what}</span>
      </button>
      <div id={panelId} hidden={!open}>
        {open ? (
          <ErrorBoundary fallback={() => <p className="text-ink-muted">{failedText}</p>}>
            <Suspense fallback={<p className="text-ink-muted">{loadingText}</p>}>{children}</Suspense>
          </ErrorBoundary>
        ) : null}
      </div>
    </div>
  );
}
