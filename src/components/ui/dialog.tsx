import type { ReactNode } from 'react';
import * as RadixDialog from '@radix-ui/react-dialog';
import { X } from 'lucide-react';

interface DialogProps {
  open: boolean;
  onOpenChange: (open: boolean) => void;
  title: string;
  description?: ReactNode;
  children?: ReactNode;
}

/** A modal question with a title, a line of explanation and its actions; no animation. */
export function Dialog({ open, onOpenChange, title, description, children }: DialogProps) {
  return (
    <RadixDialog.Root open={open} onOpenChange={onOpenChange}>
      <RadixDialog.Portal>
        <RadixDialog.Overlay className="fixed inset-0 z-50 bg-black/50" />
        <RadixDialog.Content
          {...(description ? {} : { 'aria-describedby': undefined })}
          className="fixed inset-x-4 bottom-4 z-50 mx-auto flex max-w-form flex-col gap-4 rounded-lg border border-line bg-surface p-5 text-ink shadow-lg md:top-1/3 md:bottom-auto">
          <div className="flex items-start justify-between gap-3">
            <RadixDialog.Title className="text-xl font-bold">{title}</RadixDialog.Title>
            <RadixDialog.Close
              className="-m-2 inline-flex size-tap shrink-0 items-center justify-center rounded text-ink-muted hover:text-ink"
              aria-label="Close"
            >
              <X aria-hidden="true" className="size-5" />
            </RadixDialog.Close>
          </div>
          {description ? <RadixDialog.Description className="text-ink">{description}</RadixDialog.Description> : null}
          {children}
        </RadixDialog.Content>
      </RadixDialog.Portal>
    </RadixDialog.Root>
  );
}
