import { StrictMode } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { PersistQueryClientProvider, type Persister } from '@tanstack/react-query-persist-client';
import { RouterProvider } from 'react-router-dom';
import { ErrorBoundary } from '@/components/errors/error-boundary';
import { PageMessage } from '@/components/ui/page-message';
import { ToastProvider } from '@/components/ui/toaster';
import { OutboxProvider } from '@/lib/outbox-context';
import type { Outbox } from '@/lib/outbox';
import type { AppRouter } from './router';
import { CACHE_MAX_AGE_MS } from './query-client';

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
  persister: Persister;
}

/**
 * Everything the app needs around its pages: the query client with its cache kept on the
 * device (so the app opens with no signal), the outbox, toasts and the router.
 */
export function AppProvider({ queryClient, router, outbox, persister }: AppProviderProps) {
  return (
    <StrictMode>
      <ErrorBoundary fallback={() => <AppCrashed />}>
        <PersistQueryClientProvider
          client={queryClient}
          persistOptions={{ persister, maxAge: CACHE_MAX_AGE_MS, buster: __APP_VERSION__ }}
          onSuccess={async () => {
            // Mutations that were paused when the page closed carry on, then screens refresh.
            await queryClient.resumePausedMutations();
            await queryClient.invalidateQueries();
          }}
        >
          <OutboxProvider outbox={outbox}>
            <ToastProvider>
              <RouterProvider router={router} />
            </ToastProvider>
          </OutboxProvider>
        </PersistQueryClientProvider>
      </ErrorBoundary>
    </StrictMode>
  );
}
