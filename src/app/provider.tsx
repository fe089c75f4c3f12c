import { StrictMode } from 'react';
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { RouterProvider } from 'react-router-dom';
import { ErrorBoundary } from '@/components/errors/error-boundary';
import { PageMessage } from '@/components/ui/page-message';
import { ToastProvider } from '@/components/ui/toaster';
import type { AppRouter } from './router';

function AppCrashed() {
  return (
    <PageMessage title="Scrubline stopped">
      <p>Something broke while drawing the screen. Nothing you saved is lost — reload the page to carry on.</p>
    </PageMessage>
  );
}

/** Everything the app needs around its pages: the query client, toasts and the router. */
export function AppProvider({ queryClient, router }: { queryClient: QueryClient; router: AppRouter }) {
  return (
    <StrictMode>
      <ErrorBoundary fallback={() => <AppCrashed />}>
        <QueryClientProvider client={queryClient}>
          <ToastProvider>
            <RouterProvider router={router} />
          </ToastProvider>
        </QueryClientProvider>
      </ErrorBoundary>
    </StrictMode>
  );
}
