import { CloudUpload, TriangleAlert } from 'lucide-react';

/** Beside a record not yet on the server: waiting to upload, or refused and needing attention. */
export function PendingBadge({ state }: { state: 'waiting' | 'failed' }) {
  if (state === 'failed') {
    return (
      <span className="inline-flex items-center gap-1 rounded border border-warning-line bg-warning-surface px-2 py-0.5 text-xs font-bold text-warning">
        <TriangleAlert aria-hidden="true" className="size-3.5" />
        Needs attention
      </span>
    );
  }
  return (
    <span className="inline-flex items-center gap-1 rounded border border-line-strong px-2 py-0.5 text-xs font-bold text-ink-muted">
      <CloudUpload aria-hidden="true" className="size-3.5" />
      Waiting to upload
    </span>
  );
}
