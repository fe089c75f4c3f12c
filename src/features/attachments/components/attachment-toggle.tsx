import { lazy } from 'react';
import { Images } from 'lucide-react';
import type { AttachmentTarget } from '@shared/files/attachment.schema';
import { FoldOut } from '@/components/fold-out/fold-out';

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
  return (
    <FoldOut
      icon={Images}
      label="Photos and files"
      what={what}
      defaultOpen={defaultOpen}
      loadingText="Loading photos…"
      failedText="Photos could not be opened. Try again when you have signal."
    >
      <AttachmentStrip target={target} what={what} canAdd={canAdd} heading={false} />
    </FoldOut>
  );
}
