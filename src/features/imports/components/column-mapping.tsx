import type { ColumnMapping, ImportField } from '@shared/import/mapping';
import { IMPORT_FIELDS, WIDE_FIELDS } from '@shared/import/mapping';
import type { SheetShape } from '@shared/import/sheet';
import { SelectField } from '@/components/ui/select-field';

const LABELS: Record<ImportField, string> = {
  driverName: 'Driver name',
  carNumber: 'Car number',
  classCode: 'Class',
  runNumber: 'Run number',
  time: 'Raw time',
  cones: 'Cones',
  status: 'Status (DNF, OFF, DSQ)',
};
const NONE = '';

/** Which column holds what: guessed from the names, each a select the user can correct. */
export function ColumnMappingForm({
  header,
  mapping,
  onChange,
  onShapeChange,
  timeMissing,
}: {
  header: readonly string[];
  mapping: ColumnMapping;
  onChange: (mapping: ColumnMapping) => void;
  onShapeChange: (shape: SheetShape) => void;
  timeMissing: boolean;
}) {
  const options = [
    { value: NONE, label: '— not in this file —' },
    ...header.map((h, i) => ({ value: String(i), label: h || `Column ${i + 1}` })),
  ];
  const fields = mapping.shape === 'wide' ? WIDE_FIELDS : IMPORT_FIELDS;
  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="sr-only">Columns</legend>
      <SelectField
        label="Layout"
        value={mapping.shape}
        onChange={(e) => onShapeChange(e.target.value as SheetShape)}
        options={[
          { value: 'long', label: 'One row per run' },
          { value: 'wide', label: 'One row per driver, a column per run' },
        ]}
      />
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        {fields.map((field) => (
          <SelectField
            key={field}
            label={LABELS[field]}
            value={mapping.columns[field] === null ? NONE : String(mapping.columns[field])}
            error={field === 'time' && timeMissing ? 'Choose the column that holds the time' : undefined}
            onChange={(e) =>
              onChange({ ...mapping, columns: { ...mapping.columns, [field]: e.target.value === NONE ? null : Number(e.target.value) } })
            }
            options={options}
          />
        ))}
      </div>
      {mapping.shape === 'wide' ? (
        mapping.runColumns.length > 0 ? (
          <div>
            <p className="font-semibold">Run columns</p>
            <ul className="list-disc pl-5 text-sm">
              {mapping.runColumns.map((rc) => (
                <li key={rc.runNumber}>
                  Run {rc.runNumber}: “{header[rc.time]}”{rc.cones === null ? '' : `, cones from “${header[rc.cones]}”`}
                </li>
              ))}
            </ul>
          </div>
        ) : (
          <p className="text-sm font-semibold text-warning">
            No run columns found. Name them Run 1, Run 2… (or R1, R2…) in the file, or choose “One row per run”.
          </p>
        )
      ) : null}
    </fieldset>
  );
}
