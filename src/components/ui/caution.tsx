import type { ReactNode } from 'react';
import { TriangleAlert } from 'lucide-react';

/** A short safety note beside the tool that needs it. */
export function Caution({ title = 'Caution', children }: { title?: string; children: ReactNode }) {
  return (
    <aside aria-label={title} className="flex items-start gap-2 rounded border border-warning-line bg-warning-surface p-3 text-sm text-ink">
      <TriangleAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-warning" />
      <div className="flex flex-col gap-1">
        <p className="font-bold text-warning">{title}</p>
        {children}
      </div>
    </aside>
  );
}
