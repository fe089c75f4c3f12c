import { lazy, Suspense, useId, useState } from 'react';
import { ChevronDown, ChevronRight, Images } from 'lucide-react';
import type { AttachmentTarget } from '@shared/files/attachment.schema';
import { ErrorBoundary } from '@/components/errors/error-boundary';

// The strip's code comes with the first one opened on the page.
const AttachmentStrip = lazy(async () => ({ default: (await import('./attachment-strip')).AttachmentStrip }));

interface AttachmentToggleProps {
  target: AttachmentTarget;
  /** What the files are on: "run 3", "“Spring baseline”". */
  what: string;
  canAdd?: boolean;
  /** Open at first (a short list where the photos are the point); the strip's code still loads on its own. */
  defaultOpen?: boolean;
}

/** Photos and files folded away under a button; fetched only when opened, so a long list asks for nothing up front. */
export function AttachmentToggle({ target, what, canAdd, defaultOpen = false }: AttachmentToggleProps) {
  const [open, setOpen] = useState(defaultOpen);
  const panelId = useId();
  const Chevron = open ? ChevronDown : ChevronRight;
  return (
    <div className="flex flex-col gap-2">
      <button
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((v) => !v)}
        className="inline-flex min-h-tap items-center gap-1 self-start font-semibold text-link"
      >
        <Chevron aria-hidden="true" className="size-4" />
        <Images aria-hidden="true" className="size-4" />
        Photos and files
        <span className="sr-only"> on {what}</span>
      </button>
      <div id={panelId} hidden={!open}>
        {open ? (
          <ErrorBoundary fallback={() => <p className="text-ink-muted">Photos could not be opened. Try again when you have signal.</p>}>
            <Suspense fallback={<p className="text-ink-muted">Loading photos…</p>}>
              <AttachmentStrip target={target} what={what} canAdd={canAdd} heading={false} />
            </Suspense>
          </ErrorBoundary>
        ) : null}
      </div>
    </div>
  );
}
