import type { ReactNode } from 'react';
import { QueryErrorResetBoundary } from '@tanstack/react-query';
import { ErrorBoundary } from './error-boundary';
import { SectionError } from './section-error';

/** Wraps one section of a page; "Try again" also retries the section's failed queries. */
export function SectionBoundary({ title, children }: { title: string; children: ReactNode }) {
  return (
    <QueryErrorResetBoundary>
      {({ reset }) => (
        <ErrorBoundary
          onReset={reset}
          fallback={({ error, reset: retry }) => <SectionError title={title} error={error} onRetry={retry} />}
        >
          {children}
        </ErrorBoundary>
      )}
    </QueryErrorResetBoundary>
  );
}
