import { useState } from 'react';
import type { UseFormSetError } from 'react-hook-form';
import type { Car, CreateCarInput } from '@shared/season/car.schema';
import { AXLES } from '@shared/season/corners';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useUpdateCar } from '../api/update-car';
import { carToForm, type CarFormValues } from '../utils/car-form';
import { CarDetailsForm } from './car-details-form';

const FIELDS = [
  'name', 'classCode', 'carNumber', 'tyreSize', 'notes',
  ...AXLES.flatMap((a) => [`damperAdjusters.${a}.positions`, `damperAdjusters.${a}.rebound.positions`, `motionRatios.${a}`] as const),
] as const;

const STALE =
  'Someone changed this car since you opened it. The form now shows what is stored; make your change again and save.';

/**
 * The car's details as stored, to change (owner only; it needs signal). Setups already recorded keep their clicks
 * as written, whatever the adjusters are changed to.
 */
export function EditCarForm({ car, onSaved }: { car: Car; onSaved: () => void }) {
  const update = useUpdateCar(car.id);
  const [formError, setFormError] = useState<string | null>(null);

  const onSave = async (input: CreateCarInput, setError: UseFormSetError<CarFormValues>) => {
    setFormError(null);
    try {
      await update.mutateAsync({ ...input, version: car.version });
    } catch (error) {
      setFormError(isApiError(error) && error.status === 409 ? STALE : applyServerErrors(error, setError, FIELDS));
      return;
    }
    onSaved();
  };

  return (
    // A new version (a save elsewhere, read again after a 409) starts the form again from what is stored.
    <CarDetailsForm
      key={car.version}
      label={`Edit ${car.name}`}
      defaults={carToForm(car)}
      submitLabel="Save changes"
      isPending={update.isPending}
      formError={formError}
      onSave={onSave}
      footnote="Changing the clicks or which end counts as 0 leaves the setups already recorded as they were written."
    />
  );
}
