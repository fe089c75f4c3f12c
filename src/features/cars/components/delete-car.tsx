import { useId, useState, type FormEvent } from 'react';
import type { Car } from '@shared/season/car.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { useOutbox } from '@/lib/outbox-context';
import { useDeleteCar } from '../api/delete-car';

/**
 * Deleting the car, with its whole season, for every driver of it: asked only after its name is typed, so a
 * cold thumb cannot do it by mistake.
 */
export function DeleteCar({ car, onDeleted }: { car: Car; onDeleted: () => void }) {
  const remove = useDeleteCar(car.id);
  const outbox = useOutbox();
  const [typed, setTyped] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [fieldError, setFieldError] = useState<string | undefined>();
  const headingId = useId();

  const onSubmit = async (event: FormEvent) => {
    event.preventDefault();
    setError(null);
    if (typed.trim() !== car.name.trim()) {
      setFieldError(`Type the car's name, ${car.name}, exactly as shown`);
      return;
    }
    setFieldError(undefined);
    try {
      await remove.mutateAsync();
    } catch (e) {
      setError(isApiError(e) ? e.message : 'The car could not be deleted. Nothing was removed; try again when you have signal.');
      return;
    }
    // What this phone still holds for the car (runs, readings, setups not yet sent) has nowhere to go now.
    await outbox.discard((entry) => entry.scope.carId === car.id);
    onDeleted();
  };

  return (
    <form
      onSubmit={(e) => void onSubmit(e)}
      noValidate
      aria-labelledby={headingId}
      className="flex max-w-form flex-col gap-3 rounded border border-line-strong p-3"
    >
      <h2 id={headingId} className="text-lg font-bold">
        Delete this car
      </h2>
      <p className="text-sm">
        This removes {car.name} and everything recorded on it, for you and every co-driver: its setups, runs, tyre
        readings, change log, comments, shop visits, and what this phone has not sent yet. It cannot be undone. A shop
        keeps the invoices it issued for the car, as its own records. Download its season file first (the car&rsquo;s
        page, Your data) to keep a copy.
      </p>
      <TextField
        label={`Type ${car.name} to confirm`}
        autoComplete="off"
        value={typed}
        onChange={(e) => setTyped(e.target.value)}
        error={fieldError}
      />
      <FormAlert message={error} />
      <Button type="submit" variant="danger" className="self-start" isPending={remove.isPending} pendingLabel="Deleting…">
        Delete {car.name} and its season
      </Button>
    </form>
  );
}
