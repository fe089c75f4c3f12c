import { SETUP_CORNER_FIELDS, type Setup } from '@shared/season/setup.schema';
import { CornerGrid } from '@/components/corner-grid/corner-grid';
import { useUnits } from '@/lib/units-context';
import { FIELD_INFO, formatFieldValue } from '@/lib/setup-fields';

/** Every recorded value of a snapshot, each field in the corner grid. */
export function SetupValues({ setup }: { setup: Pick<Setup, 'corners' | 'axles'> }) {
  const units = useUnits();
  const fields = SETUP_CORNER_FIELDS.filter((f) => Object.values(setup.corners).some((c) => c?.[f] !== null && c?.[f] !== undefined));
  const bars = [setup.axles.front.antiRollBar, setup.axles.rear.antiRollBar];
  if (fields.length === 0 && bars.every((b) => !b)) return <p className="text-sm text-ink-muted">No values recorded.</p>;
  return (
    <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
      {fields.map((field) => (
        <CornerGrid
          key={field}
          label={FIELD_INFO[field].label}
          renderCorner={(corner) => (
            <p className="tabular-figures text-right text-lg font-bold">{formatFieldValue(field, setup.corners[corner]?.[field], units)}</p>
          )}
        />
      ))}
      {bars.some(Boolean) ? (
        <dl className="flex flex-col gap-1">
          <div className="flex gap-2">
            <dt className="font-semibold">Front anti-roll bar:</dt>
            <dd>{setup.axles.front.antiRollBar ?? '—'}</dd>
          </div>
          <div className="flex gap-2">
            <dt className="font-semibold">Rear anti-roll bar:</dt>
            <dd>{setup.axles.rear.antiRollBar ?? '—'}</dd>
          </div>
        </dl>
      ) : null}
    </div>
  );
}
