import type { SetupCornerField } from '@shared/season/setup.schema';
import { CornerGrid } from '@/components/corner-grid/corner-grid';
import { FIELD_INFO, formatFieldChange, formatFieldValue } from '@/lib/setup-fields';
import { useUnits } from '@/lib/units-context';
import type { PreviewCell } from '../utils/change-rows';

/** One corner's from → to, with the difference: "−1.20° → −1.70° (▼ 0.50°)". */
export function FromTo({ cell }: { cell: Pick<PreviewCell, 'field' | 'from' | 'to'> }) {
  const units = useUnits();
  const { field, from, to } = cell;
  return (
    <span className="tabular-figures flex flex-col text-right">
      <span className="text-sm text-ink-muted">{formatFieldValue(field, from, units)}</span>
      <span className="font-bold">→ {formatFieldValue(field, to, units)}</span>
      {from !== null && to !== null ? <span className="text-xs text-ink-muted">{formatFieldChange(field, from, to, units)}</span> : null}
      {from === null ? <span className="text-xs text-ink-muted">not recorded before</span> : null}
    </span>
  );
}

/** Every changed value in the corner grid, one grid per field; corners left alone say so. */
export function ChangePreview({ cells }: { cells: readonly PreviewCell[] }) {
  const fields = [...new Set(cells.map((c) => c.field))] as SetupCornerField[];
  if (fields.length === 0) return <p className="text-sm text-ink-muted">No changes.</p>;
  return (
    <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
      {fields.map((field) => {
        // The last change to a corner is where it ends up; the first says where it started.
        const byCorner = (corner: PreviewCell['corner']) => {
          const mine = cells.filter((c) => c.field === field && c.corner === corner);
          return mine.length ? { field, from: mine[0]!.from, to: mine[mine.length - 1]!.to } : null;
        };
        return (
          <CornerGrid
            key={field}
            label={FIELD_INFO[field].label}
            renderCorner={(corner) => {
              const cell = byCorner(corner);
              return cell ? <FromTo cell={cell} /> : <p className="text-right text-sm text-ink-muted">unchanged</p>;
            }}
          />
        );
      })}
    </div>
  );
}
