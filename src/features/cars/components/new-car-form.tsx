import { useState } from 'react';
import type { CreateCarInput } from '@shared/season/car.schema';
import { createCarEntry, useCreateCar, type CreateCarBody } from '../api/create-car';
import { emptyCarForm } from '../utils/car-form';
import { CarDetailsForm } from './car-details-form';

/**
 * A new car, saved on the phone through the outbox with an id made here, so it works with no signal.
 */
export function NewCarForm({ onSaved }: { onSaved: (carId: string) => void }) {
  const write = useCreateCar();
  const [formError, setFormError] = useState<string | null>(null);
  const [defaults] = useState(emptyCarForm);

  const onSave = async (input: CreateCarInput) => {
    setFormError(null);
    const body: CreateCarBody = { ...input, id: crypto.randomUUID() };
    try {
      await write.mutateAsync(createCarEntry(body));
    } catch {
      setFormError('The car could not be stored on this phone. Nothing was sent; try again.');
      return;
    }
    onSaved(body.id);
  };

  return (
    <CarDetailsForm
      label="New car"
      defaults={defaults}
      submitLabel="Save car"
      isPending={write.isPending}
      formError={formError}
      onSave={onSave}
      footnote="Saved on this phone first; it uploads by itself when there is signal."
    />
  );
}
