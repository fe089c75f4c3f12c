import type { Corner } from '@shared/season/corners';
import { CORNER_NAMES, CornerGrid } from '@/components/corner-grid/corner-grid';
import { UnitInput } from '@/components/ui/unit-input';
import { hotField, type CornerTextMap } from '../utils/hot-pressures';
import type { RunFormErrors } from '../utils/run-form';

interface HotPressureGridProps {
  /** The driver's pressure unit's symbol, as shown beside each field. */
  unit: string;
  /** The text in each corner's field, as typed. */
  values: CornerTextMap;
  /** The form's messages; a corner's is under its field's name (hotField). */
  errors: RunFormErrors;
  onChange: (corner: Corner, text: string) => void;
}

/** One field per corner for the hot pressures read after a run, laid out as the car sits. */
export function HotPressureGrid({ unit, values, errors, onChange }: HotPressureGridProps) {
  return (
    <CornerGrid
      label={`Hot pressures (${unit})`}
      cornerInvalid={(corner) => Boolean(errors[hotField(corner)])}
      renderCorner={(corner) => (
        <UnitInput
          label={`${CORNER_NAMES[corner]} hot pressure`}
          hideLabel
          unit={unit}
          value={values[corner]}
          error={errors[hotField(corner)]}
          onChange={(e) => onChange(corner, e.target.value)}
        />
      )}
    />
  );
}
