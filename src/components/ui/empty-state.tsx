import type { ReactNode } from 'react';

/** Says plainly that there is nothing here yet, and why. */
export function EmptyState({ message, children }: { message: string; children?: ReactNode }) {
  return (
    <div className="flex flex-col gap-2 rounded border border-dashed border-line-strong p-4">
      <p className="font-semibold text-ink-muted">{message}</p>
      {children}
    </div>
  );
}
