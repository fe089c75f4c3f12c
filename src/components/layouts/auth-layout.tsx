import type { ReactNode } from 'react';
import { Wordmark } from '@/components/ui/wordmark';

/** The frame for signing in and creating an account: one narrow column, the form within thumb reach. */
export function AuthLayout({ title, intro, children }: { title: string; intro?: ReactNode; children: ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col">
      <header className="mx-auto w-full max-w-form px-4 pt-8">
        <Wordmark className="text-2xl" />
      </header>
      <main className="mx-auto flex w-full max-w-form flex-1 flex-col gap-6 px-4 pt-8 pb-12">
        <div className="flex flex-col gap-2">
          <h1 className="text-3xl font-extrabold">{title}</h1>
          {intro ? <div className="text-ink-muted">{intro}</div> : null}
        </div>
        {children}
      </main>
    </div>
  );
}
