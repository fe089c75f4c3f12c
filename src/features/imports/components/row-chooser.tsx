import type { ImportRow } from '@shared/import/mapping';
import { TextField } from '@/components/ui/text-field';
import { describeRun, type WhoseFilter } from '../utils/import-draft';

/**
 * "Which rows are yours": narrow by car number and name, then tick the rows to import.
 * Rows that match start ticked.
 */
export function RowChooser({
  filter,
  onFilterChange,
  rows,
  unticked,
  onToggle,
}: {
  filter: WhoseFilter;
  onFilterChange: (filter: WhoseFilter) => void;
  rows: readonly ImportRow[];
  unticked: ReadonlySet<number>;
  onToggle: (line: number) => void;
}) {
  return (
    <div className="flex flex-col gap-3">
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <TextField
          label="Your car number"
          inputMode="text"
          value={filter.carNumber}
          onChange={(e) => onFilterChange({ ...filter, carNumber: e.target.value })}
          hint="Leave empty to match any number"
        />
        <TextField
          label="Your name as the sheet spells it"
          value={filter.driverName}
          onChange={(e) => onFilterChange({ ...filter, driverName: e.target.value })}
          hint="Every word must appear, in any order"
        />
      </div>
      {rows.length === 0 ? (
        <p className="text-ink-muted">No rows match. Check the car number and name, or the columns chosen above.</p>
      ) : (
        <ul className="flex flex-col gap-2" aria-label="Rows that match">
          {rows.map((row) => {
            const label = `Line ${row.line}: ${row.driverName || 'no name'}${row.carNumber ? ` #${row.carNumber}` : ''}${row.classCode ? ` (${row.classCode})` : ''}`;
            return (
              <li key={row.line} className="rounded border border-line p-2">
                <label className="flex min-h-tap cursor-pointer items-start gap-3">
                  <input
                    type="checkbox"
                    className="mt-1 size-6 shrink-0"
                    checked={!unticked.has(row.line)}
                    onChange={() => onToggle(row.line)}
                  />
                  <span className="flex flex-col">
                    <span className="font-semibold">{label}</span>
                    {row.error ? <span className="text-sm font-semibold text-warning">{row.error}</span> : null}
                    {row.runs.length > 0 ? (
                      <span className="text-sm tabular-nums">
                        {row.runs.map((run) => `Run ${run.runNumber}: ${describeRun(run)}`).join(' · ')}
                      </span>
                    ) : null}
                    {row.runs
                      .filter((run) => run.error)
                      .map((run) => (
                        <span key={run.runNumber} className="text-sm font-semibold text-warning">
                          Run {run.runNumber} will be left out: {run.error}
                        </span>
                      ))}
                  </span>
                </label>
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}
