import { TriangleAlert } from 'lucide-react';
import { formatQuantity } from '@shared/calc/units.calc';
import type { TreadCorner } from '@shared/season/tyre.schema';
import type { Corner } from '@shared/season/corners';
import { CornerGrid } from '@/components/corner-grid/corner-grid';
import { toInputText, unitSymbol } from '@/lib/numbers';
import { useUnits } from '@/lib/units-context';
import { POSITION_SHORT, POSITION_WORDS, positionsAcross, WEAR_BAR_MM } from '../utils/tread';

/**
 * A tread reading in the corner grid: outer, middle and inner across each tyre as it sits on the
 * car. Three numbers share a narrow corner, so the unit is in the grid's title (and read out with each).
 */
export function TreadDisplay({
  corners,
  label = 'Tread depth',
}: {
  corners: Partial<Record<Corner, TreadCorner & { tyreNumber?: number | null }>>;
  label?: string;
}) {
  const units = useUnits();
  const unit = unitSymbol('treadDepth', units);
  return (
    <CornerGrid
      label={`${label} (${unit})`}
      title={
        <span className="text-sm">
          {label} <span className="font-normal text-ink-muted">({unit}; outer, middle, inner as on the car)</span>
        </span>
      }
      cornerNote={(c) => (corners[c]?.tyreNumber ? `tyre ${corners[c]!.tyreNumber}` : null)}
      renderCorner={(corner) => {
        const values = corners[corner];
        if (!values) return <p className="text-sm text-ink-muted">Not measured</p>;
        return (
          <div className="grid grid-cols-3 gap-1 text-center">
            {positionsAcross(corner).map((pos) => {
              const low = values[pos] <= WEAR_BAR_MM;
              return (
                <div key={pos} className="flex min-w-0 flex-col">
                  <span className="text-xs text-ink-muted" aria-hidden="true">
                    {POSITION_SHORT[pos]}
                  </span>
                  <span className={`tabular-figures text-base font-bold ${low ? 'text-warning underline decoration-2' : ''}`}>
                    <span aria-hidden="true">{toInputText(values[pos], 'treadDepth', units)}</span>
                    <span className="sr-only">
                      {POSITION_WORDS[pos]} {formatQuantity(values[pos], 'treadDepth', units)}
                      {low ? ', at or below the wear bars' : ''}
                    </span>
                  </span>
                  {low ? <TriangleAlert aria-hidden="true" className="mx-auto size-3.5 text-warning" /> : null}
                </div>
              );
            })}
          </div>
        );
      }}
    />
  );
}
