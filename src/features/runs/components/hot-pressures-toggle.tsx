import type { PerCorner } from '@shared/season/corners';
import { formatQuantity } from '@shared/calc/units.calc';
import { CornerGrid } from '@/components/corner-grid/corner-grid';
import { useUnits } from '@/lib/units-context';

/** A run's hot pressures, folded under a toggle, in the corner grid and the user's units; a corner not taken shows "—". */
export function HotPressuresToggle({ kpa }: { kpa: PerCorner<number> }) {
  const units = useUnits();
  return (
    <details>
      <summary className="inline-flex min-h-tap cursor-pointer items-center text-sm font-semibold text-link">Hot pressures</summary>
      <CornerGrid
        label="Hot pressures"
        title={null}
        renderCorner={(c) => <span className="tabular-figures text-right font-bold">{formatQuantity(kpa[c], 'pressure', units)}</span>}
      />
    </details>
  );
}
