import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { CORNERS, type Corner } from '@shared/season/corners';
import type { CreateMountingInput } from '@shared/season/tyre.schema';
import { CORNER_NAMES, CornerGrid } from '@/components/corner-grid/corner-grid';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { FormAlert } from '@/components/ui/form-alert';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { toLocalInputValue } from '@/lib/dates';
import { rotateTyresEntry, useRotateTyres } from '../api/rotate-tyres';
import { applyPreset, PRESET_WORDS, PRESETS, rotationFormSchema, TYRE_NUMBERS, type RotationFormValues, type RotationPreset } from '../utils/rotation';
import { currentPositions, type TyreSetView } from '../utils/tyre-set-views';

const TYRE_OPTIONS = TYRE_NUMBERS.map((n) => ({ value: String(n), label: n === 5 ? 'Tyre 5 (spare)' : `Tyre ${n}` }));

const asTexts = (positions: Record<Corner, number>) =>
  Object.fromEntries(CORNERS.map((c) => [c, String(positions[c])])) as Record<Corner, string>;

interface RotationFormProps {
  carId: string;
  set: TyreSetView;
  onSaved: () => void;
  onCancel: () => void;
}

/**
 * A rotation: which numbered tyre now sits on each corner, picked in the corner grid (or from a
 * common pattern), and when. Each tyre may be on one corner only. Saved through the outbox.
 */
export function RotationForm({ carId, set, onSaved, onCancel }: RotationFormProps) {
  const write = useRotateTyres();
  const [now] = useState(() => currentPositions(set).positions);
  const [formError, setFormError] = useState<string | null>(null);
  const resolver = useMemo(() => zodResolver(rotationFormSchema(now)), [now]);
  const { register, handleSubmit, setValue, clearErrors, formState } = useForm<RotationFormValues, unknown, CreateMountingInput>({
    resolver,
    defaultValues: { mountedAt: toLocalInputValue(new Date()), positions: asTexts(now) },
  });
  const errors = formState.errors;
  const cornerError = (c: Corner) => errors.positions?.[c]?.message;

  const pickPreset = (preset: RotationPreset) => {
    const next = applyPreset(preset, now);
    for (const c of CORNERS) setValue(`positions.${c}`, String(next[c]), { shouldDirty: true });
    clearErrors('positions');
  };

  const onSubmit = handleSubmit(async (body) => {
    setFormError(null);
    try {
      await write.mutateAsync(rotateTyresEntry(carId, set.id, set.label, body));
    } catch {
      setFormError('The rotation could not be stored on this phone. Nothing was sent; try again.');
      return;
    }
    onSaved();
  });

  const duplicate = CORNERS.some((c) => cornerError(c));
  const summary = errors.positions?.message ?? (duplicate ? 'Each tyre can be on one corner only; the corners marked above share one.' : null);

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label={`Rotate ${set.label}`} className="flex flex-col gap-4 rounded border border-line p-3">
      <h4 className="font-bold">Rotate tyres</h4>
      <div className="flex flex-col gap-2">
        <p className="text-sm font-semibold">Common patterns</p>
        <div className="grid grid-cols-1 gap-2 sm:grid-cols-3">
          {PRESETS.map((preset) => (
            <Button key={preset} variant="secondary" className="px-3" onClick={() => pickPreset(preset)}>
              {PRESET_WORDS[preset]}
            </Button>
          ))}
        </div>
      </div>
      <CornerGrid
        label="Which tyre is on each corner"
        cornerInvalid={(c) => Boolean(cornerError(c))}
        renderCorner={(corner) => (
          // Where the tyre was goes under the choice, on a line of its own: beside a name that wraps it was cut short.
          <div className="flex flex-col gap-1">
            <SelectField
              label={`${CORNER_NAMES[corner]} tyre`}
              hideLabel
              options={TYRE_OPTIONS}
              error={cornerError(corner)}
              {...register(`positions.${corner}`, { onChange: () => clearErrors('positions') })}
            />
            <p className="text-xs text-ink-muted">Was tyre {now[corner]}</p>
          </div>
        )}
      />
      <TextField label="When the tyres were moved" type="datetime-local" error={errors.mountedAt?.message} {...register('mountedAt')} />
      <Caution title="Before you drive">
        <p>
          Jack on firm ground and use stands. Torque the wheel nuts to the car maker’s figure and check them again after the first run.
          Directional tyres keep their side unless remounted on the wheel.
        </p>
      </Caution>
      <FormAlert message={summary ?? formError} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" isPending={write.isPending || formState.isSubmitting} pendingLabel="Saving…">
          Save rotation
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
