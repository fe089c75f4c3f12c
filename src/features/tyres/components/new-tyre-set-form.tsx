import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { CreateTyreSetInput } from '@shared/season/tyre.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { UnitInput } from '@/components/ui/unit-input';
import { unitSymbol } from '@/lib/numbers';
import { useUnits } from '@/lib/units-context';
import { createTyreSetEntry, useCreateTyreSet, type CreateTyreSetBody } from '../api/create-tyre-set';
import { tyreSetFormSchema, type TyreSetFormValues } from '../utils/tyre-set-form';

interface NewTyreSetFormProps {
  carId: string;
  /** The car's tyre size, offered as the set's. */
  defaultSize: string | null;
  onSaved: () => void;
  /** Where there is something else to go back to; without it, no Cancel button. */
  onCancel?: () => void;
}

/** A new tyre set: label, size, when bought and its depth when new, in the user's tread unit; saved through the outbox. */
export function NewTyreSetForm({ carId, defaultSize, onSaved, onCancel }: NewTyreSetFormProps) {
  const units = useUnits();
  const write = useCreateTyreSet();
  const [formError, setFormError] = useState<string | null>(null);
  const resolver = useMemo(() => zodResolver(tyreSetFormSchema(units)), [units]);
  const { register, handleSubmit, formState } = useForm<TyreSetFormValues, unknown, CreateTyreSetInput>({
    resolver,
    defaultValues: { label: '', size: defaultSize ?? '', boughtOn: '', startTreadMm: '' },
  });
  const errors = formState.errors;
  const unit = unitSymbol('treadDepth', units);

  const onSubmit = handleSubmit(async (input) => {
    setFormError(null);
    const body: CreateTyreSetBody = { ...input, id: crypto.randomUUID() };
    try {
      await write.mutateAsync(createTyreSetEntry(carId, body));
    } catch {
      setFormError('The tyre set could not be stored on this phone. Nothing was sent; try again.');
      return;
    }
    onSaved();
  });

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="New tyre set" className="flex flex-col gap-4 rounded border border-line p-3">
      <h3 className="font-bold">New tyre set</h3>
      <TextField label="Label" hint="As written on the tyres or the rack, e.g. “Set C (2026)”." maxLength={80} error={errors.label?.message} {...register('label')} />
      <TextField label="Size (optional)" maxLength={40} autoCapitalize="characters" error={errors.size?.message} {...register('size')} />
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2 sm:gap-3">
        <TextField label="Bought on (optional)" type="date" error={errors.boughtOn?.message} {...register('boughtOn')} />
        <UnitInput label="Depth when new (optional)" unit={unit} error={errors.startTreadMm?.message} {...register('startTreadMm')} />
      </div>
      <p className="text-sm text-ink-muted">Tyres 1–4 start on left front, right front, left rear, right rear; mark them on the sidewalls.</p>
      <FormAlert message={formError} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" isPending={write.isPending || formState.isSubmitting} pendingLabel="Saving…">
          Save tyre set
        </Button>
        {onCancel ? (
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}
