import { StrictMode } from 'react';
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { RouterProvider } from 'react-router-dom';
import { ErrorBoundary } from '@/components/errors/error-boundary';
import { PageMessage } from '@/components/ui/page-message';
import { ToastProvider } from '@/components/ui/toaster';
import { OutboxProvider } from '@/lib/outbox-context';
import type { Outbox } from '@/lib/outbox';
import type { AppRouter } from './router';

function AppCrashed() {
  return (
    <PageMessage title="Scrubline stopped">
      <p>Something broke while drawing the screen. Nothing you saved is lost — reload the page to carry on.</p>
    </PageMessage>
  );
}

interface AppProviderProps {
  queryClient: QueryClient;
  router: AppRouter;
  outbox: Outbox;
}

/**
 * Everything the app needs around its pages: the query client (its cache is kept on the
 * device and restored before the app starts; see main.tsx), the outbox, toasts and the router.
 */
export function AppProvider({ queryClient, router, outbox }: AppProviderProps) {
  return (
    <StrictMode>
      <ErrorBoundary fallback={() => <AppCrashed />}>
        <QueryClientProvider client={queryClient}>
          <OutboxProvider outbox={outbox}>
            <ToastProvider>
              <RouterProvider router={router} />
            </ToastProvider>
          </OutboxProvider>
        </QueryClientProvider>
      </ErrorBoundary>
    </StrictMode>
  );
}
