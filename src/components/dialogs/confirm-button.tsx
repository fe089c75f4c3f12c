import { useState, type ReactNode } from 'react';
import type { LucideIcon } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormAlert } from '@/components/ui/form-alert';
import { isApiError } from '@/lib/api-client';

// Not in components/ui: the build bundles ui/ into one file the trackside page loads, and this one brings the dialog with it.

/** Why an online action was refused, in words: no signal, the fields the server named, or its message. */
export function refusalText(error: unknown): string {
  if (!isApiError(error)) return 'Something went wrong; try again.';
  if (error.code === 'network') return 'This needs a connection. Try again when you have signal.';
  const fields = Object.values(error.fieldErrors).flat();
  return fields.length ? fields.join(' ') : error.message;
}

export interface ConfirmButtonProps {
  /** The button that opens the question. */
  children: ReactNode;
  variant?: 'primary' | 'secondary' | 'quiet';
  /** The confirming button is drawn as a destructive step (removing, revoking, ending); not for restoring or granting. */
  destructive?: boolean;
  title: string;
  description: string;
  confirmLabel: string;
  pendingLabel: string;
  keepLabel?: string;
  isPending: boolean;
  /** Runs the action; the dialog closes when it succeeds and shows the error when it fails. */
  onConfirm: (handlers: { onSuccess: () => void; onError: (error: unknown) => void }) => void;
  /** The words shown in the dialog when the action fails. */
  failureText: (error: unknown) => string;
  /** Fields the question asks for (a reason), above its buttons. */
  fields?: ReactNode;
  /** Runs whenever the question closes, done or not: to clear what its fields held. */
  onClose?: () => void;
}

/** A button that asks first, for what cannot be undone from here (removing, revoking, leaving, withdrawing). */
export function ConfirmButton({
  children,
  variant = 'quiet',
  destructive = false,
  title,
  description,
  confirmLabel,
  pendingLabel,
  keepLabel = 'Cancel',
  isPending,
  onConfirm,
  failureText,
  fields,
  onClose,
}: ConfirmButtonProps) {
  const [open, setOpen] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const onOpenChange = (next: boolean) => {
    setOpen(next);
    if (!next) {
      setError(null);
      onClose?.();
    }
  };
  const confirm = () => {
    setError(null);
    onConfirm({ onSuccess: () => setOpen(false), onError: (e) => setError(failureText(e)) });
  };
  return (
    <>
      <Button variant={variant} className="shrink-0" onClick={() => onOpenChange(true)}>
        {children}
      </Button>
      <Dialog open={open} onOpenChange={onOpenChange} title={title} description={description}>
        {fields}
        <FormAlert message={error} />
        <div className="flex flex-wrap gap-3">
          <Button variant={destructive ? 'danger' : 'primary'} onClick={confirm} isPending={isPending} pendingLabel={pendingLabel}>
            {confirmLabel}
          </Button>
          <Button variant="secondary" onClick={() => onOpenChange(false)}>
            {keepLabel}
          </Button>
        </div>
      </Dialog>
    </>
  );
}

/** Removes one person from a car, a team or a shop, after asking; the button names them to screen readers. */
export function RemovePersonButton({
  person,
  description,
  confirmLabel,
  remove,
  failureText,
  icon: Icon,
}: {
  person: { id: string; displayName: string };
  description: string;
  confirmLabel: string;
  remove: { isPending: boolean; mutate: (personId: string, handlers: { onSuccess: () => void; onError: (error: unknown) => void }) => void };
  failureText: (error: unknown) => string;
  icon: LucideIcon;
}) {
  return (
    <ConfirmButton
      title={`Remove ${person.displayName}?`}
      destructive
      description={description}
      confirmLabel={confirmLabel}
      pendingLabel="Removing…"
      keepLabel="Keep"
      isPending={remove.isPending}
      onConfirm={(handlers) => remove.mutate(person.id, handlers)}
      failureText={failureText}
    >
      <Icon aria-hidden="true" className="size-5" /> Remove<span className="sr-only"> {person.displayName}</span>
    </ConfirmButton>
  );
}
