import { useSyncExternalStore } from 'react';
import * as Toast from '@radix-ui/react-toast';
import { CircleCheck, Info, TriangleAlert, X } from 'lucide-react';
import { cn } from '@/lib/cn';
import { dismissToast, getToasts, subscribeToToasts, type ToastMessage, type ToastTone } from '@/lib/toast-store';

const TONE: Record<ToastTone, { className: string; Icon: typeof Info }> = {
  info: { className: 'border-line-strong bg-surface text-ink', Icon: Info },
  success: { className: 'border-line bg-success-surface text-success', Icon: CircleCheck },
  warning: { className: 'border-warning-line bg-warning-surface text-warning', Icon: TriangleAlert },
};

function ToastItem({ message }: { message: ToastMessage }) {
  const { className, Icon } = TONE[message.tone];
  return (
    <Toast.Root
      // Problems are announced at once; confirmations wait their turn.
      type={message.tone === 'warning' ? 'foreground' : 'background'}
      duration={message.tone === 'warning' || message.action ? 10_000 : 5_000}
      onOpenChange={(open) => {
        if (!open) dismissToast(message.id);
      }}
      className={cn('flex items-start gap-3 rounded-lg border p-3 shadow-lg', className)}
    >
      <Icon aria-hidden="true" className="mt-0.5 size-5 shrink-0" />
      <div className="flex min-w-0 flex-1 flex-col gap-1">
        <Toast.Title className="font-bold">{message.title}</Toast.Title>
        {message.description ? (
          <Toast.Description className="text-sm text-ink">{message.description}</Toast.Description>
        ) : null}
      </div>
      {message.action ? (
        <Toast.Action
          altText={message.action.altText}
          className="inline-flex min-h-tap shrink-0 items-center justify-center rounded border border-line-strong bg-surface px-4 font-bold text-ink hover:bg-surface-raised"
          onClick={() => {
            message.action?.onAction();
            dismissToast(message.id);
          }}
        >
          {message.action.label}
        </Toast.Action>
      ) : null}
      <Toast.Close
        className="-m-2 inline-flex size-tap shrink-0 items-center justify-center rounded text-ink-muted hover:text-ink"
        aria-label="Dismiss"
      >
        <X aria-hidden="true" className="size-5" />
      </Toast.Close>
    </Toast.Root>
  );
}

/**
 * Renders the toast store's messages. On a phone they sit under the header, away from the bottom third where the
 * page's own actions are (a Save bar, the keypad): a confirmation never takes the next tap. On a wide screen, at
 * the bottom right.
 */
function ToastList() {
  const toasts = useSyncExternalStore(subscribeToToasts, getToasts, getToasts);
  return toasts.map((message) => <ToastItem key={message.id} message={message} />);
}

/** Radix Toast around the store's messages; loaded with the first toast (see toaster.tsx). */
export function ToastLayer() {
  return (
    <Toast.Provider swipeDirection="right" label="Notifications">
      <ToastList />
      <Toast.Viewport className="fixed inset-x-0 top-[calc(3.5rem+env(safe-area-inset-top))] z-50 mx-auto flex max-w-form flex-col gap-2 px-4 pt-2 outline-none md:top-auto md:bottom-6 md:right-6 md:left-auto md:mx-0 md:w-96 md:px-0 md:pt-0" />
    </Toast.Provider>
  );
}
