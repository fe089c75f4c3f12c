import type { ReactNode } from 'react';
import { CORNERS, type Corner } from '@shared/season/corners';
import { cn } from '@/lib/cn';

/** Corner names for people, in the order the grid draws them. */
export const CORNER_NAMES: Record<Corner, string> = {
  lf: 'Left front',
  rf: 'Right front',
  lr: 'Left rear',
  rr: 'Right rear',
};

export const CORNER_SHORT: Record<Corner, string> = { lf: 'LF', rf: 'RF', lr: 'LR', rr: 'RR' };

/** The car from above: body, four wheels and a nose, so left and right cannot be swapped by eye. */
function CarOutline({ dense }: { dense: boolean }) {
  return (
    <svg viewBox="0 0 24 72" className={cn('h-full max-h-40 text-line-strong', dense ? 'w-4' : 'w-6')} aria-hidden="true" focusable="false">
      {/* nose, pointing up (the front) */}
      <path d="M12 1 L17 7 H7 Z" fill="currentColor" />
      {/* body */}
      <rect x="5" y="8" width="14" height="60" rx="5" fill="none" stroke="currentColor" strokeWidth="1.5" />
      {/* windscreen */}
      <path d="M7.5 24 Q12 20 16.5 24" fill="none" stroke="currentColor" strokeWidth="1.2" />
      {/* wheels */}
      <rect x="1" y="14" width="3.5" height="10" rx="1" fill="currentColor" />
      <rect x="19.5" y="14" width="3.5" height="10" rx="1" fill="currentColor" />
      <rect x="1" y="52" width="3.5" height="10" rx="1" fill="currentColor" />
      <rect x="19.5" y="52" width="3.5" height="10" rx="1" fill="currentColor" />
    </svg>
  );
}

interface CornerGridProps {
  /** What the grid holds, e.g. "Cold pressure (psi)"; names the group for screen readers. */
  label: string;
  /** Shown above the grid; defaults to `label`. Pass null to show nothing (the page has a heading). */
  title?: ReactNode;
  /** The content of one corner: an input, a value, a toggle. */
  renderCorner: (corner: Corner) => ReactNode;
  /** Extra words beside a corner's name (e.g. the tyre number on it). */
  cornerNote?: (corner: Corner) => ReactNode;
  /** Marks a corner (e.g. one with an error) with a warning border. */
  cornerInvalid?: (corner: Corner) => boolean;
  /** Tighter padding and a narrower outline, for three inputs across a corner (tread). */
  dense?: boolean;
  className?: string;
}

/**
 * The one per-corner layout in Scrubline: a 2×2 grid drawn as the car seen from above — front
 * at the top, left on the left — with a small outline of the car between the columns. Used for
 * pressures, tread, setup values and every corner display.
 */
export function CornerGrid({ label, title, renderCorner, cornerNote, cornerInvalid, dense = false, className }: CornerGridProps) {
  const heading = title === undefined ? label : title;
  return (
    <div role="group" aria-label={label} className={cn('flex min-w-0 flex-col gap-1', className)}>
      {heading !== null ? <div className="font-semibold">{heading}</div> : null}
      <p className="text-center text-xs font-semibold tracking-wide text-ink-muted uppercase" aria-hidden="true">
        ▲ Front
      </p>
      <div
        className={cn(
          'grid items-stretch gap-y-2',
          dense ? 'grid-cols-[minmax(0,1fr)_1rem_minmax(0,1fr)] gap-x-2' : 'grid-cols-[minmax(0,1fr)_1.5rem_minmax(0,1fr)] gap-x-2',
        )}
      >
        {CORNERS.map((corner, i) => (
          <div
            key={corner}
            role="group"
            aria-label={CORNER_NAMES[corner]}
            className={cn(
              'flex min-w-0 flex-col gap-1 rounded border bg-surface',
              dense ? 'p-1' : 'p-2',
              cornerInvalid?.(corner) ? 'border-2 border-warning' : 'border-line',
              // left corners in the first column, right corners in the third; the outline sits between
              corner === 'lf' || corner === 'lr' ? 'col-start-1' : 'col-start-3',
              i < 2 ? 'row-start-1' : 'row-start-2',
            )}
          >
            <div className="flex items-baseline justify-between gap-1 text-xs font-semibold text-ink-muted">
              <span className="font-bold text-ink" aria-hidden="true">
                {CORNER_NAMES[corner]}
              </span>
              {cornerNote ? <span className="truncate">{cornerNote(corner)}</span> : null}
            </div>
            {renderCorner(corner)}
          </div>
        ))}
        <div className="col-start-2 row-span-2 row-start-1 flex items-center justify-center">
          <CarOutline dense={dense} />
        </div>
      </div>
      <p className="text-center text-xs font-semibold tracking-wide text-ink-muted uppercase" aria-hidden="true">
        Rear
      </p>
    </div>
  );
}
