import { lazy, Suspense, useState, useSyncExternalStore, type ReactNode } from 'react';
import { getToasts, subscribeToToasts } from '@/lib/toast-store';
import { ErrorBoundary } from '@/components/errors/error-boundary';

// Radix Toast is downloaded with the first toast, not with every page (the service worker keeps
// it for offline use); once there, it stays, so later toasts show at once.
const ToastLayer = lazy(async () => ({ default: (await import('./toast-layer')).ToastLayer }));

const hasToasts = () => getToasts().length > 0;

/** Shows the toast store's messages above the phone's bottom bar. */
export function ToastProvider({ children }: { children: ReactNode }) {
  const any = useSyncExternalStore(subscribeToToasts, hasToasts, hasToasts);
  const [needed, setNeeded] = useState(false);
  if (any && !needed) setNeeded(true);
  return (
    <>
      {children}
      {needed ? (
        <ErrorBoundary fallback={() => null}>
          <Suspense fallback={null}>
            <ToastLayer />
          </Suspense>
        </ErrorBoundary>
      ) : null}
    </>
  );
}
